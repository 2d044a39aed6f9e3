import { EmptyState } from '@/components/ui/EmptyState';
import { PageHeader } from '@/components/ui/PageHeader';
import { requireMember } from '@/lib/auth/guard';

export default async function Page() {
  await requireMember('reviews.view');
  return (
    <>
      <PageHeader title="Reviews" />
      <EmptyState title="Nothing is waiting for review">Protocol versions that experimenters submit appear here with their safety sheets, for you to approve or return with comments.</EmptyState>
    </>
  );
}
