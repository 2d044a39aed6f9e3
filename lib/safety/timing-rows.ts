import type { Spec } from '../schedule/spec';
import type { Derived, ScheduleSummary } from './context';
import type { SharedLimits } from './profile';
import { checkedRow, fmt, infoRow, positive, type SheetRow } from './row';
import { SOURCES } from './sources';

// Rows every modality shares: rates, gaps, windows, duty cycle, train length.

const LAB = SOURCES.labLimit;
const FROM = { schedule: 'measured on the generated schedule', spec: 'from the spec, no preview yet' } as const;

export function timingRows(
  spec: Spec,
  d: Derived,
  schedule: ScheduleSummary | null | undefined,
  limits: SharedLimits,
  whenUnknown: 'warn' | 'fail',
): SheetRow[] {
  const rows: SheetRow[] = [];
  const tauS = spec.refractory.absoluteMs / 1000;

  const delivered = d.peakRateHz !== null && tauS > 0 ? d.peakRateHz / (1 + d.peakRateHz * tauS) : null;
  rows.push(
    checkedRow(
      {
        id: 'peak-rate',
        label: 'Highest drawn rate',
        value: d.peakRateHz,
        unit: 'Hz',
        limit: limits.maxRateHz,
        direction: 'max',
        source: `${SOURCES.arithmetic}: exact maximum of the envelope; ${LAB}`,
        help:
          'The highest rate the envelope asks for; the spec is never clipped, so this is what the generator draws from. ' +
          (delivered !== null
            ? `The refractory period delivers fewer: a steady drawn rate λ with dead time τ gives λ/(1 + λτ), here about ${fmt(delivered)} Hz ` +
              '(non-paralyzable dead time, Knoll 2010, (b); exact for a constant rate only).'
            : ''),
      },
      whenUnknown,
    ),
  );

  const instant = positive(schedule?.maxInstantRateHz);
  if (instant !== null) {
    rows.push(
      infoRow({
        id: 'instant-rate',
        label: 'Highest instantaneous rate',
        value: instant,
        unit: 'Hz',
        source: SOURCES.measured,
        help: 'Measured on the generated schedule. Random timing produces short gaps by design; the refractory row bounds them.',
      }),
    );
  }

  rows.push(
    infoRow({
      id: 'mean-rate',
      label: 'Mean pulse rate',
      value: d.meanRate?.hz ?? null,
      unit: 'Hz',
      source: d.meanRate?.from === 'schedule' ? SOURCES.measured : SOURCES.arithmetic,
      help: d.meanRate
        ? d.meanRate.from === 'schedule'
          ? `Delivered pulses per second, ${FROM.schedule}.`
          : `Mean of the envelope, ${FROM.spec}. Refractoriness and caps only remove pulses, so this overstates the delivered rate.`
        : 'Cannot be computed: the envelope has no duration.',
    }),
  );

  rows.push(
    checkedRow(
      {
        id: 'refractory',
        label: 'Shortest gap between pulse onsets',
        value: spec.refractory.absoluteMs,
        unit: 'ms',
        limit: limits.minRefractoryMs,
        direction: 'min',
        source: `${SOURCES.practice}; ${LAB}`,
        help: 'The absolute refractory period of the spec, counted from the last delivered pulse: no two onsets are closer than this.',
      },
      whenUnknown,
    ),
  );

  rows.push(windowRow(spec, schedule, limits, whenUnknown));

  const dutyPct = d.duty ? d.duty.fraction * 100 : null;
  rows.push(
    checkedRow(
      {
        id: 'duty-mean',
        label: 'Duty cycle, whole train',
        value: dutyPct,
        unit: '%',
        limit: limits.maxDutyCyclePct,
        direction: 'max',
        source: `${SOURCES.practice}: pulse duration × rate; ${LAB}`,
        help: d.duty
          ? `Share of time the output is on, ${FROM[d.duty.from]}.`
          : 'Cannot be computed: no pulse duration or rate.',
      },
      whenUnknown,
    ),
  );

  rows.push(
    checkedRow(
      {
        id: 'duty-window',
        label: 'Duty cycle, busiest window',
        value: d.busiestDuty !== null ? d.busiestDuty * 100 : null,
        unit: '%',
        limit: limits.maxDutyCyclePct,
        direction: 'max',
        source: `${SOURCES.practice}: random timing bunches pulses, so a burst runs above the mean duty cycle; ${LAB}`,
        help: d.busiest
          ? `${fmt(d.busiest.pulses)} pulses in ${fmt(d.busiest.seconds)} s, ${FROM[d.busiest.from]}. Checked against the same limit as the whole train.`
          : 'Cannot be computed: generate a preview, or give the spec a window cap.',
      },
      whenUnknown,
    ),
  );

  rows.push(
    checkedRow(
      {
        id: 'train-duration',
        label: 'Train duration (one trial)',
        value: d.trainDurationS,
        unit: 's',
        limit: limits.maxTrainDurationS,
        direction: 'max',
        source: `${SOURCES.arithmetic}: sum of the envelope segments; ${LAB}`,
        help: `One trial lasts this long; the spec runs ${spec.trials} trial${spec.trials === 1 ? '' : 's'}.`,
      },
      whenUnknown,
    ),
  );

  return rows;
}

/**
 * A count over a longer window bounds the count over any shorter window inside it, so
 * a measurement (or the spec's cap) taken over at least the profile's window length is
 * a valid, if cautious, value. A shorter one proves nothing and counts as unknown.
 */
function windowRow(
  spec: Spec,
  schedule: ScheduleSummary | null | undefined,
  limits: SharedLimits,
  whenUnknown: 'warn' | 'fail',
): SheetRow {
  const wanted = limits.window?.seconds;
  const candidates = [
    { pulses: schedule?.worstWindowPulses, seconds: schedule?.worstWindowSeconds, from: FROM.schedule },
    { pulses: spec.caps?.window?.maxPulses, seconds: spec.caps?.window?.seconds, from: 'the spec’s window cap, which the generator enforces' },
  ].filter(
    (c): c is { pulses: number; seconds: number; from: string } =>
      typeof c.pulses === 'number' && c.pulses >= 0 && positive(c.seconds) !== null,
  );
  const usable = wanted === undefined ? candidates[0] : candidates.find((c) => c.seconds >= wanted * (1 - 1e-9));
  const seconds = wanted ?? usable?.seconds;

  let help: string;
  if (usable) {
    const bound = wanted !== undefined && usable.seconds > wanted * (1 + 1e-9);
    help = `${fmt(usable.pulses)} pulses in ${fmt(usable.seconds)} s, ${usable.from}.` + (bound ? ' Counted over a longer window than the profile’s, so it can only overstate.' : '');
  } else {
    help = candidates.length
      ? `The schedule was measured over a shorter window than the profile’s ${fmt(wanted as number)} s; measure it over ${fmt(wanted as number)} s.`
      : 'Cannot be computed: generate a preview, or give the spec a window cap.';
  }

  return checkedRow(
    {
      id: 'window-pulses',
      label: seconds !== undefined ? `Most pulses in any ${fmt(seconds)} s` : 'Most pulses in a sliding window',
      value: usable ? usable.pulses : null,
      unit: 'pulses',
      limit: limits.window?.maxPulses,
      direction: 'max',
      source: `${SOURCES.practice}; ${LAB}`,
      help,
    },
    whenUnknown,
  );
}
