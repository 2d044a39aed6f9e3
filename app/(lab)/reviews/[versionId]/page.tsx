import Link from 'next/link';
import { notFound } from 'next/navigation';
import { EnvelopeWorkbench } from '@/components/canvas/EnvelopeWorkbench';
import { SafetySheetView } from '@/components/safety/SafetySheetView';
import { CommentList } from '@/components/versions/CommentList';
import { ParamDiffTable } from '@/components/versions/ParamDiffTable';
import { StatusBadge } from '@/components/versions/StatusBadge';
import { VersionFacts } from '@/components/versions/VersionFacts';
import { getVersion } from '@/db/queries/versions';
import { requireMember } from '@/lib/auth/guard';
import { loadVersionView } from '@/lib/versions/view';
import { DecisionForm } from './DecisionForm';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export default async function ReviewPage({ params }: PageProps<'/reviews/[versionId]'>) {
  const member = await requireMember('reviews.view');
  const { versionId } = await params;
  if (!UUID.test(versionId)) notFound();
  const version = await getVersion({ labId: member.lab.id, versionId });
  if (!version) notFound();
  const view = await loadVersionView(member, version);
  const { spec, sheet, lastApproved } = view;
  const canDecide = view.actions.includes('approve') && view.actions.includes('return');
  const name = `${version.protocolName} v${version.number}`;
  const versionHref = `/protocols/${version.protocolId}/versions/${version.number}`;

  return (
    <div className="space-y-6">
      <div>
        <Link href="/reviews" className="text-sm text-ink-muted hover:text-ink">← Reviews</Link>
        <div className="mt-1 flex flex-wrap items-center gap-3">
          <h1>Review: {name}</h1>
          <StatusBadge status={version.status} withHelp />
        </div>
        <p className="mt-1 text-sm text-ink-muted">
          <span className="capitalize">{version.modality}</span> · <Link href={versionHref} className="text-accent hover:underline">version page</Link>
          {version.status === 'in_review' && canDecide ? <> · <a href="#decision" className="text-accent hover:underline">go to the decision</a></> : null}
        </p>
      </div>

      <section className="card"><VersionFacts v={version} /></section>

      {version.justification ? (
        <section className="card" aria-labelledby="justification-title">
          <h2 id="justification-title" className="text-base">The author’s justification</h2>
          <p className="mt-2 whitespace-pre-wrap text-sm">{version.justification}</p>
        </section>
      ) : null}

      {sheet?.ok ? (
        <section className="card"><SafetySheetView sheet={sheet.sheet} /></section>
      ) : sheet && !sheet.ok ? (
        <p role="alert" className="card text-sm text-danger">{sheet.message}</p>
      ) : null}

      <section className="space-y-3" aria-labelledby="diff-title">
        <h2 id="diff-title" className="text-base">
          {lastApproved ? `Changes since v${lastApproved.number}, the last approved version` : 'Changes since the last approved version'}
        </h2>
        {lastApproved ? (
          <>
            <ParamDiffTable rows={view.diffFromApproved} before={`v${lastApproved.number}`} after={`v${version.number}`} />
            <Link href={`/protocols/${version.protocolId}/compare?a=${lastApproved.number}&b=${version.number}`} className="btn">
              See both schedules side by side
            </Link>
          </>
        ) : (
          <p className="text-sm text-ink-muted">No earlier version of this protocol was approved; this would be the first.</p>
        )}
      </section>

      <section className="space-y-3" aria-labelledby="envelope-title">
        <h2 id="envelope-title" className="text-base">Envelope and preview</h2>
        {spec.ok ? (
          <EnvelopeWorkbench initialSpec={spec.spec} readOnly downloadName={name} />
        ) : (
          <p role="alert" className="card text-sm text-danger">This version’s spec is not valid: {spec.errors[0]?.path} {spec.errors[0]?.message}</p>
        )}
      </section>

      <section className="card space-y-3" aria-labelledby="comments-title">
        <h2 id="comments-title" className="text-base">Decisions and comments</h2>
        <CommentList comments={view.comments} empty="No decision yet." />
      </section>

      {version.status === 'in_review' ? (
        canDecide ? (
          <DecisionForm versionId={version.id} revision={version.revision} checksum={version.checksum} />
        ) : view.contributed ? (
          <p role="note" className="card border-warn/60 bg-warn-soft text-sm" data-testid="own-version">
            You wrote, edited or submitted this version, so another safety officer of the lab must decide it.
          </p>
        ) : null
      ) : null}

    </div>
  );
}
