import type { Modality } from '@/lib/schedule/spec';

// What the profile form shows for each limit: its key in the limits object, a label,
// the unit the number is in, and whether the limit is a ceiling or a floor. The list
// page reads the same table, so the form and the summary never name a limit twice.

export type LimitField = {
  key: string;
  label: string;
  unit: string;
  direction: 'max' | 'min';
  hint?: string;
  /** Shannon's k may be negative; every other limit is an amount ≥ 0. */
  signed?: boolean;
  integer?: boolean;
};

const SHARED: LimitField[] = [
  { key: 'maxRateHz', label: 'Pulse rate', unit: 'Hz', direction: 'max', hint: 'Peak rate of the envelope.' },
  { key: 'minRefractoryMs', label: 'Gap between pulses', unit: 'ms', direction: 'min', hint: 'The spec’s absolute refractory period; a floor, not a ceiling.' },
  { key: 'maxDutyCyclePct', label: 'Duty cycle', unit: '%', direction: 'max', hint: 'Fraction of time the output is on, whole train and busiest window.' },
  { key: 'maxTrainDurationS', label: 'Train duration', unit: 's', direction: 'max' },
];

const OPTICAL: LimitField[] = [
  { key: 'maxPulseWidthMs', label: 'Light pulse width', unit: 'ms', direction: 'max' },
  { key: 'maxPeakPowerMw', label: 'Peak power at the tip', unit: 'mW', direction: 'max' },
  { key: 'maxMeanPowerMw', label: 'Mean power', unit: 'mW', direction: 'max', hint: 'Peak power × duty cycle; heating follows it.' },
  { key: 'maxIrradianceMwPerMm2', label: 'Irradiance at the fibre tip', unit: 'mW/mm²', direction: 'max', hint: 'Peak power over the core area, from the rig’s fibre core diameter.' },
  { key: 'maxHeatingC', label: 'Estimated heating', unit: '°C', direction: 'max', hint: 'From mean power with a published coefficient; an estimate.' },
];

const ELECTRICAL: LimitField[] = [
  { key: 'maxPhaseWidthUs', label: 'Phase width', unit: 'µs', direction: 'max' },
  { key: 'maxChargePerPhaseNc', label: 'Charge per phase', unit: 'nC', direction: 'max', hint: 'Q = current × phase width.' },
  { key: 'maxChargeDensityUcPerCm2', label: 'Charge density per phase', unit: 'µC/cm²', direction: 'max', hint: 'Q over the rig’s electrode area.' },
  { key: 'maxShannonK', label: 'Shannon k', unit: '', direction: 'max', signed: true, hint: 'k = log10(Q) + log10(D), Q in µC, D in µC/cm². Not valid for microelectrodes.' },
];

export function limitFieldsFor(modality: Modality): LimitField[] {
  return [...SHARED, ...(modality === 'optical' ? OPTICAL : ELECTRICAL)];
}

export const WINDOW_FIELD = { label: 'Pulses in a sliding window', unit: 'pulses' } as const;

export const MODALITY_LABEL: Record<Modality, string> = { optical: 'Optical', electrical: 'Electrical' };
