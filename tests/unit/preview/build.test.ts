import { describe, expect, it } from 'vitest';
import { envelopeDuration, rateAt } from '@/lib/schedule/envelope';
import { generateSchedule } from '@/lib/schedule';
import { buildPreview, intervalHistogram, PREVIEW_BUDGET, rateEstimate, truncateEnvelope } from '@/lib/preview';
import { opticalSpec } from './spec-fixture';

describe('buildPreview', () => {
  const spec = opticalSpec();
  const p = buildPreview(spec, { trials: 4 });

  it('returns the engine’s pulses for the first trials with the current seed', () => {
    const direct = generateSchedule({ ...spec, trials: 4 });
    expect(p.seed).toBe('cue-block-a');
    expect(p.trials).toBe(4);
    expect(p.onsetsS).toEqual(direct.trials.map((t) => t.onsetsS));
    expect(p.counts.perTrial).toEqual(direct.trials.map((t) => t.onsetsS.length));
    expect(p.truncated).toBe(false);
    expect(p.coveredS).toBe(40);
  });

  it('a new seed gives new pulses', () => {
    const other = buildPreview({ ...spec, seed: 'cue-block-b' }, { trials: 4 });
    expect(other.onsetsS).not.toEqual(p.onsetsS);
  });

  it('summarizes with the engine’s numbers', () => {
    expect(p.summary.expectedCount).toBeCloseTo(225 + 400 + 400, 6); // ramp 5→40 over 10 s + 40 Hz × 10 s + 20 Hz mean × 20 s (whole cycles)
    expect(p.summary.realized.total).toBe(p.counts.perTrial.reduce((a, b) => a + b, 0));
    expect(p.summary.optical).toMatchObject({ peakPowerMw: 10 });
    expect(p.summary.electrical).toBeNull();
    expect(p.summary.dutyCycle).toBeCloseTo((p.summary.realized.total * 0.005) / (40 * 4), 12);
    expect(p.counts.expected).toBe(p.summary.expectedCount);
  });

  it('samples the envelope for plotting, sines included', () => {
    expect(p.envelope.t[0]).toBe(0);
    expect(p.envelope.t[p.envelope.t.length - 1]).toBeCloseTo(40, 9);
    for (let i = 0; i < p.envelope.t.length - 1; i += 7) expect(p.envelope.hz[i]).toBeCloseTo(rateAt(spec.envelope, p.envelope.t[i]), 9);
  });

  it('bins the rate so that the counts add up to every pulse', () => {
    const { rate } = p;
    const pulses = rate.hz.reduce((acc, hz, k) => acc + hz * rate.width[k] * p.trials, 0);
    expect(pulses).toBeCloseTo(p.summary.realized.total, 6);
    for (let k = 0; k < rate.hz.length; k++) {
      expect(rate.lowerHz[k]).toBeLessThanOrEqual(rate.hz[k]);
      expect(rate.upperHz[k]).toBeGreaterThan(rate.hz[k]);
    }
  });

  it('histograms every interval, none shorter than the refractory period', () => {
    const { intervals } = p;
    const expectedTotal = p.onsetsS.reduce((acc, t) => acc + Math.max(0, t.length - 1), 0);
    expect(intervals.total).toBe(expectedTotal);
    expect(intervals.counts.reduce((a, b) => a + b, 0) + intervals.overflow).toBe(expectedTotal);
    expect(intervals.refractoryMs).toBe(10);
    expect(intervals.belowRefractory).toBe(0);
    expect(intervals.minMs!).toBeGreaterThanOrEqual(10 - 1e-6);
  });
});

describe('rate band', () => {
  it('covers the expected delivered rate in about 95 % of bins for a hold', () => {
    // 30 Hz hold, 1 ms dead time: delivered ≈ 30 / (1 + 30 × 0.001) = 29.13 Hz.
    const spec = opticalSpec({
      envelope: [{ kind: 'ramp', durationS: 120, fromHz: 30, toHz: 30 }],
      refractory: { absoluteMs: 1, recoveryMs: 0 },
      pulse: { widthMs: 0.5, amplitude: 5, unit: 'mW' },
      caps: undefined,
    });
    const p = buildPreview(spec, { trials: 20 });
    // 72,000 expected pulses exceed the preview budget, so the preview covers only the start.
    expect(p.truncated).toBe(true);
    const delivered = p.summary.expectedDeliveredCount / p.coveredS;
    const inside = p.rate.hz.filter((_, k) => p.rate.lowerHz[k] <= delivered && delivered <= p.rate.upperHz[k]).length;
    expect(inside / p.rate.hz.length).toBeGreaterThan(0.85);
  });
});

describe('long envelopes', () => {
  it('previews the beginning only, and it is the real beginning', () => {
    const spec = opticalSpec({ envelope: [{ kind: 'sine', durationS: 7200, meanHz: 5, depthHz: 3, freqHz: 0.01, phaseDeg: 0 }] });
    const p = buildPreview(spec, { trials: 5 });
    expect(p.truncated).toBe(true);
    expect(p.durationS).toBe(7200);
    // Candidates: 400,000 / (100 Hz × 5 trials) = 800 s; pulses there (about 20,000) stay under budget.
    expect(p.coveredS).toBe(PREVIEW_BUDGET.candidates / (100 * 5));
    const longer = generateSchedule({ ...spec, envelope: truncateEnvelope(spec.envelope, 2 * p.coveredS), trials: 5 });
    for (let trial = 0; trial < 5; trial++) {
      expect(p.onsetsS[trial]).toEqual(longer.trials[trial].onsetsS.filter((t) => t < p.coveredS));
    }
  });

  it('also bounds the pulses returned, by the envelope’s expected count', () => {
    const spec = opticalSpec({
      ceilingHz: 1000,
      caps: undefined,
      refractory: { absoluteMs: 0.2, recoveryMs: 0 },
      pulse: { widthMs: 0.1, amplitude: 1, unit: 'mW' },
      envelope: [{ kind: 'ramp', durationS: 3600, fromHz: 900, toHz: 900 }],
    });
    const p = buildPreview(spec, { trials: 20 });
    expect(p.truncated).toBe(true);
    // 50,000 expected pulses over 20 trials at 900 Hz: 2.777… s, floored to 3 digits.
    expect(p.coveredS).toBe(2.77);
    expect(p.summary.realized.total).toBeLessThan(PREVIEW_BUDGET.pulses * 1.05);
  });

  it('cuts ramps on their line and sines without moving their phase', () => {
    const env = opticalSpec().envelope;
    const cut = truncateEnvelope(env, 25);
    expect(envelopeDuration(cut)).toBe(25);
    for (const t of [1, 9.5, 12, 24.9]) expect(rateAt(cut, t)).toBeCloseTo(rateAt(env, t), 12);
    expect(truncateEnvelope(env, 5)).toEqual([{ kind: 'ramp', durationS: 5, fromHz: 5, toHz: 22.5 }]);
  });
});

describe('rateEstimate and intervalHistogram on known pulses', () => {
  it('counts pulses per bin over trials, last bin at its real width', () => {
    const r = rateEstimate(
      [
        [0.1, 0.2, 1.5],
        [0.3, 2.05],
      ],
      2.1,
    );
    expect(r.binS).toBe(0.05);
    expect(r.start).toHaveLength(42);
    expect(r.width[41]).toBeCloseTo(0.05, 12);
    // bin [0.1, 0.15) holds one pulse over 2 trials × 0.05 s
    expect(r.hz[2]).toBeCloseTo(10, 9);
    expect(r.hz.reduce((a, b) => a + b, 0) * 0.05 * 2).toBeCloseTo(5, 9);
  });

  it('histograms intervals in ms and measures their spread', () => {
    const h = intervalHistogram([[0, 0.01, 0.03, 0.06], [1, 1.02]], 10);
    expect(h.total).toBe(4);
    expect(h.minMs).toBeCloseTo(10, 9);
    expect(h.meanMs).toBeCloseTo(20, 9);
    expect(h.counts.reduce((a, b) => a + b, 0) + h.overflow).toBe(4);
    expect(h.belowRefractory).toBe(0);
    expect(intervalHistogram([[0.5]], 10)).toMatchObject({ total: 0, counts: [], meanMs: null });
    expect(intervalHistogram([[0, 0.004]], 10).belowRefractory).toBe(1);
  });
});
