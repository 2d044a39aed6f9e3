import { EmptyState } from '@/components/ui/EmptyState';
import { PageHeader } from '@/components/ui/PageHeader';
import { requireMember } from '@/lib/auth/guard';

export default async function Page() {
  await requireMember('audit.view');
  return (
    <>
      <PageHeader title="Audit log" />
      <EmptyState title="No audit entries yet">State changes, approvals, exports and rig downloads are recorded here as they happen.</EmptyState>
    </>
  );
}
