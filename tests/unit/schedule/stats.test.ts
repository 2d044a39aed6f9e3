import { describe, expect, it } from 'vitest';
import { compileSpec } from '../../../lib/schedule/compile';
import { deadTimeModel, keptRate } from '../../../lib/schedule/delivered';
import { integrateEnvelope } from '../../../lib/schedule/envelope';
import { generateSchedule } from '../../../lib/schedule/generate';
import type { Spec } from '../../../lib/schedule/spec';
import { baseSpec, holdSpec } from './helpers/specs';

describe('statistics', () => {
  it('expected count is the exact envelope integral (closed form, cross-checked in envelope.test.ts)', () => {
    const spec = baseSpec({
      envelope: [
        { kind: 'ramp', durationS: 10, fromHz: 5, toHz: 40 },
        { kind: 'sine', durationS: 20, meanHz: 20, depthHz: 15, freqHz: 2, phaseDeg: 0 },
      ],
      ceilingHz: 100,
    });
    // Ramp: (5 + 40)/2 × 10 = 225; sine over 40 whole cycles: 20 × 20 = 400 (arithmetic, c).
    expect(generateSchedule(spec).stats.expectedCount).toBeCloseTo(625, 9);
  });

  it('for a hold, expected delivered count is λT/(1 + λτ) (Knoll, non-paralyzable; recalled, b), τ less half a clock tick', () => {
    const s = generateSchedule(holdSpec({ rateHz: 100, durationS: 100, refractory: { absoluteMs: 10, recoveryMs: 0 }, clockHz: 1_000_000 }));
    expect(s.stats.expectedDeliveredCount / 100).toBeCloseTo(100 / (1 + 100 * (0.01 - 0.5e-6)), 9);
    expect(s.stats.expectedDeliveredCount / 100).toBeCloseTo(50, 2);
  });

  it('the recovery model reduces to λ/(1+λτ) as the recovery constant shrinks, and matches simulation with recovery (Monte Carlo)', () => {
    const spec = holdSpec({ rateHz: 60, durationS: 600, refractory: { absoluteMs: 5, recoveryMs: 1e-6 }, clockHz: 1_000_000 });
    const m = deadTimeModel(compileSpec(spec));
    expect(keptRate(60, m)).toBeCloseTo(60 / (1 + 60 * (0.005 - 0.5e-6)), 3);
    const withRecovery = holdSpec({ rateHz: 60, durationS: 600, trials: 4, refractory: { absoluteMs: 5, recoveryMs: 12 }, clockHz: 1_000_000, seed: 'recovery-mc' });
    const s = generateSchedule(withRecovery);
    // 4 × 600 s ≈ 70 000 pulses: the mean count's sd is < 0.4 %, so the 1.5 % band is > 3.7 sd
    // (false failure < 2e-4) plus room for the model's quadrature and half-tick approximation.
    expect(Math.abs(s.stats.realizedCount.meanPerTrial / s.stats.expectedDeliveredCount - 1)).toBeLessThan(0.015);
  });

  it('accounts for every candidate: candidates = thinned + suppressed + realized, per trial', () => {
    const spec: Spec = {
      ...baseSpec(),
      envelope: [{ kind: 'sine', durationS: 90, meanHz: 40, depthHz: 35, freqHz: 0.2, phaseDeg: 0 }],
      ceilingHz: 80,
      refractory: { absoluteMs: 1.5, recoveryMs: 3 },
      caps: { maxRateHz: 76, window: { seconds: 1, maxPulses: 30 } },
      clockHz: 1000,
      trials: 3,
    };
    const s = generateSchedule(spec);
    for (const t of s.stats.perTrial) {
      const sup = t.suppressed;
      expect(t.thinned + sup.refractory + sup.clock + sup.maxRate + sup.window + t.realizedCount).toBe(t.candidates);
    }
    // τ = 1.5 ms at a 1 kHz clock is 1.5 ticks: rounding down must drop (and count) pulses 1 tick after the previous one.
    expect(s.stats.suppressed.clock).toBeGreaterThan(0);
    expect(s.stats.suppressed.window).toBeGreaterThan(0);
    expect(s.stats.suppressed.maxRate).toBeGreaterThan(0);
    expect(s.stats.warnings.join(' ')).toMatch(/Caps removed \d+ pulses \(maxRate \d+, window \d+\)/);
    expect(s.stats.shortfall.caps).toBeCloseTo((s.stats.suppressed.maxRate + s.stats.suppressed.window) / 3 / s.stats.expectedCount, 12);
  });

  it('warns plainly when the delivered rate falls more than 5 % below the envelope, and stays quiet otherwise', () => {
    const heavy = generateSchedule(holdSpec({ rateHz: 100, durationS: 100, refractory: { absoluteMs: 10, recoveryMs: 0 } })).stats;
    expect(heavy.deliveredBelowEnvelope).toBe(true);
    expect(heavy.warnings[0]).toMatch(/^Refractoriness holds the delivered rate 50\.0 % below the drawn envelope/);
    // 10 Hz with 1 ms refractory: 1 % shortfall; 20 trials × 200 s ⇒ realized mean sd 0.2 %,
    // so crossing the 5 % line by chance would take a 20-sd draw (false failure ≈ 0).
    const light = generateSchedule(holdSpec({ rateHz: 10, durationS: 200, trials: 20, refractory: { absoluteMs: 1, recoveryMs: 0 } })).stats;
    expect(light.deliveredBelowEnvelope).toBe(false);
    expect(light.warnings).toEqual([]);
  });

  it('duty cycle and mean optical power follow from the pulses: P_mean = P_peak × width × rate (facts.md §5, c)', () => {
    const s = generateSchedule(holdSpec({ rateHz: 20, durationS: 50, trials: 2, pulse: { widthMs: 5, amplitude: 8, unit: 'mW' }, refractory: { absoluteMs: 5, recoveryMs: 0 } })).stats;
    const duty = (s.realizedCount.total * 0.005) / (50 * 2);
    expect(s.dutyCycle).toBeCloseTo(duty, 12);
    expect(s.optical).toEqual({ peakPowerMw: 8, meanPowerMw: 8 * duty });
    expect(s.electrical).toBeUndefined();
  });

  it('charge per phase Q = I·t: 100 µA × 200 µs = 20 nC (facts.md §4 worked example, c); total = Q × pulses', () => {
    const spec = holdSpec({
      rateHz: 30,
      durationS: 20,
      pulse: { widthMs: 0.45, amplitude: 100, unit: 'uA', phases: { widthUs: 200, gapUs: 50, leading: 'anodic' } },
      refractory: { absoluteMs: 1, recoveryMs: 0 },
    });
    const s = generateSchedule(spec).stats;
    expect(s.electrical!.chargePerPhaseNc).toBeCloseTo(20, 12);
    expect(s.electrical!.totalChargeNc).toBeCloseTo(20 * s.realizedCount.total, 9);
    expect(s.optical).toBeUndefined();
  });

  it('expected count from a long sine uses whole cycles (no aliasing in the delivered estimate)', () => {
    const env = [{ kind: 'sine' as const, durationS: 7200, meanHz: 30, depthHz: 20, freqHz: 3, phaseDeg: 10 }];
    const spec = baseSpec({ envelope: env, ceilingHz: 60, refractory: { absoluteMs: 0.001, recoveryMs: 0 }, pulse: { widthMs: 0.001, amplitude: 1, unit: 'mW' }, trials: 1 });
    const c = compileSpec(spec);
    const { expectedDeliveredCount } = generateSchedule({ ...spec, envelope: [{ ...env[0], durationS: 60 }] }).stats;
    // With τ = 1 µs the delivered estimate is the envelope integral to 1e-4; over 2 h it must scale ×120.
    expect(expectedDeliveredCount * 120).toBeCloseTo(integrateEnvelope(env, 0, 7200), -1);
    expect(c.durationS).toBe(7200);
  });
});
