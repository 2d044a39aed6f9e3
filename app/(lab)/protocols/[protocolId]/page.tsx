import Link from 'next/link';
import { notFound } from 'next/navigation';
import { PageHeader } from '@/components/ui/PageHeader';
import { formatWhen } from '@/components/versions/CommentList';
import { StatusBadge } from '@/components/versions/StatusBadge';
import { getProtocol, listProtocolRigs } from '@/db/queries/protocols';
import { listVersions } from '@/db/queries/versions';
import { requireMember } from '@/lib/auth/guard';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export default async function ProtocolPage({ params }: PageProps<'/protocols/[protocolId]'>) {
  const member = await requireMember('protocols.view');
  const { protocolId } = await params;
  if (!UUID.test(protocolId)) notFound();
  const protocol = await getProtocol({ labId: member.lab.id, protocolId });
  if (!protocol) notFound();
  const [rigs, versions] = await Promise.all([
    listProtocolRigs({ labId: member.lab.id, protocolId }),
    listVersions({ labId: member.lab.id, protocolId }),
  ]);
  const newest = versions[0];
  const approved = versions.find((v) => v.status === 'approved');

  return (
    <>
      <Link href="/protocols" className="text-sm text-ink-muted hover:text-ink">← Protocols</Link>
      <PageHeader title={protocol.name} lead={protocol.purpose || undefined} />
      <dl className="mb-6 grid gap-x-8 gap-y-2 text-sm sm:grid-cols-3">
        <div><dt className="label">Modality</dt><dd className="capitalize">{protocol.modality}</dd></div>
        <div><dt className="label">Target</dt><dd>{protocol.target || '—'}</dd></div>
        <div>
          <dt className="label">Rigs</dt>
          <dd>{rigs.map((r) => `${r.name}${r.archivedAt ? ' (archived)' : ''}`).join(', ') || '—'}</dd>
        </div>
      </dl>

      <section aria-labelledby="versions-title" className="space-y-3">
        <h2 id="versions-title">Versions</h2>
        <div className="card overflow-x-auto p-0">
          <table className="table" data-testid="version-list">
            <thead>
              <tr>
                <th scope="col">Version</th>
                <th scope="col">State</th>
                <th scope="col">Rig</th>
                <th scope="col">Author</th>
                <th scope="col">Submitted</th>
                <th scope="col">Decided</th>
                <th scope="col">Schedule checksum</th>
              </tr>
            </thead>
            <tbody>
              {versions.map((v) => (
                <tr key={v.id}>
                  <td>
                    <Link href={`/protocols/${protocolId}/versions/${v.number}`} className="font-mono font-medium text-accent hover:underline">
                      v{v.number}
                    </Link>
                  </td>
                  <td><StatusBadge status={v.status} /></td>
                  <td>{v.rigName ?? '—'}</td>
                  <td>{v.authorName ?? v.authorEmail ?? '—'}</td>
                  <td className="text-xs">{formatWhen(v.submittedAt)}</td>
                  <td className="text-xs">{v.decidedAt ? `${formatWhen(v.decidedAt)} by ${v.deciderName ?? v.deciderEmail}` : '—'}</td>
                  <td className="font-mono text-xs" title={v.checksum ?? undefined}>{v.checksum ? `${v.checksum.slice(0, 19)}…` : '—'}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </section>

      {versions.length >= 2 ? (
        <section aria-labelledby="compare-title" className="card mt-6">
          <h2 id="compare-title" className="text-base">Compare two versions</h2>
          <form action={`/protocols/${protocolId}/compare`} className="mt-3 flex flex-wrap items-end gap-3">
            <div>
              <label htmlFor="cmp-a" className="label">Earlier</label>
              <select id="cmp-a" name="a" className="field" defaultValue={String((approved && approved.number !== newest!.number ? approved : versions[1]!).number)}>
                {versions.map((v) => <option key={v.id} value={v.number}>v{v.number}</option>)}
              </select>
            </div>
            <div>
              <label htmlFor="cmp-b" className="label">Later</label>
              <select id="cmp-b" name="b" className="field" defaultValue={String(newest!.number)}>
                {versions.map((v) => <option key={v.id} value={v.number}>v{v.number}</option>)}
              </select>
            </div>
            <button type="submit" className="btn">Compare</button>
          </form>
        </section>
      ) : null}
    </>
  );
}
