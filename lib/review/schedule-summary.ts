import { envelopeDuration, integrateEnvelope, pulseSpanMs, trialBlocks, type Spec } from '@/lib/schedule';
// The engine's index exposes trialBlocks but not the compiler it needs; importing the
// compiler directly (read-only) lets the sweep run over typed blocks instead of one
// object per pulse, about four times faster than streamPulses.
import { compileSpec } from '@/lib/schedule/compile';
import type { ScheduleSummary } from '@/lib/safety';
import { WindowCounter, windowSamples } from './worst-window';

/** When neither the profile nor the spec names a window, the busiest second is measured. */
export const DEFAULT_WINDOW_SECONDS = 1;

/**
 * Above this many expected pulses (all trials) the schedule is not generated for the
 * sheet: on two cores it would hold a page for more than a few seconds. The sheet then
 * falls back to bounds from the spec, which can only overstate (see lib/safety/context).
 */
export const MEASURE_BUDGET_PULSES = 20_000_000;

export type MeasuredSummary = ScheduleSummary & {
  /** False when the schedule was too large to generate here; the other fields are then absent. */
  measured: boolean;
  expectedPulses: number;
};

/**
 * Runs the engine over every trial and measures what the safety sheet checks against the
 * delivered schedule: the busiest window, the mean rate and duty cycle over all trains,
 * and the highest instantaneous rate (one over the shortest interval). Blocks are swept
 * as they come and never held, so memory stays flat however long the schedule is.
 */
export function summarizeSchedule(spec: Spec, windowSeconds?: number, budget = MEASURE_BUDGET_PULSES): MeasuredSummary {
  const trainS = envelopeDuration(spec.envelope);
  const expectedPulses = integrateEnvelope(spec.envelope, 0, trainS) * spec.trials;
  if (expectedPulses > budget) return { measured: false, expectedPulses };

  const seconds = windowSeconds ?? spec.caps?.window?.seconds ?? DEFAULT_WINDOW_SECONDS;
  const counter = new WindowCounter(windowSamples(seconds, spec.clockHz));
  const c = compileSpec(spec);
  let total = 0;
  let shortest = Infinity;
  for (let trial = 0; trial < spec.trials; trial++) {
    counter.reset();
    let last = -Infinity;
    for (const { samples, length } of iterate(trialBlocks(c, trial))) {
      for (let i = 0; i < length; i++) {
        const s = samples[i]!;
        if (s - last < shortest) shortest = s - last;
        last = s;
        counter.push(s);
      }
      total += length;
    }
  }
  const onTime = trainS * spec.trials;
  return {
    measured: true,
    expectedPulses,
    worstWindowPulses: counter.best,
    worstWindowSeconds: seconds,
    meanRateHz: onTime > 0 ? total / onTime : null,
    dutyCycle: onTime > 0 ? (total * pulseSpanMs(spec.pulse)) / 1000 / onTime : null,
    maxInstantRateHz: Number.isFinite(shortest) ? spec.clockHz / shortest : null,
  };
}

/** A generator's yielded values, without its return value (trialBlocks returns counters). */
function* iterate<T>(gen: Generator<T, unknown, undefined>): Generator<T, void, undefined> {
  for (;;) {
    const r = gen.next();
    if (r.done) return;
    yield r.value;
  }
}
