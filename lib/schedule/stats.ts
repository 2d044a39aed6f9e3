/**
 * Schedule statistics: what the envelope asks for, what refractoriness lets through,
 * what was realized, and what each rule removed — with plain warnings when the
 * delivered rate falls more than 5 % below the drawn envelope.
 */
import type { Compiled } from './compile';
import { expectedDeliveredCount } from './delivered';
import { integrateEnvelope } from './envelope';
import { modalityOf } from './spec';
import type { SweepCounts } from './sweep';

/** A shortfall beyond this fraction of the envelope is reported as a warning. */
export const SHORTFALL_WARNING = 0.05;

export interface Suppressed {
  /** Passed thinning but fell inside the refractory period or its recovery. */
  refractory: number;
  /** Passed in continuous time but broke the refractory period (or shared a tick) once placed on the clock. */
  clock: number;
  /** Closer than 1/caps.maxRateHz to the previous pulse. */
  maxRate: number;
  /** Would have put more than caps.window.maxPulses in one window. */
  window: number;
}

export interface TrialStats {
  trial: number;
  realizedCount: number;
  /** Points of the candidate cloud: candidates = thinned + Σ suppressed + realizedCount. */
  candidates: number;
  /** Candidates above ρ(t): the thinning itself, not a loss. */
  thinned: number;
  suppressed: Suppressed;
  meanRateHz: number;
}

export interface ScheduleStats {
  durationS: number;
  trials: number;
  /** ∫ρ dt over the trial: exact closed form for ramps and sines. Per trial. */
  expectedCount: number;
  /**
   * Expected count once refractoriness (and the maxRate cap's minimum interval) act,
   * per trial. Exact for a hold: λT/(1 + λτ); for other shapes a quasi-static
   * estimate ∫ν(ρ(t))dt (see delivered.ts). The window cap is not in it.
   */
  expectedDeliveredCount: number;
  realizedCount: { total: number; meanPerTrial: number; min: number; max: number };
  suppressed: Suppressed;
  expectedRateHz: number;
  meanRateHz: number;
  /** Fraction of time the output is on: pulses × width / (duration × trials). */
  dutyCycle: number;
  optical?: { peakPowerMw: number; meanPowerMw: number };
  electrical?: {
    chargePerPhaseNc: number;
    /** One phase's charge summed over every pulse of every trial (biphasic: net charge is zero). */
    totalChargeNc: number;
    meanChargePerTrialNc: number;
  };
  /** Fractions below the envelope's expected count (0.08 = 8 % fewer pulses). */
  shortfall: {
    /** Predicted from refractoriness alone: 1 − expectedDelivered / expected. */
    refractoryExpected: number;
    /** Removed by caps.maxRateHz and caps.window, against the expected count. */
    caps: number;
    /** What actually happened: 1 − realized / expected (includes chance). */
    realized: number;
  };
  /** true when any shortfall exceeds 5 %: the editor should warn the experimenter. */
  deliveredBelowEnvelope: boolean;
  warnings: string[];
  perTrial: TrialStats[];
}

export function trialStats(c: Compiled, trial: number, counts: SweepCounts): TrialStats {
  return {
    trial,
    realizedCount: counts.kept,
    candidates: counts.candidates,
    thinned: counts.thinned,
    suppressed: { refractory: counts.refractory, clock: counts.clock, maxRate: counts.maxRate, window: counts.window },
    meanRateHz: counts.kept / c.durationS,
  };
}

const pct = (x: number) => `${(100 * x).toFixed(1)} %`;
const num = (x: number) => (Math.abs(x) >= 100 ? x.toFixed(0) : x.toPrecision(3));

export function summarize(c: Compiled, perTrial: TrialStats[]): ScheduleStats {
  const spec = c.spec;
  const T = c.durationS;
  const n = perTrial.length;
  const expected = integrateEnvelope(spec.envelope, 0, T);
  const delivered = expectedDeliveredCount(c);
  const suppressed: Suppressed = { refractory: 0, clock: 0, maxRate: 0, window: 0 };
  let total = 0;
  let min = Infinity;
  let max = -Infinity;
  for (const t of perTrial) {
    total += t.realizedCount;
    min = Math.min(min, t.realizedCount);
    max = Math.max(max, t.realizedCount);
    suppressed.refractory += t.suppressed.refractory;
    suppressed.clock += t.suppressed.clock;
    suppressed.maxRate += t.suppressed.maxRate;
    suppressed.window += t.suppressed.window;
  }
  const meanPerTrial = n ? total / n : 0;
  const widthS = spec.pulse.widthMs / 1000;
  const dutyCycle = n ? (total * widthS) / (T * n) : 0;

  const shortfall = {
    refractoryExpected: expected > 0 ? 1 - delivered / expected : 0,
    caps: expected > 0 && n ? (suppressed.maxRate + suppressed.window) / n / expected : 0,
    realized: expected > 0 ? 1 - meanPerTrial / expected : 0,
  };
  const warnings: string[] = [];
  if (shortfall.refractoryExpected > SHORTFALL_WARNING) {
    warnings.push(
      `Refractoriness holds the delivered rate ${pct(shortfall.refractoryExpected)} below the drawn envelope: ` +
        `about ${num(delivered)} of ${num(expected)} expected pulses per trial.`,
    );
  }
  if (suppressed.maxRate + suppressed.window > 0) {
    warnings.push(
      `Caps removed ${suppressed.maxRate + suppressed.window} pulses (maxRate ${suppressed.maxRate}, window ${suppressed.window}), ` +
        `${pct(shortfall.caps)} of the expected count.`,
    );
  }
  if (shortfall.realized > SHORTFALL_WARNING) {
    warnings.push(
      `Delivered pulses are ${pct(shortfall.realized)} below the envelope: ${num(meanPerTrial)} per trial against ` +
        `${num(expected)} expected (suppressed: refractory ${suppressed.refractory}, clock ${suppressed.clock}, ` +
        `maxRate ${suppressed.maxRate}, window ${suppressed.window}).`,
    );
  }

  const stats: ScheduleStats = {
    durationS: T,
    trials: n,
    expectedCount: expected,
    expectedDeliveredCount: delivered,
    realizedCount: { total, meanPerTrial, min: n ? min : 0, max: n ? max : 0 },
    suppressed,
    expectedRateHz: expected / T,
    meanRateHz: meanPerTrial / T,
    dutyCycle,
    shortfall,
    deliveredBelowEnvelope:
      shortfall.refractoryExpected > SHORTFALL_WARNING || shortfall.caps > SHORTFALL_WARNING || shortfall.realized > SHORTFALL_WARNING,
    warnings,
    perTrial,
  };
  if (modalityOf(spec) === 'optical') {
    stats.optical = { peakPowerMw: spec.pulse.amplitude, meanPowerMw: spec.pulse.amplitude * dutyCycle };
  } else {
    // µA × µs = pC; /1000 → nC.
    const q = (spec.pulse.amplitude * (spec.pulse.phases?.widthUs ?? 0)) / 1000;
    stats.electrical = { chargePerPhaseNc: q, totalChargeNc: q * total, meanChargePerTrialNc: q * meanPerTrial };
  }
  return stats;
}
