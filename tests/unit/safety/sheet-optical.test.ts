import { describe, expect, it } from 'vitest';
import { DEMO_OPTICAL_PROFILE } from '@/lib/safety/demo-profiles';
import { coreAreaMm2 } from '@/lib/safety/metrics';
import { buildSafetySheet } from '@/lib/safety/sheet';
import { opticalProfile, opticalRig, opticalSpec, row } from './fixtures';

// A typical train: 10 mW, 5 ms at 20 Hz (common practice, no source), through a 200 µm core.
const schedule = { meanRateHz: 20, dutyCycle: 0.1, worstWindowPulses: 30, worstWindowSeconds: 1 };

describe('optical safety sheet, computed values', () => {
  const sheet = buildSafetySheet({ spec: opticalSpec(), rig: opticalRig(200), profile: DEMO_OPTICAL_PROFILE, schedule });

  it('puts 10 mW through 200 µm at 318.3 mW/mm² (facts §5, E = P/(πr²), (c))', () => {
    expect(row(sheet, 'irradiance').value).toBeCloseTo(318.31, 2);
  });

  it('gives 1 mW mean power at 10 % duty and 1.5 mW in a 30-pulse second (facts §5, P_mean = P_peak × duty, (c))', () => {
    expect(row(sheet, 'duty-mean').value).toBeCloseTo(10, 10);
    expect(row(sheet, 'mean-power').value).toBeCloseTo(1, 10);
    expect(row(sheet, 'duty-window').value).toBeCloseTo(15, 10);
    expect(row(sheet, 'mean-power-window').value).toBeCloseTo(1.5, 10);
  });

  it('estimates 0.25 °C from 1 mW mean power (Shin et al. 2016, 0.25 °C/mW near the tip, (a))', () => {
    expect(row(sheet, 'heating-mean').value).toBeCloseTo(0.25, 10);
  });

  it('reports the train length and the highest drawn rate from the envelope (arithmetic, (c))', () => {
    expect(row(sheet, 'train-duration').value).toBe(30);
    expect(row(sheet, 'peak-rate').value).toBe(20);
    expect(row(sheet, 'refractory').value).toBe(10);
  });

  it('passes every checked row of the demo profile and can be submitted without justification', () => {
    const checked = sheet.rows.filter((r) => r.direction !== null);
    expect(checked.length).toBeGreaterThanOrEqual(12);
    expect(checked.filter((r) => r.status !== 'pass').map((r) => r.id)).toEqual([]);
    expect(sheet.canSubmit).toBe(true);
    expect(sheet.needsJustification).toBe(false);
  });

  it('gives the margin to the hard limit in the row’s unit', () => {
    expect(row(sheet, 'irradiance').margin).toBeCloseTo(1000 - 318.31, 2);
    expect(row(sheet, 'refractory').margin).toBe(10 - 2);
  });
});

describe('optical safety sheet, heating and spread estimates', () => {
  it('reproduces Yizhar et al. (2011): 4.9 mW/mm², 5 ms at 20 Hz for 30 s ⇒ 0.387 °C upper bound (b)', () => {
    // Peak power chosen so the tip irradiance is 4.9 mW/mm²; busiest window = the whole 30 s train.
    const spec = opticalSpec({ pulse: { widthMs: 5, amplitude: 4.9 * coreAreaMm2(200), unit: 'mW' } });
    const sheet = buildSafetySheet({
      spec,
      rig: opticalRig(200),
      profile: DEMO_OPTICAL_PROFILE,
      schedule: { ...schedule, worstWindowPulses: 600, worstWindowSeconds: 30 },
    });
    const bound = row(sheet, 'heating-burst-bound');
    expect(bound.value).toBeCloseTo(0.387, 3);
    expect(bound.status).toBe('info');
    expect(bound.label).toMatch(/upper bound/i);
    expect(bound.help).toMatch(/conduction/);
    expect(bound.help).toMatch(/blood flow/);
  });

  it('estimates 4.14 mW/mm² at 0.5 mm for 5 mW through 200 µm, NA 0.37 (Aravanis et al. 2007 model (b), computed (c)); information only', () => {
    const spec = opticalSpec({ pulse: { widthMs: 5, amplitude: 5, unit: 'mW' } });
    const sheet = buildSafetySheet({ spec, rig: opticalRig(200, 0.37), profile: DEMO_OPTICAL_PROFILE, schedule });
    const spread = row(sheet, 'spread');
    expect(spread.value).toBeCloseTo(4.14, 2);
    expect(spread.status).toBe('info');
    expect(spread.limit).toBeNull();
  });
});

describe('optical safety sheet, pass / warn / fail', () => {
  it('fails 10 mW through a 100 µm core (1273 mW/mm², facts §5 (c)) against a hard limit of 1000, and blocks submission', () => {
    const sheet = buildSafetySheet({ spec: opticalSpec(), rig: opticalRig(100), profile: DEMO_OPTICAL_PROFILE, schedule });
    const r = row(sheet, 'irradiance');
    expect(r.value).toBeCloseTo(1273.2, 1);
    expect(r.status).toBe('fail');
    expect(r.margin).toBeCloseTo(1000 - 1273.24, 1);
    expect(sheet.canSubmit).toBe(false);
  });

  it('warns for 7.5 mW through 200 µm (≈ 239 mW/mm², published practitioner note (a)) above a 200 warning level', () => {
    const spec = opticalSpec({ pulse: { widthMs: 5, amplitude: 7.5, unit: 'mW' } });
    const profile = opticalProfile({ maxIrradianceMwPerMm2: { warn: 200, hard: 1000 } });
    const sheet = buildSafetySheet({ spec, rig: opticalRig(200), profile, schedule });
    expect(row(sheet, 'irradiance').value).toBeCloseTo(239, 0);
    expect(row(sheet, 'irradiance').status).toBe('warn');
    expect(sheet.canSubmit).toBe(true);
    expect(sheet.needsJustification).toBe(true);
  });

  it('marks rows whose limit the profile leaves empty as not-set, and checks nothing there', () => {
    const sheet = buildSafetySheet({ spec: opticalSpec(), rig: opticalRig(200), profile: opticalProfile({}), schedule });
    const checked = sheet.rows.filter((r) => r.direction !== null);
    expect(new Set(checked.map((r) => r.status))).toEqual(new Set(['not-set']));
    expect(row(sheet, 'irradiance').value).toBeCloseTo(318.31, 2);
    expect(sheet.canSubmit).toBe(true);
    expect(sheet.needsJustification).toBe(false);
  });

  it('checks the busiest window against the mean-power limit: a burst can fail where the mean passes (facts §5, (c))', () => {
    const profile = opticalProfile({ maxMeanPowerMw: { hard: 2 } });
    const sheet = buildSafetySheet({
      spec: opticalSpec(),
      rig: opticalRig(200),
      profile,
      schedule: { ...schedule, worstWindowPulses: 50 },
    });
    expect(row(sheet, 'mean-power').status).toBe('pass');
    expect(row(sheet, 'mean-power-window').value).toBeCloseTo(2.5, 10);
    expect(row(sheet, 'mean-power-window').status).toBe('fail');
  });
});

describe('optical safety sheet, missing data', () => {
  it('does not crash without a rig; limits it cannot check ask for a justification', () => {
    const sheet = buildSafetySheet({ spec: opticalSpec(), rig: null, profile: DEMO_OPTICAL_PROFILE, schedule });
    const irr = row(sheet, 'irradiance');
    expect(irr.value).toBeNull();
    expect(irr.status).toBe('warn');
    expect(irr.help).toMatch(/fibre core diameter/);
    expect(row(sheet, 'heating-burst-bound')).toMatchObject({ value: null, status: 'info' });
    expect(row(sheet, 'spread')).toMatchObject({ value: null, status: 'info' });
    expect(row(sheet, 'mean-power').status).toBe('pass');
    expect(sheet.canSubmit).toBe(true);
    expect(sheet.needsJustification).toBe(true);
  });

  it('treats a zero or absent core diameter as missing, and blocks when the profile says so', () => {
    for (const core of [0, -5, null]) {
      const sheet = buildSafetySheet({ spec: opticalSpec(), rig: opticalRig(core), profile: { ...DEMO_OPTICAL_PROFILE, whenUnknown: 'fail' }, schedule });
      expect(row(sheet, 'irradiance')).toMatchObject({ value: null, status: 'fail' });
      expect(sheet.canSubmit).toBe(false);
    }
  });

  it('shows not-set, not a warning, when the missing value has no limit either', () => {
    const sheet = buildSafetySheet({ spec: opticalSpec(), rig: null, profile: opticalProfile({ maxPeakPowerMw: { hard: 20 } }), schedule });
    expect(row(sheet, 'irradiance')).toMatchObject({ value: null, status: 'not-set' });
    expect(sheet.needsJustification).toBe(false);
  });

  it('without a preview, uses the envelope mean (an overstatement) and the spec’s window cap', () => {
    const spec = opticalSpec({ caps: { window: { seconds: 1, maxPulses: 25 } } });
    const sheet = buildSafetySheet({ spec, rig: opticalRig(200), profile: DEMO_OPTICAL_PROFILE });
    expect(row(sheet, 'mean-rate').value).toBeCloseTo(20, 10);
    expect(row(sheet, 'mean-rate').help).toMatch(/overstates/);
    expect(row(sheet, 'duty-mean').value).toBeCloseTo(10, 10);
    expect(row(sheet, 'window-pulses')).toMatchObject({ value: 25, status: 'pass' });
    expect(row(sheet, 'duty-window').value).toBeCloseTo(12.5, 10);
  });

  it('without a preview or a window cap, cannot count the busiest window', () => {
    const sheet = buildSafetySheet({ spec: opticalSpec(), rig: opticalRig(200), profile: DEMO_OPTICAL_PROFILE });
    expect(row(sheet, 'window-pulses')).toMatchObject({ value: null, status: 'warn' });
    expect(row(sheet, 'duty-window')).toMatchObject({ value: null, status: 'warn' });
  });
});

describe('optical safety sheet, window length', () => {
  const profile = opticalProfile({ window: { seconds: 1, maxPulses: { hard: 40 } } });

  it('accepts a count over a longer window as a bound, since it can only overstate', () => {
    const sheet = buildSafetySheet({ spec: opticalSpec(), profile, schedule: { worstWindowPulses: 35, worstWindowSeconds: 2 } });
    const r = row(sheet, 'window-pulses');
    expect(r).toMatchObject({ value: 35, status: 'pass', label: 'Most pulses in any 1 s' });
    expect(r.help).toMatch(/longer window/);
  });

  it('refuses a count over a shorter window, which proves nothing about the profile’s window', () => {
    const sheet = buildSafetySheet({ spec: opticalSpec(), profile, schedule: { worstWindowPulses: 10, worstWindowSeconds: 0.5 } });
    expect(row(sheet, 'window-pulses')).toMatchObject({ value: null, status: 'warn' });
  });

  it('fails a busiest window above the hard count', () => {
    const sheet = buildSafetySheet({ spec: opticalSpec(), profile, schedule: { worstWindowPulses: 41, worstWindowSeconds: 1 } });
    expect(row(sheet, 'window-pulses')).toMatchObject({ value: 41, status: 'fail', margin: -1 });
  });
});

describe('optical safety sheet, rates', () => {
  it('takes the exact envelope maximum: ramp 5→40 Hz then sine 20 ± 15 Hz peaks at 40 Hz (arithmetic, (c))', () => {
    const spec = opticalSpec({
      envelope: [
        { kind: 'ramp', durationS: 10, fromHz: 5, toHz: 40 },
        { kind: 'sine', durationS: 20, meanHz: 20, depthHz: 15, freqHz: 2, phaseDeg: 0 },
      ],
    });
    const sheet = buildSafetySheet({ spec, profile: opticalProfile({ maxRateHz: { warn: 39, hard: 100 } }), schedule });
    expect(row(sheet, 'peak-rate')).toMatchObject({ value: 40, status: 'warn' });
  });

  it('states the delivered rate under dead time: 100 Hz drawn, 10 ms refractory ⇒ 50 Hz (Knoll 2010 (b); facts §3 check value (c))', () => {
    const spec = opticalSpec({ envelope: [{ kind: 'ramp', durationS: 5, fromHz: 100, toHz: 100 }], ceilingHz: 200 });
    const sheet = buildSafetySheet({ spec, profile: opticalProfile({}), schedule });
    expect(row(sheet, 'peak-rate').help).toMatch(/about 50 Hz/);
  });

  it('fails a refractory period below the minimum', () => {
    const spec = opticalSpec({ refractory: { absoluteMs: 6, recoveryMs: 0 } });
    const sheet = buildSafetySheet({ spec, profile: opticalProfile({ minRefractoryMs: { hard: 8 } }), schedule });
    expect(row(sheet, 'refractory')).toMatchObject({ value: 6, status: 'fail', margin: -2, direction: 'min' });
  });

  it('shows the schedule’s highest instantaneous rate only when given, as information', () => {
    const without = buildSafetySheet({ spec: opticalSpec(), profile: DEMO_OPTICAL_PROFILE, schedule });
    expect(without.rows.some((r) => r.id === 'instant-rate')).toBe(false);
    const withIt = buildSafetySheet({ spec: opticalSpec(), profile: DEMO_OPTICAL_PROFILE, schedule: { ...schedule, maxInstantRateHz: 95 } });
    expect(row(withIt, 'instant-rate')).toMatchObject({ value: 95, status: 'info' });
  });
});
