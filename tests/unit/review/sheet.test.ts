import { describe, expect, it } from 'vitest';
import { buildSafetySheet, demoProfileFor, type LimitProfile } from '@/lib/safety';
import { generateSchedule, parseSpec, type Spec } from '@/lib/schedule';
import { summarizeSchedule } from '@/lib/review/schedule-summary';
import { windowSamples, worstWindowCount } from '@/lib/review/worst-window';
import optical from '@/lib/schedule/examples/optical-ramp-sine.json';
import electrical from '@/lib/schedule/examples/electrical-biphasic.json';

function spec(raw: unknown, patch: Partial<Spec> = {}): Spec {
  const r = parseSpec({ ...(raw as object), ...patch });
  if (!r.ok) throw new Error(JSON.stringify(r.errors));
  return r.spec;
}

// Shorter versions of the shipped examples keep the suite fast; the engine is the same.
const opticalSpec = spec(optical, { trials: 3 });
const electricalSpec = spec(electrical, { trials: 2 });

describe('schedule summary (streamed) against the engine’s in-memory schedule', () => {
  it('finds the same busiest window as a sweep over generateSchedule’s onsets', () => {
    const summary = summarizeSchedule(opticalSpec, 1);
    const full = generateSchedule(opticalSpec);
    const width = windowSamples(1, opticalSpec.clockHz);
    const expected = Math.max(...full.trials.map((t) => worstWindowCount(t.onsetSamples, width)));
    expect(summary.worstWindowPulses).toBe(expected);
    expect(summary.worstWindowSeconds).toBe(1);
    // The spec's own cap (40 pulses in 2 s) bounds any 1 s window too.
    expect(expected).toBeLessThanOrEqual(40);
    expect(expected).toBeGreaterThan(0);
  });

  it('reports the engine’s mean rate and duty cycle', () => {
    const summary = summarizeSchedule(opticalSpec, 1);
    const { stats } = generateSchedule(opticalSpec);
    expect(summary.meanRateHz).toBeCloseTo(stats.meanRateHz, 12);
    expect(summary.dutyCycle).toBeCloseTo(stats.dutyCycle, 12);
  });

  it('takes the highest instantaneous rate from the shortest interval, which the refractory period bounds', () => {
    const summary = summarizeSchedule(opticalSpec, 1);
    const full = generateSchedule(opticalSpec);
    let shortest = Infinity;
    for (const t of full.trials) for (let i = 1; i < t.onsetSamples.length; i++) shortest = Math.min(shortest, t.onsetSamples[i]! - t.onsetSamples[i - 1]!);
    expect(summary.maxInstantRateHz).toBeCloseTo(opticalSpec.clockHz / shortest, 9);
    // Absolute refractory 10 ms ⇒ no two onsets closer than 10 ms ⇒ at most 100 Hz.
    expect(summary.maxInstantRateHz!).toBeLessThanOrEqual(100 + 1e-9);
  });

  it('skips generation above the pulse budget, and the sheet then falls back to the spec’s bounds', () => {
    // Expected pulses = ∫ρ dt × trials, the envelope's own count (computed, c).
    const summary = summarizeSchedule(opticalSpec, 1, 100);
    expect(summary.measured).toBe(false);
    expect(summary.worstWindowPulses).toBeUndefined();
    expect(summary.expectedPulses).toBeCloseTo(generateSchedule(opticalSpec).stats.expectedCount * opticalSpec.trials, 6);
    const sheet = buildSafetySheet({ spec: opticalSpec, profile: demoProfileFor('optical'), schedule: null });
    // The spec caps 40 pulses per 2 s: longer than the profile's 1 s window, so a valid (cautious) bound.
    expect(sheet.rows.find((r) => r.id === 'window-pulses')?.value).toBe(40);
  });

  it('measures over the spec’s window when the profile names none', () => {
    expect(summarizeSchedule(opticalSpec).worstWindowSeconds).toBe(2);
    const noCap = spec(optical, { trials: 1, caps: undefined });
    expect(summarizeSchedule(noCap).worstWindowSeconds).toBe(1);
  });
});

describe('sheet composition from a real spec', () => {
  const rig = { modality: 'optical' as const, clockHz: 20_000, fibreCoreUm: 200, fibreNA: 0.39, wavelengthNm: 473 };

  it('an optical example on the demo profile: measured rows, irradiance from the fibre core, cautions and disclaimer', () => {
    const profile = demoProfileFor('optical');
    const schedule = summarizeSchedule(opticalSpec, profile.limits.window?.seconds);
    const sheet = buildSafetySheet({ spec: opticalSpec, profile, rig, schedule });
    const byId = Object.fromEntries(sheet.rows.map((r) => [r.id, r]));

    expect(byId['window-pulses']?.value).toBe(schedule.worstWindowPulses);
    expect(byId['window-pulses']?.help).toContain('generated schedule');
    // E = P / (π r²): 6.5 mW through a 200 µm core is 6.5 / (π · 0.1²) = 206.9 mW/mm² (facts §5, (c)).
    const irr = sheet.rows.find((r) => r.unit === 'mW/mm²');
    expect(irr?.value).toBeCloseTo(6.5 / (Math.PI * 0.01), 6);
    expect(sheet.rows.every((r) => r.source.length > 0 && r.help.length > 0)).toBe(true);
    expect(sheet.canSubmit).toBe(true);
    expect(sheet.cautions.map((c) => c.id)).toContain('laser-eye');
    expect(sheet.disclaimer).toMatch(/does not replace/);
  });

  it('a tighter window limit than the schedule’s busiest window fails the version', () => {
    const base = demoProfileFor('optical') as Extract<LimitProfile, { modality: 'optical' }>;
    const probe = summarizeSchedule(opticalSpec, 1);
    const limit = probe.worstWindowPulses! - 1;
    const profile: LimitProfile = { ...base, limits: { ...base.limits, window: { seconds: 1, maxPulses: { hard: limit } } } };
    const sheet = buildSafetySheet({ spec: opticalSpec, profile, rig, schedule: summarizeSchedule(opticalSpec, 1) });
    const row = sheet.rows.find((r) => r.id === 'window-pulses');
    expect(row?.status).toBe('fail');
    expect(row?.margin).toBe(-1);
    expect(sheet.canSubmit).toBe(false);
  });

  it('an electrical example gets charge rows and no optical rows', () => {
    const profile = demoProfileFor('electrical');
    const schedule = summarizeSchedule(electricalSpec, profile.limits.window?.seconds);
    const sheet = buildSafetySheet({
      spec: electricalSpec,
      profile,
      rig: { modality: 'electrical', electrodeAreaMm2: 0.0314, clockHz: 30_000 },
      schedule,
    });
    expect(sheet.modality).toBe('electrical');
    expect(sheet.rows.some((r) => r.unit === 'mW/mm²')).toBe(false);
    // Q = I·t: 60 µA × 200 µs = 12 nC per phase (facts §4, (c)).
    expect(sheet.rows.find((r) => r.unit === 'nC')?.value).toBeCloseTo(12, 9);
    expect(sheet.cautions.map((c) => c.id)).toContain('charge-damage');
  });
});
