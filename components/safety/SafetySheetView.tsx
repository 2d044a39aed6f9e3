import type { SafetySheet, SheetRow } from '@/lib/safety';
import type { SheetProfileInfo } from '@/lib/review/types';
import { STATUS_LOOK, formatLimit, formatMargin, withUnit } from './format';

type Props = {
  /** A sheet from lib/safety, or from computeSafetySheet (which also says which profile was used). */
  sheet: SafetySheet & { profile?: SheetProfileInfo; schedule?: { measured: boolean; expectedPulses: number } };
  /** Heading level context: the sheet's own title, if the page wants one. */
  title?: string;
};

/** The safety sheet of one version: every metric against the lab's limits, then the cautions. Server-renderable. */
export function SafetySheetView({ sheet, title = 'Safety sheet' }: Props) {
  const fails = sheet.rows.filter((r) => r.status === 'fail').length;
  const warns = sheet.rows.filter((r) => r.status === 'warn').length;
  return (
    <section aria-labelledby="safety-sheet-title" className="space-y-4" data-testid="safety-sheet">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 id="safety-sheet-title">{title}</h2>
        <Verdict fails={fails} warns={warns} />
      </div>

      {sheet.profile ? <ProfileNote profile={sheet.profile} modality={sheet.modality} /> : null}
      {sheet.schedule && !sheet.schedule.measured ? (
        <p className="text-sm text-ink-muted" data-testid="sheet-unmeasured">
          This schedule (about {Math.round(sheet.schedule.expectedPulses).toLocaleString('en')} pulses over all trials) is
          too large to generate for the sheet, so rates and windows are bounded from the spec instead. Those bounds can
          only overstate.
        </p>
      ) : null}

      <div className="overflow-x-auto rounded-card border border-line bg-panel">
        <table className="table">
          <caption className="sr-only">Each {sheet.modality} metric of this version against the lab’s limits</caption>
          <thead>
            <tr>
              <th scope="col">Metric</th>
              <th scope="col" className="text-right">Value</th>
              <th scope="col">Limit</th>
              <th scope="col" className="text-right">Margin</th>
              <th scope="col">Status</th>
            </tr>
          </thead>
          <tbody>
            {sheet.rows.map((row) => (
              <Row key={row.id} row={row} />
            ))}
          </tbody>
        </table>
      </div>

      {sheet.flags.microelectrode ? (
        <p className="rounded-card border border-warn/60 bg-warn-soft px-4 py-3 text-sm" role="note">
          <strong>Microelectrode.</strong> The electrode’s area is in the microelectrode range, where Shannon’s k was
          never fitted. A k within the lab’s limit shows nothing here: justify the charge per phase and the charge
          density against the electrode material’s own limits.
        </p>
      ) : null}

      {/* The approval caution repeats the disclaimer, which closes the sheet on its own. */}
      <Cautions cautions={sheet.cautions.filter((c) => c.body !== sheet.disclaimer)} />

      <p className="rounded-card border border-line bg-paper px-4 py-3 text-sm" data-testid="safety-disclaimer">
        {sheet.disclaimer}
      </p>
    </section>
  );
}

function Verdict({ fails, warns }: { fails: number; warns: number }) {
  if (fails > 0) {
    return (
      <p className="text-sm font-medium text-danger" data-testid="sheet-verdict">
        {fails} {fails === 1 ? 'metric is' : 'metrics are'} beyond a hard limit: this version cannot be submitted.
      </p>
    );
  }
  if (warns > 0) {
    return (
      <p className="text-sm font-medium" data-testid="sheet-verdict">
        {warns} {warns === 1 ? 'metric needs' : 'metrics need'} a written justification to submit.
      </p>
    );
  }
  return (
    <p className="text-sm font-medium text-ok" data-testid="sheet-verdict">
      Every checked metric is within the lab’s limits.
    </p>
  );
}

function ProfileNote({ profile, modality }: { profile: SheetProfileInfo; modality: string }) {
  if (profile.scope === 'demo') {
    return (
      <p className="rounded-card border border-warn/60 bg-warn-soft px-4 py-3 text-sm" data-testid="sheet-profile">
        <strong>No lab profile — demo defaults.</strong> This lab has no {modality} limit profile yet, so the sheet uses
        Pulseloom’s demo values (“{profile.name}”). They are starting points, not recommendations: a safety officer or lab
        admin should set the lab’s own limits.
      </p>
    );
  }
  return (
    <p className="text-sm text-ink-muted" data-testid="sheet-profile">
      Checked against <span className="font-medium text-ink">{profile.name}</span>
      {profile.scope === 'rig' ? ` (the profile for ${profile.rigName ?? 'this rig'})` : ' (the lab’s profile for all rigs)'}.
    </p>
  );
}

function Row({ row }: { row: SheetRow }) {
  const look = STATUS_LOOK[row.status];
  return (
    <tr data-row={row.id} data-status={row.status} className="align-top">
      <td className="min-w-56">
        <div className="font-medium">{row.label}</div>
        <details className="mt-1 text-xs text-ink-muted">
          <summary className="cursor-pointer select-none hover:text-ink">How this is worked out</summary>
          <p className="mt-1 max-w-prose">{row.help}</p>
          <p className="mt-1 max-w-prose">
            <span className="font-semibold">Source: </span>
            {row.source}
          </p>
        </details>
      </td>
      <td className="whitespace-nowrap text-right font-mono tabular-nums">
        {row.value === null ? <span className="text-ink-muted">unknown</span> : withUnit(row.value, row.unit)}
      </td>
      <td className="whitespace-nowrap font-mono text-xs">{formatLimit(row)}</td>
      <td className="whitespace-nowrap text-right font-mono tabular-nums">{formatMargin(row)}</td>
      <td>
        <span className={`inline-flex items-center gap-1.5 whitespace-nowrap rounded-full border px-2 py-0.5 text-xs font-medium text-ink ${look.badge}`}>
          <span aria-hidden="true" className={`inline-grid size-4 place-items-center rounded-full text-[0.65rem] font-bold ${look.dot}`}>
            {look.mark}
          </span>
          {look.label}
        </span>
      </td>
    </tr>
  );
}

function Cautions({ cautions }: { cautions: SafetySheet['cautions'] }) {
  return (
    <div className="space-y-2">
      <h3 className="text-sm font-semibold">Before you run it</h3>
      <ul className="grid gap-3 md:grid-cols-2">
        {cautions.map((c) => (
          <li key={c.id} className="card p-4 text-sm" data-caution={c.id}>
            <p className="font-medium">{c.title}</p>
            <p className="mt-1 text-ink-muted">{c.body}</p>
            <details className="mt-2 text-xs text-ink-muted">
              <summary className="cursor-pointer select-none hover:text-ink">Sources</summary>
              <ul className="mt-1 list-disc pl-4">
                {c.sources.map((s) => (
                  <li key={s}>{s}</li>
                ))}
              </ul>
            </details>
          </li>
        ))}
      </ul>
    </div>
  );
}
