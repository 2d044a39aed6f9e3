import Link from 'next/link';
import { PageHeader } from '@/components/ui/PageHeader';
import { listRigs } from '@/db/queries/rigs';
import { listStartingEnvelopes } from '@/db/queries/protocols';
import { requireMember } from '@/lib/auth/guard';
import { NewProtocolForm } from './NewProtocolForm';

export default async function NewProtocolPage() {
  const member = await requireMember('protocols.edit');
  const [rigs, envelopes] = await Promise.all([listRigs({ labId: member.lab.id }), listStartingEnvelopes({ labId: member.lab.id })]);
  return (
    <>
      <Link href="/protocols" className="text-sm text-ink-muted hover:text-ink">← Protocols</Link>
      <PageHeader title="New protocol" lead="Version 1 starts as a draft on the first rig you choose, with that rig’s clock. Nothing reaches a rig until a safety officer approves a version." />
      {rigs.length === 0 ? (
        <div className="card text-sm" role="note">
          This lab has no rigs yet. A lab admin adds them under Rigs; a protocol needs at least one to run on.
        </div>
      ) : (
        <NewProtocolForm
          rigs={rigs.map((r) => ({ id: r.id, name: r.name, modality: r.modality, clockHz: r.clockHz }))}
          envelopes={envelopes}
        />
      )}
    </>
  );
}
