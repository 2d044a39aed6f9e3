import { envelopeDuration, envelopeMax, integrateEnvelope } from '../schedule/envelope';
import { pulseSpanMs, type Modality, type Spec } from '../schedule/spec';
import { positive } from './row';

/** What the sheet reads from a rig record (the rigs table may hold nulls). */
export interface RigSafetyData {
  modality: Modality;
  clockHz?: number | null;
  channels?: number | null;
  wavelengthNm?: number | null;
  fibreCoreUm?: number | null;
  fibreNA?: number | null;
  electrodeMaterial?: string | null;
  /** Geometric area in mm² (converted to cm² for charge density). */
  electrodeAreaMm2?: number | null;
}

/**
 * Numbers measured on the generated schedule, passed in as plain values so the safety
 * code never runs the generator. All optional: a version without a preview still gets
 * a sheet, with spec-based bounds where they exist.
 */
export interface ScheduleSummary {
  /** Most pulses in any sliding window of `worstWindowSeconds`, over all trials. */
  worstWindowPulses?: number | null;
  worstWindowSeconds?: number | null;
  /** Delivered pulses per second, averaged over the trains. */
  meanRateHz?: number | null;
  /** Fraction of time on (0-1), averaged over the trains. */
  dutyCycle?: number | null;
  /** Highest instantaneous rate the schedule reaches (information only). */
  maxInstantRateHz?: number | null;
}

type Origin = 'schedule' | 'spec';

/** Values several rows share, computed once. `from` says where each came from. */
export interface Derived {
  spanMs: number | null;
  peakRateHz: number | null;
  trainDurationS: number | null;
  meanRate: { hz: number; from: Origin } | null;
  duty: { fraction: number; from: Origin } | null;
  busiest: { pulses: number; seconds: number; from: Origin } | null;
  busiestDuty: number | null;
}

export function derive(spec: Spec, schedule: ScheduleSummary | null | undefined): Derived {
  const spanMs = positive(pulseSpanMs(spec.pulse));
  const envelope = spec.envelope;
  const trainDurationS = positive(envelopeDuration(envelope));
  const peak = envelopeMax(envelope);
  const peakRateHz = Number.isFinite(peak) ? peak : null;

  const scheduleMean = finiteNonNegative(schedule?.meanRateHz);
  // Without a preview, the envelope's mean rate stands in. It can only overstate the
  // delivered rate: refractoriness and window caps remove pulses, never add them.
  const envelopeMean = trainDurationS ? integrateEnvelope(envelope, 0, trainDurationS) / trainDurationS : null;
  const meanRate =
    scheduleMean !== null
      ? { hz: scheduleMean, from: 'schedule' as const }
      : envelopeMean !== null && Number.isFinite(envelopeMean)
        ? { hz: envelopeMean, from: 'spec' as const }
        : null;

  const scheduleDuty = finiteNonNegative(schedule?.dutyCycle);
  const duty =
    scheduleDuty !== null
      ? { fraction: scheduleDuty, from: 'schedule' as const }
      : spanMs !== null && meanRate !== null
        ? { fraction: (spanMs / 1000) * meanRate.hz, from: 'spec' as const }
        : null;

  const busiest = busiestWindow(spec, schedule);
  const busiestDuty = busiest && spanMs !== null ? (spanMs / 1000) * (busiest.pulses / busiest.seconds) : null;

  return { spanMs, peakRateHz, trainDurationS, meanRate, duty, busiest, busiestDuty };
}

/** The schedule's measured busiest window, else the spec's window cap (the engine enforces it). */
function busiestWindow(spec: Spec, schedule: ScheduleSummary | null | undefined): Derived['busiest'] {
  const pulses = finiteNonNegative(schedule?.worstWindowPulses);
  const seconds = positive(schedule?.worstWindowSeconds);
  if (pulses !== null && seconds !== null) return { pulses, seconds, from: 'schedule' };
  const cap = spec.caps?.window;
  if (cap && positive(cap.seconds) !== null && finiteNonNegative(cap.maxPulses) !== null) {
    return { pulses: cap.maxPulses, seconds: cap.seconds, from: 'spec' };
  }
  return null;
}

function finiteNonNegative(x: number | null | undefined): number | null {
  return typeof x === 'number' && Number.isFinite(x) && x >= 0 ? x : null;
}
