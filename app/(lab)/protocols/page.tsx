import Link from 'next/link';
import { EmptyState } from '@/components/ui/EmptyState';
import { PageHeader } from '@/components/ui/PageHeader';
import { StatusBadge } from '@/components/versions/StatusBadge';
import { formatWhen } from '@/components/versions/CommentList';
import { listProtocols } from '@/db/queries/protocols';
import { requireMember } from '@/lib/auth/guard';
import { may } from '@/lib/auth/roles';

export default async function ProtocolsPage() {
  const member = await requireMember('protocols.view');
  const rows = await listProtocols({ labId: member.lab.id });
  const canCreate = may(member.roles, 'protocols.edit');
  return (
    <>
      <PageHeader
        title="Protocols"
        lead="What goes to an animal: an envelope with pulse parameters, trials, seed and rig, and why. Each version goes to a safety officer before any rig can fetch it."
        actions={canCreate ? <Link href="/protocols/new" className="btn btn-primary">New protocol</Link> : null}
      />
      {rows.length === 0 ? (
        <EmptyState title="No protocols yet">
          {canCreate
            ? 'Start one with “New protocol”: choose the rigs it may run on and an envelope to begin from.'
            : 'Experimenters of the lab create protocols here; they appear once the first one is started.'}
        </EmptyState>
      ) : (
        <div className="card overflow-x-auto p-0">
          <table className="table" data-testid="protocol-list">
            <thead>
              <tr>
                <th scope="col">Protocol</th>
                <th scope="col">Modality</th>
                <th scope="col">Target</th>
                <th scope="col">Rigs</th>
                <th scope="col">Latest version</th>
                <th scope="col">Last activity</th>
              </tr>
            </thead>
            <tbody>
              {rows.map((p) => (
                <tr key={p.id}>
                  <td><Link href={`/protocols/${p.id}`} className="font-medium text-accent hover:underline">{p.name}</Link></td>
                  <td className="capitalize">{p.modality}</td>
                  <td>{p.target || <span className="text-ink-muted">—</span>}</td>
                  <td className="text-xs">{p.rigNames.join(', ')}</td>
                  <td>
                    {p.latestNumber ? (
                      <span className="inline-flex items-center gap-2">
                        <span className="font-mono text-xs">v{p.latestNumber}</span>
                        {p.latestStatus ? <StatusBadge status={p.latestStatus} /> : null}
                      </span>
                    ) : '—'}
                  </td>
                  <td className="text-xs text-ink-muted">{formatWhen(p.updatedAt)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </>
  );
}
