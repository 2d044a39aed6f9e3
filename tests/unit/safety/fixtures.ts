import { specSchema, type Spec } from '@/lib/schedule/spec';
import type { RigSafetyData } from '@/lib/safety/context';
import type { LimitProfile } from '@/lib/safety/profile';
import type { SafetySheet } from '@/lib/safety/sheet';

// Specs go through the real schema, so a fixture that the engine would refuse fails
// here first instead of testing an impossible input.

/** Constant-rate optical train: 5 ms, 10 mW pulses at 20 Hz for 30 s (typical ChR2-type values, (c)). */
export function opticalSpec(overrides: Partial<Spec> = {}): Spec {
  return specSchema.parse({
    format: 'pulseloom-spec/1',
    envelope: [{ kind: 'ramp', durationS: 30, fromHz: 20, toHz: 20 }],
    ceilingHz: 100,
    refractory: { absoluteMs: 10, recoveryMs: 0 },
    pulse: { widthMs: 5, amplitude: 10, unit: 'mW' },
    trials: 20,
    seed: 'safety-fixture',
    clockHz: 10_000,
    ...overrides,
  });
}

/** Biphasic electrical train at 50 pulses/s, the rate of Shannon's pooled data (Shannon 1992, (a)). */
export function electricalSpec(amplitudeUa: number, phaseUs: number, overrides: Partial<Spec> = {}): Spec {
  return specSchema.parse({
    format: 'pulseloom-spec/1',
    envelope: [{ kind: 'ramp', durationS: 10, fromHz: 50, toHz: 50 }],
    ceilingHz: 100,
    refractory: { absoluteMs: 5, recoveryMs: 0 },
    pulse: { widthMs: (2 * phaseUs) / 1000, amplitude: amplitudeUa, unit: 'uA', phases: { widthUs: phaseUs, gapUs: 0, leading: 'cathodic' } },
    trials: 5,
    seed: 'safety-fixture',
    clockHz: 100_000,
    ...overrides,
  });
}

export const opticalRig = (fibreCoreUm: number | null = 200, fibreNA: number | null = 0.37): RigSafetyData => ({
  modality: 'optical',
  clockHz: 10_000,
  channels: 1,
  wavelengthNm: 473,
  fibreCoreUm,
  fibreNA,
});

export const electricalRig = (electrodeAreaMm2: number | null): RigSafetyData => ({
  modality: 'electrical',
  clockHz: 100_000,
  channels: 1,
  electrodeMaterial: 'platinum',
  electrodeAreaMm2,
});

export function opticalProfile(limits: Extract<LimitProfile, { modality: 'optical' }>['limits'], whenUnknown?: 'warn' | 'fail'): LimitProfile {
  return { name: 'Test optical', modality: 'optical', limits, ...(whenUnknown ? { whenUnknown } : {}) };
}

export function electricalProfile(limits: Extract<LimitProfile, { modality: 'electrical' }>['limits'], whenUnknown?: 'warn' | 'fail'): LimitProfile {
  return { name: 'Test electrical', modality: 'electrical', limits, ...(whenUnknown ? { whenUnknown } : {}) };
}

export function row(sheet: SafetySheet, id: string) {
  const found = sheet.rows.find((r) => r.id === id);
  if (!found) throw new Error(`no row ${id}; rows: ${sheet.rows.map((r) => r.id).join(', ')}`);
  return found;
}
