import { PageHeader } from '@/components/ui/PageHeader';
import { listRigs } from '@/db/queries/rigs';
import { requireMember } from '@/lib/auth/guard';
import { z } from 'zod';
import { LimitProfileForm } from '../LimitProfileForm';
import { MODALITY_LABEL } from '../fields';

const querySchema = z.object({ modality: z.enum(['optical', 'electrical']).catch('optical') });

export default async function NewLimitProfilePage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const member = await requireMember('limits.manage');
  const { modality } = querySchema.parse(await searchParams);
  const rigs = (await listRigs({ labId: member.lab.id })).filter((r) => r.modality === modality);
  return (
    <>
      <PageHeader
        title={`New ${MODALITY_LABEL[modality].toLowerCase()} limit profile`}
        lead="Set the levels this lab works within. Demo values are available as a starting point; they are not recommendations."
      />
      <LimitProfileForm modality={modality} rigs={rigs.map((r) => ({ id: r.id, name: r.name }))} />
    </>
  );
}
