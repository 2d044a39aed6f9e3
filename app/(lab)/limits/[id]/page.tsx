import { notFound } from 'next/navigation';
import { z } from 'zod';
import { PageHeader } from '@/components/ui/PageHeader';
import { getLimitProfile } from '@/db/queries/limit-profiles';
import { listRigs } from '@/db/queries/rigs';
import { requireMember } from '@/lib/auth/guard';
import { LimitProfileForm } from '../LimitProfileForm';
import { MODALITY_LABEL } from '../fields';

export default async function EditLimitProfilePage({ params }: { params: Promise<{ id: string }> }) {
  const member = await requireMember('limits.manage');
  const { id } = await params;
  if (!z.uuid().safeParse(id).success) notFound();
  const stored = await getLimitProfile({ labId: member.lab.id, id });
  if (!stored) notFound();
  const { modality } = stored.profile;
  const rigs = (await listRigs({ labId: member.lab.id }))
    .filter((r) => r.modality === modality)
    .map((r) => ({ id: r.id, name: r.name }));
  // An archived rig is not listed, but its profile must keep pointing at it when saved.
  if (stored.rigId && !rigs.some((r) => r.id === stored.rigId)) {
    rigs.push({ id: stored.rigId, name: `${stored.rigName ?? 'a rig'} (archived)` });
  }
  return (
    <>
      <PageHeader title={stored.profile.name} lead={`${MODALITY_LABEL[modality]} limits. Changes apply to safety sheets computed from now on; every change is in the audit log.`} />
      <LimitProfileForm
        modality={modality}
        rigs={rigs}
        existing={{ id: stored.id, profile: stored.profile, updatedAt: stored.updatedAt.toISOString() }}
      />
    </>
  );
}
