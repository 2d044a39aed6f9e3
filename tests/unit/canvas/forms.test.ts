import { describe, expect, it } from 'vitest';
import { parseSpec, SPEC_FORMAT, type Spec } from '@/lib/schedule/spec';
import { formToSettings, joinSpec, newSeed, saveBlockers, settingsFieldOf, settingsToForm, shapeFormSchema, shapeFromForm, splitSpec } from '@/components/canvas/model';

const spec: Spec = {
  format: SPEC_FORMAT,
  envelope: [{ kind: 'ramp', durationS: 10, fromHz: 5, toHz: 40 }],
  ceilingHz: 100,
  refractory: { absoluteMs: 10, recoveryMs: 0 },
  caps: { maxRateHz: 80, window: { seconds: 1, maxPulses: 40 } },
  pulse: { widthMs: 0.45, amplitude: 50, unit: 'uA', phases: { widthUs: 200, gapUs: 50, leading: 'cathodic' } },
  trials: 20,
  seed: 'slice-3',
  clockHz: 10000,
};

describe('settings form ↔ spec', () => {
  it('round-trips a spec through the form', () => {
    const { envelope, settings } = splitSpec(spec);
    const back = joinSpec(envelope, formToSettings(settingsToForm(settings), settings.seed));
    expect(back).toEqual(spec);
    expect(parseSpec(back).ok).toBe(true);
  });

  it('drops switched-off caps and phases of light pulses, keeping the spec valid', () => {
    const f = { ...settingsToForm(splitSpec(spec).settings), useMaxRate: false, useWindow: false, unit: 'mW' as const, widthMs: 5 };
    const s = formToSettings(f, 'x');
    expect(s.caps).toBeUndefined();
    expect(s.pulse).toEqual({ widthMs: 5, amplitude: 50, unit: 'mW' });
    expect(saveBlockers(joinSpec(spec.envelope, s))).toEqual([]);
  });

  it('places engine errors on form fields, and lists them as save blockers', () => {
    const bad = joinSpec(spec.envelope, { ...splitSpec(spec).settings, refractory: { absoluteMs: 0.1, recoveryMs: 0 } });
    const blockers = saveBlockers(bad);
    expect(blockers.map((b) => b.path)).toContain('refractory.absoluteMs');
    expect(settingsFieldOf('refractory.absoluteMs')).toBe('absoluteMs');
    expect(settingsFieldOf('caps.window.maxPulses')).toBe('windowMaxPulses');
    expect(settingsFieldOf('envelope[0].toHz')).toBeNull();
  });
});

describe('shape form', () => {
  it('accepts each shape and builds it', () => {
    const sine = shapeFormSchema.parse({ kind: 'sine', startS: 1, endS: 3, meanHz: 20, depthHz: 5, freqHz: 2, phaseDeg: 90 });
    expect(shapeFromForm(sine)).toEqual({ shape: { kind: 'sine', meanHz: 20, depthHz: 5, freqHz: 2, phaseDeg: 90 }, span: { startS: 1, endS: 3 } });
    expect(shapeFromForm(shapeFormSchema.parse({ kind: 'hold', startS: 0, endS: 1, rateHz: 3 })).shape).toEqual({ kind: 'hold', rateHz: 3 });
  });

  it('rejects an empty span, negative rates, a zero frequency and blank fields', () => {
    const bad = [
      { kind: 'hold', startS: 2, endS: 2, rateHz: 3 },
      { kind: 'ramp', startS: 0, endS: 1, fromHz: -1, toHz: 3 },
      { kind: 'sine', startS: 0, endS: 1, meanHz: 1, depthHz: 1, freqHz: 0, phaseDeg: 0 },
      { kind: 'hold', startS: 0, endS: 1, rateHz: Number.NaN },
    ];
    for (const v of bad) expect(shapeFormSchema.safeParse(v).success).toBe(false);
  });
});

describe('newSeed', () => {
  it('makes a short readable seed from the random source', () => {
    const s = newSeed((a) => a.fill(123456789));
    expect(s).toMatch(/^seed-[0-9a-z]{10}$/);
    expect(newSeed()).not.toBe(newSeed());
  });
});
