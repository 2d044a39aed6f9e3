import Link from 'next/link';
import { notFound } from 'next/navigation';
import { EnvelopeWorkbench } from '@/components/canvas/EnvelopeWorkbench';
import { ExportPanel } from '@/components/exports/ExportPanel';
import { SafetySheetView } from '@/components/safety/SafetySheetView';
import { CommentList } from '@/components/versions/CommentList';
import { ParamDiffTable } from '@/components/versions/ParamDiffTable';
import { StatusBadge } from '@/components/versions/StatusBadge';
import { VersionFacts } from '@/components/versions/VersionFacts';
import { getVersionByNumber } from '@/db/queries/versions';
import { requireMember } from '@/lib/auth/guard';
import { may } from '@/lib/auth/roles';
import { STATUS_LABELS } from '@/lib/versions/status';
import { loadVersionView } from '@/lib/versions/view';
import { CopyButton } from './CopyButton';
import { DraftEditor } from './DraftEditor';
import { DraftRevisionProvider } from './DraftRevision';
import { RigPicker } from './RigPicker';
import { SubmitPanel } from './SubmitPanel';
import { WithdrawForm } from './WithdrawForm';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export default async function VersionPage({ params }: PageProps<'/protocols/[protocolId]/versions/[number]'>) {
  const member = await requireMember('protocols.view');
  const { protocolId, number: raw } = await params;
  const number = Number(raw);
  if (!UUID.test(protocolId) || !Number.isInteger(number) || number < 1) notFound();
  const version = await getVersionByNumber({ labId: member.lab.id, protocolId, number });
  if (!version) notFound();
  const view = await loadVersionView(member, version);
  const { spec, sheet, actions, source, sourceComments, lastApproved } = view;
  const editing = actions.includes('edit');
  const name = `${version.protocolName} v${version.number}`;

  const blockers: string[] = [];
  if (!version.rigId) blockers.push('Choose the rig it runs on.');
  if (!spec.ok) blockers.push('The spec is not valid; fix it in the editor and save.');
  if (sheet && !sheet.ok) blockers.push(sheet.message);
  if (sheet?.ok) for (const r of sheet.sheet.rows.filter((x) => x.status === 'fail')) blockers.push(`${r.label}: ${r.help}`);

  return (
    <DraftRevisionProvider key={version.id} initial={version.revision}>
    <div className="space-y-6">
      <div>
        <Link href={`/protocols/${protocolId}`} className="text-sm text-ink-muted hover:text-ink">← {version.protocolName}</Link>
        <div className="mt-1 flex flex-wrap items-center gap-3">
          <h1>{name}</h1>
          <StatusBadge status={version.status} withHelp />
        </div>
        {source ? (
          <p className="mt-1 text-sm text-ink-muted">
            Started from{' '}
            <Link className="text-accent hover:underline" href={`/protocols/${protocolId}/versions/${source.number}`}>v{source.number}</Link>{' '}
            ({STATUS_LABELS[source.status].toLowerCase()}).
          </p>
        ) : null}
      </div>

      <section className="card"><VersionFacts v={version} /></section>

      <div className="flex flex-wrap items-start gap-3">
        {actions.includes('copy') ? <CopyButton versionId={version.id} label={version.status === 'returned' ? 'Copy into a new version' : 'Start a new version from this one'} /> : null}
        {actions.includes('withdraw') ? <WithdrawForm versionId={version.id} revision={version.revision} approved={version.status === 'approved'} /> : null}
        {version.status === 'in_review' && may(member.roles, 'reviews.view') ? (
          <Link href={`/reviews/${version.id}`} className="btn">Open the review</Link>
        ) : null}
        {lastApproved ? (
          <Link href={`/protocols/${protocolId}/compare?a=${lastApproved.number}&b=${version.number}`} className="btn">
            Compare with v{lastApproved.number} (approved)
          </Link>
        ) : null}
      </div>

      <div className={source && sourceComments.length ? 'grid gap-6 xl:grid-cols-[minmax(0,1fr)_20rem]' : ''}>
        <div className="min-w-0 space-y-6">
          {editing ? (
            <section className="card" aria-label="Rig of this draft">
              <RigPicker
                versionId={version.id}
                rigId={version.rigId}
                rigs={view.rigs.map((r) => ({ id: r.id, name: r.name, clockHz: r.clockHz, archived: Boolean(r.archivedAt) }))}
              />
            </section>
          ) : null}
          {spec.ok ? (
            editing ? (
              <DraftEditor key={version.rigId ?? 'no-rig'} versionId={version.id} spec={spec.spec} name={name} />
            ) : (
              <EnvelopeWorkbench initialSpec={spec.spec} readOnly downloadName={name} />
            )
          ) : (
            <div role="alert" className="card text-sm">
              <p className="font-semibold text-danger">This version’s spec is not valid.</p>
              <ul className="mt-2 list-disc pl-5">
                {spec.errors.map((e) => <li key={e.path + e.message}><code className="font-mono">{e.path}</code>: {e.message}</li>)}
              </ul>
            </div>
          )}
        </div>
        {source && sourceComments.length ? (
          <aside className="card h-fit space-y-3 xl:sticky xl:top-4" aria-labelledby="source-comments-title" data-testid="source-comments">
            <h2 id="source-comments-title" className="text-base">Comments on v{source.number}</h2>
            <CommentList comments={sourceComments} />
          </aside>
        ) : null}
      </div>

      {sheet?.ok ? (
        <section className="card"><SafetySheetView sheet={sheet.sheet} /></section>
      ) : sheet && !sheet.ok ? (
        <p role="alert" className="card text-sm text-danger">{sheet.message}</p>
      ) : null}

      {actions.includes('submit') ? (
        <SubmitPanel
          versionId={version.id}
          revision={version.revision}
          canSubmit={blockers.length === 0}
          needsJustification={sheet?.ok ? sheet.sheet.needsJustification : false}
          blockers={blockers}
        />
      ) : null}

      {version.justification ? (
        <section className="card" aria-labelledby="justification-title">
          <h2 id="justification-title" className="text-base">Justification given at submission</h2>
          <p className="mt-2 whitespace-pre-wrap text-sm">{version.justification}</p>
        </section>
      ) : null}

      <section className="card space-y-3" aria-labelledby="comments-title">
        <h2 id="comments-title" className="text-base">Review</h2>
        <CommentList comments={view.comments} empty={version.status === 'draft' ? 'Not submitted yet.' : 'No decision yet.'} />
      </section>

      {lastApproved && version.status !== 'approved' ? (
        <section className="space-y-3" aria-labelledby="diff-title">
          <h2 id="diff-title" className="text-base">Changes since v{lastApproved.number} (approved)</h2>
          <ParamDiffTable rows={view.diffFromApproved} before={`v${lastApproved.number}`} after={`v${version.number}`} />
        </section>
      ) : null}

      {may(member.roles, 'exports.download') && spec.ok ? (
        <ExportPanel versionId={version.id} status={version.status} modality={version.modality} />
      ) : null}
    </div>
    </DraftRevisionProvider>
  );
}
