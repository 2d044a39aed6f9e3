import { notFound } from 'next/navigation';
import { PageHeader } from '@/components/ui/PageHeader';
import { countVersionsOnRig, getRig } from '@/db/queries/rigs';
import { requireMember } from '@/lib/auth/guard';
import { rigFormValues } from '@/lib/rigs/schema';
import { RigForm } from '../../RigForm';

export default async function EditRigPage({ params }: { params: Promise<{ rigId: string }> }) {
  const member = await requireMember('rigs.manage');
  const { rigId } = await params;
  const rig = /^[0-9a-f-]{36}$/i.test(rigId) ? await getRig({ labId: member.lab.id, rigId }) : null;
  if (!rig) notFound();
  const versions = await countVersionsOnRig({ labId: member.lab.id, rigId });
  return (
    <>
      <PageHeader title={`Edit ${rig.name}`} lead="Changes are recorded in the audit log with their old and new values." />
      <RigForm
        rigId={rig.id}
        initial={rigFormValues(rig)}
        modalityLocked={versions.total > 0 ? `${versions.total} protocol version(s) are made for this rig, so its modality stays.` : null}
      />
    </>
  );
}
