import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  envelopeDuration,
  envelopeMax,
  envelopeMin,
  envelopePolyline,
  integrateEnvelope,
  rateAt,
  sampleEnvelope,
} from '../../../lib/schedule/envelope';
import type { Segment } from '../../../lib/schedule/spec';

/** Composite Simpson on a fine grid: an independent numeric check of the closed forms. */
function numericIntegral(env: Segment[], a: number, b: number, n = 20_000): number {
  const h = (b - a) / n;
  let s = rateAt(env, a) + rateAt(env, b - 1e-12);
  for (let k = 1; k < n; k++) s += (k % 2 ? 4 : 2) * rateAt(env, a + k * h);
  return (s * h) / 3;
}

const segmentArb: fc.Arbitrary<Segment> = fc.oneof(
  fc.record({
    kind: fc.constant('ramp' as const),
    durationS: fc.double({ min: 0.5, max: 20, noNaN: true }),
    fromHz: fc.double({ min: 0, max: 100, noNaN: true }),
    toHz: fc.double({ min: 0, max: 100, noNaN: true }),
  }),
  fc.record({
    kind: fc.constant('sine' as const),
    durationS: fc.double({ min: 0.5, max: 20, noNaN: true }),
    meanHz: fc.double({ min: 20, max: 60, noNaN: true }),
    depthHz: fc.double({ min: 0, max: 20, noNaN: true }),
    freqHz: fc.double({ min: 0.05, max: 3, noNaN: true }),
    phaseDeg: fc.double({ min: -360, max: 360, noNaN: true }),
  }),
);

describe('envelope math', () => {
  it('worked example: λ(t) = sin t + 4 on [0, 200] integrates to 801 − cos 200 = 800.5128 (facts.md §1, computed, c)', () => {
    // sin t = sin(2π·f·t) with f = 1/(2π).
    const env: Segment[] = [{ kind: 'sine', durationS: 200, meanHz: 4, depthHz: 1, freqHz: 1 / (2 * Math.PI), phaseDeg: 0 }];
    expect(integrateEnvelope(env, 0, 200)).toBeCloseTo(800.5128, 4);
    expect(envelopeMax(env)).toBe(5);
  });

  it('worked example: 10 Hz on even seconds, 1 Hz on odd seconds over [0, 6] gives E[N] = 33 (facts.md §1, computed, c)', () => {
    const env: Segment[] = Array.from({ length: 6 }, (_, i) => {
      const r = i % 2 === 0 ? 10 : 1;
      return { kind: 'ramp' as const, durationS: 1, fromHz: r, toHz: r };
    });
    expect(integrateEnvelope(env, 0, 6)).toBe(33);
    expect(envelopeDuration(env)).toBe(6);
  });

  it('closed-form integrals agree with fine numeric quadrature on random envelopes and sub-intervals (fast-check)', () => {
    fc.assert(
      fc.property(fc.array(segmentArb, { minLength: 1, maxLength: 4 }), fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }), (env, p, q) => {
        const T = envelopeDuration(env);
        const a = Math.min(p, q) * T;
        const b = Math.max(p, q) * T;
        // Piecewise quadrature per segment so kinks at boundaries do not blur the comparison.
        let num = 0;
        let start = 0;
        for (const seg of env) {
          const lo = Math.max(a, start);
          const hi = Math.min(b, start + seg.durationS);
          if (hi > lo) num += numericIntegral(env, lo, hi, 2000);
          start += seg.durationS;
        }
        expect(integrateEnvelope(env, a, b)).toBeCloseTo(num, 6);
      }),
      { numRuns: 60, seed: 7 },
    );
  });

  it('envelopeMax / envelopeMin are the exact extrema (never below a dense sample, equal within sampling error)', () => {
    fc.assert(
      fc.property(fc.array(segmentArb, { minLength: 1, maxLength: 4 }), (env) => {
        const pts = sampleEnvelope(env, 20_000);
        const sMax = Math.max(...pts.map((p) => p.hz));
        const sMin = Math.min(...pts.map((p) => p.hz));
        const T = envelopeDuration(env);
        const endRate = (() => {
          const last = env[env.length - 1];
          return last.kind === 'ramp' ? last.toHz : last.meanHz + last.depthHz * Math.sin(2 * Math.PI * last.freqHz * last.durationS + (last.phaseDeg * Math.PI) / 180);
        })();
        const mx = envelopeMax(env);
        const mn = envelopeMin(env);
        expect(mx).toBeGreaterThanOrEqual(Math.max(sMax, endRate) - 1e-9);
        expect(mn).toBeLessThanOrEqual(Math.min(sMin, endRate) + 1e-9);
        // Slope ≤ 2π·3 Hz·20 Hz + ramps; grid step T/20000: the sample misses at most that much.
        const slack = (400 * T) / 20_000 + 1e-9;
        expect(mx - Math.max(sMax, endRate)).toBeLessThanOrEqual(slack);
        expect(Math.min(sMin, endRate) - mn).toBeLessThanOrEqual(slack);
      }),
      { numRuns: 60, seed: 11 },
    );
  });

  it('rateAt is 0 outside [0, T) and the polyline keeps ramp vertices exact', () => {
    const env: Segment[] = [
      { kind: 'ramp', durationS: 2, fromHz: 1, toHz: 5 },
      { kind: 'sine', durationS: 1, meanHz: 5, depthHz: 1, freqHz: 4, phaseDeg: 0 },
    ];
    expect(rateAt(env, -0.1)).toBe(0);
    expect(rateAt(env, 3)).toBe(0);
    expect(rateAt(env, 1)).toBe(3);
    const line = envelopePolyline(env, { pointsPerCycle: 8 });
    expect(line[0]).toEqual({ t: 0, hz: 1 });
    expect(line[1]).toEqual({ t: 2, hz: 5 });
    expect(line.length).toBeGreaterThanOrEqual(2 + 4 * 8);
    expect(envelopePolyline(env, { maxPoints: 10 }).length).toBeLessThanOrEqual(10);
    // More segments than the budget allows: each keeps its minimum (2 per ramp, 3 per sine).
    expect(envelopePolyline(env, { maxPoints: 1 }).length).toBe(5);
  });
});
