import { envelopeDuration, pulseSpanMs, streamPulses, type Spec } from '@/lib/schedule';
import type { ScheduleSummary } from '@/lib/safety';
import { WindowCounter, windowSamples } from './worst-window';

/** When neither the profile nor the spec names a window, the busiest second is measured. */
export const DEFAULT_WINDOW_SECONDS = 1;

/**
 * Runs the engine over every trial and measures what the safety sheet checks against the
 * delivered schedule: the busiest window, the mean rate and duty cycle over all trains,
 * and the highest instantaneous rate (one over the shortest interval). The pulses are
 * streamed, never held, so a long schedule costs time but not memory.
 */
export function summarizeSchedule(spec: Spec, windowSeconds?: number): ScheduleSummary {
  const seconds = windowSeconds ?? spec.caps?.window?.seconds ?? DEFAULT_WINDOW_SECONDS;
  const counter = new WindowCounter(windowSamples(seconds, spec.clockHz));
  let total = 0;
  let shortest = Infinity;
  let trial = -1;
  let last = -Infinity;
  for (const p of streamPulses(spec)) {
    if (p.trial !== trial) {
      trial = p.trial;
      last = -Infinity;
      counter.reset();
    }
    const gap = p.onsetSample - last;
    if (gap < shortest) shortest = gap;
    last = p.onsetSample;
    counter.push(p.onsetSample);
    total++;
  }
  const onTime = envelopeDuration(spec.envelope) * spec.trials;
  return {
    worstWindowPulses: counter.best,
    worstWindowSeconds: seconds,
    meanRateHz: onTime > 0 ? total / onTime : null,
    dutyCycle: onTime > 0 ? (total * pulseSpanMs(spec.pulse)) / 1000 / onTime : null,
    maxInstantRateHz: Number.isFinite(shortest) ? spec.clockHz / shortest : null,
  };
}
