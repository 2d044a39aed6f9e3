import type { Suppressed } from '@/lib/schedule/stats';

export const PREVIEW_FORMAT = 'pulseloom-preview/1';

/** What POST /api/preview returns: everything the preview plots draw, already reduced. */
export interface PreviewResponse {
  format: typeof PREVIEW_FORMAT;
  seed: string;
  trials: number;
  clockHz: number;
  unit: 'mW' | 'uA';
  /** Whole envelope. */
  durationS: number;
  /** Part previewed: the whole envelope unless it was too long for a quick preview. */
  coveredS: number;
  truncated: boolean;
  ceilingHz: number;
  maxRateHz: number | null;
  /** Onset times in seconds, one array per trial (trial 0 first). */
  onsetsS: number[][];
  /** The drawn envelope over the previewed part, as a polyline (sines sampled). */
  envelope: { t: number[]; hz: number[] };
  rate: RateEstimate;
  intervals: IntervalHistogram;
  counts: {
    /** Pulses per trial, over the previewed part. */
    perTrial: number[];
    /** ∫ρ dt over the previewed part: what the envelope asks for per trial. */
    expected: number;
    /** Expected once refractoriness acts (engine's estimate). */
    expectedDelivered: number;
  };
  summary: PreviewSummaryNumbers;
}

export interface RateEstimate {
  method: string;
  binS: number;
  /** Bin start times (s); bin k spans [start[k], start[k] + width[k]). */
  start: number[];
  width: number[];
  hz: number[];
  lowerHz: number[];
  upperHz: number[];
}

export interface IntervalHistogram {
  binMs: number;
  /** counts[k] = intervals in [k·binMs, (k+1)·binMs). */
  counts: number[];
  /** Intervals longer than the last bin. */
  overflow: number;
  total: number;
  refractoryMs: number;
  /** Intervals shorter than the absolute refractory period: should be 0 (checked by the engine). */
  belowRefractory: number;
  minMs: number | null;
  meanMs: number | null;
  /** Coefficient of variation: 1 for a Poisson process, lower with refractoriness. */
  cv: number | null;
}

export interface PreviewSummaryNumbers {
  expectedCount: number;
  expectedDeliveredCount: number;
  realized: { total: number; meanPerTrial: number; min: number; max: number };
  suppressed: Suppressed;
  expectedRateHz: number;
  meanRateHz: number;
  dutyCycle: number;
  optical: { peakPowerMw: number; meanPowerMw: number } | null;
  electrical: { chargePerPhaseNc: number; meanChargePerTrialNc: number; totalChargeNc: number } | null;
  deliveredBelowEnvelope: boolean;
  warnings: string[];
}
