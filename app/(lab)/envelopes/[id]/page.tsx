import Link from 'next/link';
import { notFound } from 'next/navigation';
import { getEnvelope } from '@/db/queries/envelopes';
import { requireMember } from '@/lib/auth/guard';
import { may } from '@/lib/auth/roles';
import { parseSpec } from '@/lib/schedule/spec';
import { deleteAndReturn, duplicateAndOpen } from '../actions';
import { EnvelopeDetailsForm } from './EnvelopeDetailsForm';
import { EnvelopeEditor } from './EnvelopeEditor';

export default async function EnvelopePage({ params }: PageProps<'/envelopes/[id]'>) {
  const member = await requireMember('envelopes.view');
  const { id } = await params;
  if (!/^[0-9a-f-]{36}$/i.test(id)) notFound();
  const envelope = await getEnvelope({ labId: member.lab.id, id });
  if (!envelope) notFound();
  const canEdit = may(member.roles, 'envelopes.edit');
  const parsed = parseSpec(envelope.spec);

  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <div>
          <Link href="/envelopes" className="text-sm text-ink-muted hover:text-ink">← Envelopes</Link>
          <h1 className="mt-1">{envelope.name}</h1>
          <p className="text-xs text-ink-muted">{envelope.modality} · last changed {envelope.updatedAt.toISOString().slice(0, 16).replace('T', ' ')} UTC</p>
        </div>
        {canEdit ? (
          <div className="flex gap-2">
            <form action={duplicateAndOpen}><input type="hidden" name="id" value={envelope.id} /><button className="btn">Duplicate</button></form>
            <form action={deleteAndReturn}><input type="hidden" name="id" value={envelope.id} /><button className="btn btn-danger">Delete</button></form>
          </div>
        ) : null}
      </div>
      <EnvelopeDetailsForm id={envelope.id} name={envelope.name} description={envelope.description} readOnly={!canEdit} />
      {parsed.ok ? (
        <EnvelopeEditor id={envelope.id} spec={parsed.spec} readOnly={!canEdit} name={envelope.name} />
      ) : (
        <div role="alert" className="card border-danger text-sm">
          <p className="font-semibold text-danger">This saved envelope no longer reads as a valid spec.</p>
          <ul className="mt-2 list-disc pl-5">
            {parsed.errors.map((e) => <li key={e.path + e.message}><code className="font-mono">{e.path}</code>: {e.message}</li>)}
          </ul>
        </div>
      )}
    </div>
  );
}
