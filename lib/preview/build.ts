import type { Spec } from '@/lib/schedule/spec';
import { envelopeDuration, envelopePolyline, integrateEnvelope } from '@/lib/schedule/envelope';
import { generateSchedule } from '@/lib/schedule';
import { histogram, niceStep } from './bins';
import { poissonInterval95 } from './poisson';
import { PREVIEW_DEFAULT_TRIALS, PREVIEW_MAX_TRIALS } from './request';
import { truncateEnvelope } from './truncate';
import { PREVIEW_FORMAT, type IntervalHistogram, type PreviewResponse, type RateEstimate } from './types';

/**
 * A preview must answer while the user drags, so its work is bounded: candidate pulses
 * (ceiling × duration × trials) and returned points. A longer envelope is previewed over
 * its beginning, and the response says so.
 */
export const PREVIEW_BUDGET = {
  candidates: 400_000,
  /** Expected pulses over all preview trials: keeps the response near half a megabyte. */
  pulses: 50_000,
  envelopePoints: 2_000,
  rateBins: 60,
  intervalBins: 40,
} as const;

export interface BuildPreviewOptions {
  trials?: number;
}

export function buildPreview(spec: Spec, opts: BuildPreviewOptions = {}): PreviewResponse {
  const trials = Math.min(PREVIEW_MAX_TRIALS, Math.max(1, Math.round(opts.trials ?? PREVIEW_DEFAULT_TRIALS)));
  const durationS = envelopeDuration(spec.envelope);
  const affordable = Math.min(PREVIEW_BUDGET.candidates / (spec.ceilingHz * trials), timeForPulses(spec.envelope, PREVIEW_BUDGET.pulses / trials, durationS));
  const truncated = affordable < durationS;
  // Rounded down to three significant digits: the cut reads as a round number of seconds.
  const coveredS = truncated ? floorSignificant(affordable, 3) : durationS;
  const envelope = truncated ? truncateEnvelope(spec.envelope, coveredS) : spec.envelope;

  const schedule = generateSchedule({ ...spec, envelope, trials });
  const onsetsS = schedule.trials.map((t) => t.onsetsS);
  const s = schedule.stats;
  const line = envelopePolyline(envelope, { maxPoints: PREVIEW_BUDGET.envelopePoints });

  return {
    format: PREVIEW_FORMAT,
    seed: spec.seed,
    trials,
    clockHz: spec.clockHz,
    unit: spec.pulse.unit,
    durationS,
    coveredS,
    truncated,
    ceilingHz: spec.ceilingHz,
    maxRateHz: spec.caps?.maxRateHz ?? null,
    onsetsS,
    envelope: { t: line.map((p) => p.t), hz: line.map((p) => p.hz) },
    rate: rateEstimate(onsetsS, coveredS),
    intervals: intervalHistogram(onsetsS, spec.refractory.absoluteMs),
    counts: {
      perTrial: schedule.trials.map((t) => t.onsetsS.length),
      expected: s.expectedCount,
      expectedDelivered: s.expectedDeliveredCount,
    },
    summary: {
      expectedCount: s.expectedCount,
      expectedDeliveredCount: s.expectedDeliveredCount,
      realized: s.realizedCount,
      suppressed: s.suppressed,
      expectedRateHz: s.expectedRateHz,
      meanRateHz: s.meanRateHz,
      dutyCycle: s.dutyCycle,
      optical: s.optical ?? null,
      electrical: s.electrical
        ? { chargePerPhaseNc: s.electrical.chargePerPhaseNc, meanChargePerTrialNc: s.electrical.meanChargePerTrialNc, totalChargeNc: s.electrical.totalChargeNc }
        : null,
      deliveredBelowEnvelope: s.deliveredBelowEnvelope,
      warnings: s.warnings,
    },
  };
}

/** Earliest time by which the envelope expects `count` pulses (bisection on its closed-form integral). */
function timeForPulses(envelope: Spec['envelope'], count: number, durationS: number): number {
  if (integrateEnvelope(envelope, 0, durationS) <= count) return durationS;
  let lo = 0;
  let hi = durationS;
  for (let i = 0; i < 60; i++) {
    const mid = (lo + hi) / 2;
    if (integrateEnvelope(envelope, 0, mid) <= count) lo = mid;
    else hi = mid;
  }
  return lo;
}

function floorSignificant(x: number, digits: number): number {
  const scale = 10 ** (digits - 1 - Math.floor(Math.log10(x)));
  return Math.floor(x * scale) / scale;
}

export const RATE_METHOD =
  'Pulses of all trials counted in fixed time bins, divided by trials × bin width; 95 % band from the exact Poisson interval of each bin count (Byar’s approximation above 30 counts).';

/** Rate across trials in fixed bins, with a 95 % Poisson band per bin. */
export function rateEstimate(onsetsS: readonly (readonly number[])[], coveredS: number): RateEstimate {
  const n = Math.max(1, onsetsS.length);
  const binS = niceStep(coveredS / PREVIEW_BUDGET.rateBins);
  const bins = Math.max(1, Math.ceil(coveredS / binS - 1e-9));
  const { counts } = histogram(
    onsetsS.flatMap((t) => t),
    binS,
    bins,
  );
  const out: RateEstimate = { method: RATE_METHOD, binS, start: [], width: [], hz: [], lowerHz: [], upperHz: [] };
  for (let k = 0; k < bins; k++) {
    const start = k * binS;
    // The last bin may be cut by the end of the envelope; its rate uses its real width.
    const width = Math.min(binS, coveredS - start);
    const exposure = n * width;
    const ci = poissonInterval95(counts[k]);
    out.start.push(Number(start.toPrecision(12)));
    out.width.push(width);
    out.hz.push(counts[k] / exposure);
    out.lowerHz.push(ci.lower / exposure);
    out.upperHz.push(ci.upper / exposure);
  }
  return out;
}

/** Intervals between consecutive pulses within each trial, in ms, binned up to about their 99th percentile. */
export function intervalHistogram(onsetsS: readonly (readonly number[])[], refractoryMs: number): IntervalHistogram {
  const intervals: number[] = [];
  for (const trial of onsetsS) for (let i = 1; i < trial.length; i++) intervals.push((trial[i] - trial[i - 1]) * 1000);
  const total = intervals.length;
  if (total === 0) {
    return { binMs: niceStep(Math.max(refractoryMs, 1) / 4), counts: [], overflow: 0, total, refractoryMs, belowRefractory: 0, minMs: null, meanMs: null, cv: null };
  }
  const sorted = Float64Array.from(intervals).sort();
  const p99 = sorted[Math.min(total - 1, Math.floor(total * 0.99))];
  const top = Math.max(p99, 2 * refractoryMs, sorted[0] * 1.01);
  const binMs = niceStep(top / PREVIEW_BUDGET.intervalBins);
  const bins = Math.max(1, Math.ceil(top / binMs));
  const { counts, over } = histogram(intervals, binMs, bins);
  let sum = 0;
  for (const x of intervals) sum += x;
  const mean = sum / total;
  let ss = 0;
  for (const x of intervals) ss += (x - mean) ** 2;
  const sd = total > 1 ? Math.sqrt(ss / (total - 1)) : 0;
  // A hair of slack: onsets are whole clock ticks turned into doubles.
  const belowRefractory = intervals.filter((x) => x < refractoryMs - 1e-6).length;
  return { binMs, counts, overflow: over, total, refractoryMs, belowRefractory, minMs: sorted[0], meanMs: mean, cv: mean > 0 ? sd / mean : null };
}
