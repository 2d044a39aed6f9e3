import Link from 'next/link';
import { EmptyState } from '@/components/ui/EmptyState';
import { PageHeader } from '@/components/ui/PageHeader';
import { countActiveTokens, listArchivedRigs, listRigs } from '@/db/queries/rigs';
import { requireMember } from '@/lib/auth/guard';
import { may } from '@/lib/auth/roles';
import { ArchiveButton } from './ArchiveButton';
import { rigHardware } from './describe';

export default async function RigsPage() {
  const member = await requireMember('rigs.view');
  const manage = may(member.roles, 'rigs.manage');
  const [rigs, archived] = await Promise.all([
    listRigs({ labId: member.lab.id }),
    manage ? listArchivedRigs({ labId: member.lab.id }) : Promise.resolve([]),
  ]);
  const tokens = await countActiveTokens({ labId: member.lab.id, rigIds: rigs.map((r) => r.id) });
  return (
    <>
      <PageHeader
        title="Rigs"
        lead="Each rig's output clock is the clock every schedule made for it is placed on."
        actions={manage ? <Link href="/rigs/new" className="btn btn-primary">Register a rig</Link> : null}
      />
      {rigs.length === 0 ? (
        <EmptyState title="No rigs yet">
          {manage ? 'Register each rig with its output clock and its optics or electrodes.' : 'A lab admin registers rigs here, with their output clock and optics or electrodes.'}
        </EmptyState>
      ) : (
        <div className="card overflow-x-auto p-0">
          <table className="table">
            <thead>
              <tr><th>Name</th><th>Modality</th><th>Clock</th><th>Channels</th><th>Light / electrode</th><th>Active tokens</th></tr>
            </thead>
            <tbody>
              {rigs.map((r) => (
                <tr key={r.id}>
                  <td className="font-medium"><Link href={`/rigs/${r.id}`} className="text-accent underline-offset-2 hover:underline">{r.name}</Link></td>
                  <td>{r.modality}</td>
                  <td className="font-mono">{r.clockHz.toLocaleString('en')} Hz</td>
                  <td className="font-mono">{r.channels}</td>
                  <td className="text-ink-muted">{rigHardware(r)}</td>
                  <td className="font-mono">{tokens.get(r.id) ?? 0}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
      {manage && archived.length > 0 ? (
        <section className="mt-8" aria-labelledby="archived-title">
          <h2 id="archived-title" className="text-base">Archived rigs</h2>
          <ul className="mt-2 space-y-2 text-sm">
            {archived.map((r) => (
              <li key={r.id} className="flex flex-wrap items-center gap-3">
                <Link href={`/rigs/${r.id}`} className="underline-offset-2 hover:underline">{r.name}</Link>
                <span className="text-xs text-ink-muted">{r.modality}, archived {r.archivedAt?.toISOString().slice(0, 10)}</span>
                <ArchiveButton rigId={r.id} rigName={r.name} archived />
              </li>
            ))}
          </ul>
        </section>
      ) : null}
    </>
  );
}
