import Link from 'next/link';
import { notFound } from 'next/navigation';
import { ExportPanel } from '@/components/exports/ExportPanel';
import { PageHeader } from '@/components/ui/PageHeader';
import { listUnapprovedForRig } from '@/db/queries/exports';
import { listApprovedForRig } from '@/db/queries/rig-api';
import { getRig, listRigTokens } from '@/db/queries/rigs';
import { requireMember } from '@/lib/auth/guard';
import { may } from '@/lib/auth/roles';
import { ArchiveButton } from '../ArchiveButton';
import { rigHardware } from '../describe';
import { TokenPanel } from './TokenPanel';

const STATUS_LABEL: Record<string, string> = { draft: 'draft', in_review: 'in review', returned: 'returned' };

export default async function RigPage({ params }: { params: Promise<{ rigId: string }> }) {
  const member = await requireMember('rigs.view');
  const { rigId } = await params;
  const rig = /^[0-9a-f-]{36}$/i.test(rigId) ? await getRig({ labId: member.lab.id, rigId }) : null;
  if (!rig) notFound();
  const manageRig = may(member.roles, 'rigs.manage');
  const manageTokens = may(member.roles, 'tokens.manage');
  const canExport = may(member.roles, 'exports.download');
  const [approved, unapproved, tokens] = await Promise.all([
    listApprovedForRig({ labId: member.lab.id, rigId }),
    listUnapprovedForRig({ labId: member.lab.id, rigId }),
    manageTokens ? listRigTokens({ labId: member.lab.id, rigId }) : Promise.resolve([]),
  ]);
  const versionHref = (protocolId: string, n: number) => `/protocols/${protocolId}/versions/${n}`;

  return (
    <>
      <PageHeader
        title={rig.name}
        lead={rig.archivedAt ? `Archived ${rig.archivedAt.toISOString().slice(0, 10)}: hidden from lists, tokens refused.` : undefined}
        actions={
          manageRig ? (
            <>
              {rig.archivedAt ? null : <Link href={`/rigs/${rig.id}/edit`} className="btn">Edit rig</Link>}
              <ArchiveButton rigId={rig.id} rigName={rig.name} archived={Boolean(rig.archivedAt)} />
            </>
          ) : null
        }
      />
      <dl className="card grid gap-x-6 gap-y-2 text-sm sm:grid-cols-[auto_1fr]">
        <dt className="text-ink-muted">Modality</dt><dd>{rig.modality}</dd>
        <dt className="text-ink-muted">Output clock</dt><dd className="font-mono">{rig.clockHz.toLocaleString('en')} Hz</dd>
        <dt className="text-ink-muted">Channels</dt><dd className="font-mono">{rig.channels}</dd>
        <dt className="text-ink-muted">{rig.modality === 'optical' ? 'Light path' : 'Electrode'}</dt><dd>{rigHardware(rig)}</dd>
        {rig.notes ? (<><dt className="text-ink-muted">Notes</dt><dd className="whitespace-pre-line">{rig.notes}</dd></>) : null}
      </dl>

      <section className="mt-8 space-y-3" aria-labelledby="fetch-title">
        <h2 id="fetch-title">What this rig fetches</h2>
        <p className="max-w-prose text-sm text-ink-muted">
          Approved versions assigned to this rig: exactly what its tokens can list and download from
          <code className="mx-1 font-mono">/api/rig/v1/versions</code>(see docs/rig-api.md).
        </p>
        {approved.length === 0 ? (
          <p className="text-sm text-ink-muted">Nothing approved for this rig yet. Versions appear here once a safety officer approves them.</p>
        ) : (
          <ul className="space-y-3">
            {approved.map((v) => (
              <li key={v.id} className="card" data-testid="approved-version">
                <div className="flex flex-wrap items-baseline justify-between gap-2">
                  <Link href={versionHref(v.protocolId, v.version)} className="font-medium text-accent hover:underline">
                    {v.name} — version {v.version}
                  </Link>
                  <span className="text-xs text-ink-muted">approved {v.approvedAt?.toISOString().slice(0, 16).replace('T', ' ')} UTC</span>
                </div>
                <p className="mt-1 break-all font-mono text-xs text-ink-muted" title="Checksum of the approved schedule">{v.checksum}</p>
                {v.clockHz !== null && v.clockHz !== rig.clockHz ? (
                  <p className="mt-1 text-xs text-danger">Placed on {v.clockHz} Hz, but the rig runs at {rig.clockHz} Hz.</p>
                ) : null}
                {canExport ? (
                  <details className="mt-3">
                    <summary className="cursor-pointer text-sm font-semibold">Export {v.name} v{v.version}</summary>
                    <div className="mt-3"><ExportPanel versionId={v.id} status="approved" modality={rig.modality} /></div>
                  </details>
                ) : null}
              </li>
            ))}
          </ul>
        )}
      </section>

      {unapproved.length > 0 ? (
        <section className="mt-8 space-y-3" aria-labelledby="pending-title">
          <h2 id="pending-title">Not approved: previews only</h2>
          <ul className="space-y-3">
            {unapproved.map((v) => (
              <li key={v.id} className="card" data-testid="unapproved-version">
                <div className="flex flex-wrap items-baseline justify-between gap-2">
                  <Link href={versionHref(v.protocolId, v.version)} className="font-medium hover:underline">
                    {v.name} — version {v.version}
                  </Link>
                  <span className="rounded bg-warn-soft px-2 py-0.5 text-xs font-semibold text-warn">{STATUS_LABEL[v.status] ?? v.status}</span>
                </div>
                {canExport ? (
                  <details className="mt-3">
                    <summary className="cursor-pointer text-sm font-semibold">Preview export {v.name} v{v.version}</summary>
                    <div className="mt-3"><ExportPanel versionId={v.id} status={v.status} modality={v.modality} /></div>
                  </details>
                ) : null}
              </li>
            ))}
          </ul>
        </section>
      ) : null}

      {manageTokens ? (
        <div className="mt-8">
          <TokenPanel
            rigId={rig.id}
            rigName={rig.name}
            archived={Boolean(rig.archivedAt)}
            tokens={tokens.map((t) => ({
              id: t.id,
              name: t.name,
              status: t.status,
              createdAt: t.createdAt.toISOString(),
              expiresAt: t.expiresAt.toISOString(),
              lastUsedAt: t.lastUsedAt?.toISOString() ?? null,
            }))}
          />
        </div>
      ) : null}
    </>
  );
}
