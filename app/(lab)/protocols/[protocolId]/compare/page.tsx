import Link from 'next/link';
import { notFound } from 'next/navigation';
import { PageHeader } from '@/components/ui/PageHeader';
import { CompareRastersLazy } from '@/components/versions/CompareRastersLazy';
import { ParamDiffTable } from '@/components/versions/ParamDiffTable';
import { StatusBadge } from '@/components/versions/StatusBadge';
import { getProtocol } from '@/db/queries/protocols';
import { getVersionByNumber, type VersionRow } from '@/db/queries/versions';
import { requireMember } from '@/lib/auth/guard';
import { parseSpec } from '@/lib/schedule';
import { compareSchedules } from '@/lib/versions/compare-schedules';
import { diffVersions } from '@/lib/versions/diff';
import { summarizeComparison } from '@/lib/versions/pulse-compare';
import { compareQuerySchema } from '@/lib/versions/schemas';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
const rigLabel = (v: VersionRow) => (v.rigName ? `${v.rigName} (${v.rigClockHz} Hz)` : null);

export default async function ComparePage({ params, searchParams }: PageProps<'/protocols/[protocolId]/compare'>) {
  const member = await requireMember('protocols.view');
  const { protocolId } = await params;
  if (!UUID.test(protocolId)) notFound();
  const protocol = await getProtocol({ labId: member.lab.id, protocolId });
  if (!protocol) notFound();
  const query = compareQuerySchema.safeParse(await searchParams);
  const back = <Link href={`/protocols/${protocolId}`} className="text-sm text-ink-muted hover:text-ink">← {protocol.name}</Link>;
  if (!query.success) {
    return (
      <>
        {back}
        <PageHeader title="Compare versions" />
        <p role="alert" className="card text-sm">Choose two versions to compare from the protocol page.</p>
      </>
    );
  }
  const [a, b] = await Promise.all([
    getVersionByNumber({ labId: member.lab.id, protocolId, number: query.data.a }),
    getVersionByNumber({ labId: member.lab.id, protocolId, number: query.data.b }),
  ]);
  if (!a || !b) notFound();
  const labelA = `v${a.number}`;
  const labelB = `v${b.number}`;
  const rows = diffVersions({ spec: a.spec, extras: { rig: rigLabel(a) } }, { spec: b.spec, extras: { rig: rigLabel(b) } });
  const specA = parseSpec(a.spec);
  const specB = parseSpec(b.spec);
  const cmp = specA.ok && specB.ok ? compareSchedules(specA.spec, specB.spec) : null;
  const totals = cmp ? summarizeComparison(cmp.trials) : null;

  return (
    <>
      {back}
      <PageHeader title={`Compare ${labelA} and ${labelB}`} lead="Parameters that differ, and the same trials of both schedules. The engine keeps the pulses two versions agree on, so what is coloured is what the change moved." />
      <div className="mb-6 flex flex-wrap gap-6 text-sm">
        {[a, b].map((v) => (
          <span key={v.id} className="inline-flex items-center gap-2">
            <Link href={`/protocols/${protocolId}/versions/${v.number}`} className="font-mono font-semibold text-accent hover:underline">v{v.number}</Link>
            <StatusBadge status={v.status} />
          </span>
        ))}
      </div>

      <section className="space-y-3" aria-labelledby="params-title">
        <h2 id="params-title" className="text-base">Parameters</h2>
        <ParamDiffTable rows={rows} before={labelA} after={labelB} />
      </section>

      <section className="card mt-6 space-y-3" aria-labelledby="schedules-title">
        <h2 id="schedules-title" className="text-base">Schedules</h2>
        {!cmp || !totals ? (
          <p role="alert" className="text-sm text-danger">One of the two specs is not valid, so its schedule cannot be generated.</p>
        ) : (
          <>
            <p className="text-sm" data-testid="compare-summary">
              First {cmp.trials.length} trial{cmp.trials.length === 1 ? '' : 's'}
              {cmp.cutAtS !== null ? `, up to ${cmp.cutAtS.toFixed(1)} s (the schedules are too long to draw whole)` : ''}:{' '}
              <strong>{totals.unchanged}</strong> pulses in both, <strong>{totals.removed}</strong> only in {labelA},{' '}
              <strong>{totals.added}</strong> only in {labelB}.
            </p>
            <CompareRastersLazy before={labelA} after={labelB} durationS={cmp.durationS} trials={cmp.trials} />
            <table className="table max-w-xl">
              <caption className="sr-only">Pulses per trial</caption>
              <thead>
                <tr><th scope="col">Trial</th><th scope="col" className="text-right">In both</th><th scope="col" className="text-right">Only in {labelA}</th><th scope="col" className="text-right">Only in {labelB}</th></tr>
              </thead>
              <tbody>
                {cmp.trials.map((t) => (
                  <tr key={t.trial}>
                    <td>{t.trial + 1}</td>
                    <td className="text-right font-mono">{t.unchanged.length}</td>
                    <td className="text-right font-mono">{t.removed.length}</td>
                    <td className="text-right font-mono">{t.added.length}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </>
        )}
      </section>
    </>
  );
}
