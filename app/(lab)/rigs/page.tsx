import { EmptyState } from '@/components/ui/EmptyState';
import { PageHeader } from '@/components/ui/PageHeader';
import { listRigs } from '@/db/queries/rigs';
import { requireMember } from '@/lib/auth/guard';

export default async function RigsPage() {
  const member = await requireMember('rigs.view');
  const rigs = await listRigs({ labId: member.lab.id });
  return (
    <>
      <PageHeader title="Rigs" lead="Each rig's output clock is the clock every schedule made for it is placed on." />
      {rigs.length === 0 ? (
        <EmptyState title="No rigs yet">A lab admin registers rigs here, with their output clock and optics or electrodes.</EmptyState>
      ) : (
        <div className="card overflow-x-auto p-0">
          <table className="table">
            <thead>
              <tr><th>Name</th><th>Modality</th><th>Clock</th><th>Channels</th><th>Light / electrode</th></tr>
            </thead>
            <tbody>
              {rigs.map((r) => (
                <tr key={r.id}>
                  <td className="font-medium">{r.name}</td>
                  <td>{r.modality}</td>
                  <td className="font-mono">{r.clockHz.toLocaleString('en')} Hz</td>
                  <td className="font-mono">{r.channels}</td>
                  <td className="text-ink-muted">
                    {r.modality === 'optical'
                      ? `${r.wavelengthNm ?? '—'} nm, ${r.fibreCoreUm ?? '—'} µm core, NA ${r.fibreNA ?? '—'}`
                      : `${r.electrodeMaterial ?? '—'}, ${r.electrodeAreaMm2 ?? '—'} mm²`}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </>
  );
}
