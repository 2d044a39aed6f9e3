import { describe, expect, it } from 'vitest';
import { DEMO_ELECTRICAL_PROFILE } from '@/lib/safety/demo-profiles';
import { buildSafetySheet } from '@/lib/safety/sheet';
import { electricalProfile, electricalRig, electricalSpec, row } from './fixtures';

// 50 pulses/s, 400 µs phases: the conditions of Shannon's pooled data (Shannon 1992, (a)).
const schedule = { meanRateHz: 50, dutyCycle: 0.04, worstWindowPulses: 60, worstWindowSeconds: 1 };
// A clinical macroelectrode contact of about 0.06 cm² = 6 mm² (facts §4, (b) low confidence).
const CONTACT_MM2 = 6;
const CONTACT_CM2 = 0.06;

/** Phase current that puts charge density D (µC/cm²) on the 0.06 cm² contact with 400 µs phases. */
const currentForDensity = (dUcPerCm2: number) => (dUcPerCm2 * CONTACT_CM2) / 400e-6;

describe('electrical safety sheet, computed values', () => {
  const sheet = buildSafetySheet({
    spec: electricalSpec(100, 200),
    rig: electricalRig(CONTACT_MM2),
    profile: DEMO_ELECTRICAL_PROFILE,
    schedule: { meanRateHz: 50, dutyCycle: 0.02, worstWindowPulses: 60, worstWindowSeconds: 1 },
  });

  it('puts 100 µA × 200 µs at 20 nC per phase (facts §4 worked example, (c))', () => {
    expect(row(sheet, 'charge-per-phase').value).toBeCloseTo(20, 10);
    expect(row(sheet, 'phase-width').value).toBe(200);
  });

  it('spreads 0.02 µC over 6 mm² = 0.06 cm² as 0.3333 µC/cm² (D = Q/A, (c))', () => {
    expect(row(sheet, 'charge-density').value).toBeCloseTo(1 / 3, 10);
  });

  it('gives Shannon k = log10(0.02) + log10(0.3333) = −2.176 (Shannon 1992, (a))', () => {
    expect(row(sheet, 'shannon-k').value).toBeCloseTo(-2.1761, 4);
    expect(row(sheet, 'shannon-k').status).toBe('pass');
  });

  it('passes the demo profile as a macroelectrode, no justification needed', () => {
    expect(row(sheet, 'electrode-size')).toMatchObject({ value: 6, status: 'info' });
    expect(sheet.flags.microelectrode).toBe(false);
    expect(sheet.rows.filter((r) => r.direction !== null && r.status !== 'pass').map((r) => r.id)).toEqual([]);
    expect(sheet.canSubmit).toBe(true);
    expect(sheet.needsJustification).toBe(false);
  });

  it('counts both phases as on-time for the duty cycle when no preview gives one: 50 Hz × 0.4 ms = 2 % (arithmetic, (c))', () => {
    const noPreview = buildSafetySheet({ spec: electricalSpec(100, 200), rig: electricalRig(CONTACT_MM2), profile: DEMO_ELECTRICAL_PROFILE });
    expect(row(noPreview, 'duty-mean').value).toBeCloseTo(2, 10);
  });
});

describe('electrical safety sheet, Shannon k against the lab’s limit (Shannon 1992, (a))', () => {
  // Highest D on 0.06 cm² per k: 22.96 (k 1.5), 30.6 (k 1.75), 34.35 (k 1.85) µC/cm² (facts §4, computed, (c)).
  const profile = electricalProfile({ maxShannonK: { warn: 1.6, hard: 1.8 } });
  const sheetFor = (d: number) =>
    buildSafetySheet({ spec: electricalSpec(currentForDensity(d), 400), rig: electricalRig(CONTACT_MM2), profile, schedule });

  it.each([
    [22.96, 1.5, 'pass'],
    [30.6, 1.75, 'warn'],
    [34.35, 1.85, 'fail'],
  ])('D %s µC/cm² on 0.06 cm² is k %s: %s', (d, k, status) => {
    const sheet = sheetFor(d);
    expect(row(sheet, 'charge-density').value).toBeCloseTo(d, 6);
    expect(row(sheet, 'shannon-k').value).toBeCloseTo(k, 3);
    expect(row(sheet, 'shannon-k').status).toBe(status);
    expect(sheet.canSubmit).toBe(status !== 'fail');
    expect(sheet.needsJustification).toBe(status === 'warn');
  });

  it('tells the user the highest density the k limit allows on this electrode: 30.6 µC/cm² at k 1.75', () => {
    const sheet = buildSafetySheet({
      spec: electricalSpec(100, 200),
      rig: electricalRig(CONTACT_MM2),
      profile: electricalProfile({ maxShannonK: { hard: 1.75 } }),
      schedule,
    });
    expect(row(sheet, 'shannon-k').help).toContain('30.61 µC/cm²');
  });

  it('names Shannon (1992) as the source of the rule', () => {
    expect(row(sheetFor(22.96), 'shannon-k').source).toContain('Shannon (1992)');
  });
});

describe('electrical safety sheet, microelectrodes (Cogan et al. 2016, (a); 10 000 µm² cut-off (b))', () => {
  it('flags a 2000 µm² site for separate justification without blocking it', () => {
    const sheet = buildSafetySheet({
      spec: electricalSpec(100, 200),
      rig: electricalRig(0.002),
      profile: electricalProfile({ maxShannonK: { warn: 1.5, hard: 1.75 } }),
      schedule,
    });
    // 0.02 µC on 2e-5 cm² is 1000 µC/cm², k = −1.699 + 3 = 1.301 (arithmetic, (c)).
    expect(row(sheet, 'charge-density').value).toBeCloseTo(1000, 6);
    expect(row(sheet, 'shannon-k').value).toBeCloseTo(1.301, 3);
    expect(row(sheet, 'shannon-k').status).toBe('pass');
    expect(row(sheet, 'shannon-k').help).toMatch(/microelectrode/);
    expect(row(sheet, 'electrode-size')).toMatchObject({ status: 'warn', value: 0.002 });
    expect(row(sheet, 'electrode-size').source).toContain('Cogan');
    expect(sheet.flags.microelectrode).toBe(true);
    expect(sheet.canSubmit).toBe(true);
    expect(sheet.needsJustification).toBe(true);
  });

  it('does not flag an electrode of exactly 0.01 mm²', () => {
    const sheet = buildSafetySheet({ spec: electricalSpec(100, 200), rig: electricalRig(0.01), profile: electricalProfile({}), schedule });
    expect(sheet.flags.microelectrode).toBe(false);
    expect(row(sheet, 'electrode-size').status).toBe('info');
  });

  it('still fails a microelectrode above the lab’s hard k: the flag never loosens a limit', () => {
    // 1000 µA × 200 µs on 2000 µm²: Q 0.2 µC, D 10 000 µC/cm², k 3.30 (arithmetic, (c)).
    const sheet = buildSafetySheet({
      spec: electricalSpec(1000, 200),
      rig: electricalRig(0.002),
      profile: electricalProfile({ maxShannonK: { hard: 1.75 } }),
      schedule,
    });
    expect(row(sheet, 'shannon-k').value).toBeCloseTo(3.301, 3);
    expect(row(sheet, 'shannon-k').status).toBe('fail');
    expect(sheet.canSubmit).toBe(false);
  });
});

describe('electrical safety sheet, missing data', () => {
  it('does not crash without an electrode area; density and k become unknown', () => {
    for (const rig of [null, electricalRig(null), electricalRig(0)]) {
      const sheet = buildSafetySheet({ spec: electricalSpec(100, 200), rig, profile: DEMO_ELECTRICAL_PROFILE, schedule });
      expect(row(sheet, 'charge-per-phase').value).toBeCloseTo(20, 10);
      expect(row(sheet, 'charge-density')).toMatchObject({ value: null, status: 'warn' });
      expect(row(sheet, 'charge-density').help).toMatch(/electrode area/);
      expect(row(sheet, 'shannon-k')).toMatchObject({ value: null, status: 'warn' });
      expect(row(sheet, 'electrode-size')).toMatchObject({ value: null, status: 'info' });
      expect(sheet.flags.microelectrode).toBe(false);
      expect(sheet.canSubmit).toBe(true);
      expect(sheet.needsJustification).toBe(true);
    }
  });

  it('shows not-set when neither the value nor a limit exists', () => {
    const sheet = buildSafetySheet({ spec: electricalSpec(100, 200), rig: null, profile: electricalProfile({}), schedule });
    expect(row(sheet, 'shannon-k')).toMatchObject({ value: null, status: 'not-set' });
    expect(sheet.needsJustification).toBe(false);
  });

  it('has nothing to check for Shannon when no current flows', () => {
    const sheet = buildSafetySheet({ spec: electricalSpec(0, 200), rig: electricalRig(CONTACT_MM2), profile: DEMO_ELECTRICAL_PROFILE, schedule });
    expect(row(sheet, 'charge-per-phase')).toMatchObject({ value: 0, status: 'pass' });
    expect(row(sheet, 'shannon-k')).toMatchObject({ value: null, status: 'info' });
  });
});

describe('electrical safety sheet, other limits', () => {
  it('fails a phase width and a charge per phase above the hard limits', () => {
    const sheet = buildSafetySheet({
      spec: electricalSpec(150, 400),
      rig: electricalRig(CONTACT_MM2),
      profile: electricalProfile({ maxPhaseWidthUs: { hard: 300 }, maxChargePerPhaseNc: { warn: 30, hard: 50 } }),
      schedule,
    });
    expect(row(sheet, 'phase-width')).toMatchObject({ value: 400, status: 'fail', margin: -100 });
    // 150 µA × 400 µs = 60 nC (arithmetic, (c)).
    expect(row(sheet, 'charge-per-phase').value).toBeCloseTo(60, 10);
    expect(row(sheet, 'charge-per-phase').status).toBe('fail');
  });
});
