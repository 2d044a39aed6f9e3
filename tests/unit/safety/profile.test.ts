import { describe, expect, it } from 'vitest';
import { DEMO_ELECTRICAL_PROFILE, DEMO_OPTICAL_PROFILE, demoProfileFor } from '@/lib/safety/demo-profiles';
import { limitProfileSchema, windowSecondsFor } from '@/lib/safety/profile';

// The schema is Pulseloom's own rule set (issue 5); these checks hold it to that rule,
// not to a published source.

const optical = (limits: object) => ({ name: 'Test', modality: 'optical', limits });
const electrical = (limits: object) => ({ name: 'Test', modality: 'electrical', limits });

function issues(input: unknown): string[] {
  const r = limitProfileSchema.safeParse(input);
  return r.success ? [] : r.error.issues.map((i) => i.path.join('.'));
}

describe('limitProfileSchema', () => {
  it('accepts both demo profiles unchanged', () => {
    expect(limitProfileSchema.parse(DEMO_OPTICAL_PROFILE)).toEqual(DEMO_OPTICAL_PROFILE);
    expect(limitProfileSchema.parse(DEMO_ELECTRICAL_PROFILE)).toEqual(DEMO_ELECTRICAL_PROFILE);
    expect(demoProfileFor('optical').modality).toBe('optical');
    expect(demoProfileFor('electrical').modality).toBe('electrical');
  });

  it('lets a lab leave every limit unset', () => {
    expect(issues(optical({}))).toEqual([]);
    expect(issues(electrical({ maxShannonK: {} }))).toEqual([]);
  });

  it('rejects a warning level above the hard limit of a maximum', () => {
    expect(issues(optical({ maxPeakPowerMw: { warn: 25, hard: 20 } }))).toEqual(['limits.maxPeakPowerMw.warn']);
    expect(issues(optical({ maxPeakPowerMw: { warn: 20, hard: 20 } }))).toEqual([]);
  });

  it('rejects a warning level below the hard limit of a minimum (the refractory period)', () => {
    expect(issues(optical({ minRefractoryMs: { warn: 1, hard: 2 } }))).toEqual(['limits.minRefractoryMs.warn']);
    expect(issues(optical({ minRefractoryMs: { warn: 5, hard: 2 } }))).toEqual([]);
  });

  it('rejects negative amounts but allows a negative Shannon k (a sum of logarithms)', () => {
    expect(issues(optical({ maxRateHz: { hard: -1 } }))).toEqual(['limits.maxRateHz.hard']);
    expect(issues(electrical({ maxShannonK: { warn: -1, hard: 0.5 } }))).toEqual([]);
  });

  it('needs a window length with a window count, and a whole number of pulses', () => {
    expect(issues(optical({ window: { maxPulses: { hard: 10 } } }))).toEqual(['limits.window.seconds']);
    expect(issues(optical({ window: { seconds: 1, maxPulses: { hard: 10.5 } } }))).toEqual(['limits.window.maxPulses.hard']);
    expect(issues(optical({ window: { seconds: 0, maxPulses: { hard: 10 } } }))).toEqual(['limits.window.seconds']);
  });

  it('keeps the duty cycle between 0 and 100 %', () => {
    expect(issues(optical({ maxDutyCyclePct: { hard: 101 } }))).toEqual(['limits.maxDutyCyclePct.hard']);
  });

  it('needs a name and a known modality', () => {
    expect(issues({ ...optical({}), name: '  ' })).toEqual(['name']);
    expect(issues({ name: 'x', modality: 'acoustic', limits: {} }).length).toBeGreaterThan(0);
  });

  it('keeps only the limits of its own modality', () => {
    const parsed = limitProfileSchema.parse(electrical({ maxIrradianceMwPerMm2: { hard: 100 }, maxChargePerPhaseNc: { hard: 30 } }));
    expect(parsed.limits).toEqual({ maxChargePerPhaseNc: { hard: 30 } });
  });

  it('accepts an optional rig and an unknown-value policy', () => {
    expect(issues({ ...optical({}), rigId: 'rig-1', whenUnknown: 'fail' })).toEqual([]);
    expect(issues({ ...optical({}), rigId: null })).toEqual([]);
    expect(issues({ ...optical({}), whenUnknown: 'ignore' })).toEqual(['whenUnknown']);
  });

  it('tells the caller which window to measure the schedule over', () => {
    expect(windowSecondsFor(DEMO_OPTICAL_PROFILE)).toBe(1);
    expect(windowSecondsFor(limitProfileSchema.parse(optical({})))).toBeUndefined();
  });
});
