import { EmptyState } from '@/components/ui/EmptyState';
import { PageHeader } from '@/components/ui/PageHeader';
import { requireMember } from '@/lib/auth/guard';

export default async function Page() {
  await requireMember('envelopes.view');
  return (
    <>
      <PageHeader title="Envelopes" />
      <EmptyState title="No envelopes yet">Envelopes you draw or import appear here, with a live preview of the schedule each one makes.</EmptyState>
    </>
  );
}
