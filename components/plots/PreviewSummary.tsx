import type { PreviewSummaryNumbers } from '@/lib/preview/types';

const f1 = (x: number) => x.toFixed(1);
const pct = (x: number) => `${(100 * x).toFixed(2)} %`;

/** The preview's numbers; mono digits so columns line up. */
export function PreviewSummary({ summary, trials }: { summary: PreviewSummaryNumbers; trials: number }) {
  const s = summary;
  const rows: [string, string, string?][] = [
    ['Expected pulses / trial', f1(s.expectedCount), `${f1(s.expectedRateHz)} Hz mean`],
    ['Expected after refractory', f1(s.expectedDeliveredCount)],
    ['Realized pulses', `${s.realized.total}`, `${f1(s.realized.meanPerTrial)} / trial (${s.realized.min}–${s.realized.max}) over ${trials} trials`],
    ['Suppressed: refractory', `${s.suppressed.refractory}`],
    ['Suppressed: clock rounding', `${s.suppressed.clock}`],
    ['Suppressed: rate cap', `${s.suppressed.maxRate}`],
    ['Suppressed: window cap', `${s.suppressed.window}`],
    ['Mean delivered rate', `${f1(s.meanRateHz)} Hz`],
    ['Duty cycle', pct(s.dutyCycle)],
  ];
  if (s.optical) rows.push(['Mean light power', `${s.optical.meanPowerMw.toFixed(3)} mW`, `peak ${s.optical.peakPowerMw} mW`]);
  if (s.electrical) {
    rows.push(['Charge per phase', `${s.electrical.chargePerPhaseNc.toFixed(2)} nC`]);
    rows.push(['Charge per trial (one phase)', `${f1(s.electrical.meanChargePerTrialNc)} nC`]);
  }
  return (
    <section aria-label="Preview numbers">
      <dl className="grid grid-cols-[auto_auto] gap-x-4 gap-y-1 text-sm">
        {rows.map(([label, value, note]) => (
          <div key={label} className="contents">
            <dt className="text-ink-muted">{label}</dt>
            <dd className="font-mono text-ink">
              {value}
              {note ? <span className="ml-2 font-sans text-xs text-ink-muted">{note}</span> : null}
            </dd>
          </div>
        ))}
      </dl>
      {s.warnings.length > 0 ? (
        <ul className="mt-3 space-y-1 rounded-md border border-warn bg-warn-soft p-2 text-sm text-ink" role="status">
          {s.warnings.map((w) => (
            <li key={w}>{w}</li>
          ))}
        </ul>
      ) : null}
    </section>
  );
}
