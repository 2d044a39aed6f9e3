import { EmptyState } from '@/components/ui/EmptyState';
import { PageHeader } from '@/components/ui/PageHeader';
import { requireMember } from '@/lib/auth/guard';

export default async function Page() {
  await requireMember('protocols.view');
  return (
    <>
      <PageHeader title="Protocols" />
      <EmptyState title="No protocols yet">A protocol is an envelope plus pulse parameters, trials, seed and rig. Its versions go to a safety officer before any rig can fetch them.</EmptyState>
    </>
  );
}
