/** fast-check generator of random valid specs (small enough to run many). */
import fc from 'fast-check';
import { envelopeMax } from '../../../../lib/schedule/envelope';
import { parseSpec, type Segment, type Spec } from '../../../../lib/schedule/spec';

export function segmentArb(ceiling: number): fc.Arbitrary<Segment> {
  const dur = fc.double({ min: 0.5, max: 70, noNaN: true });
  const rate = fc.double({ min: 0, max: ceiling, noNaN: true });
  return fc.oneof(
    fc.record({ kind: fc.constant('ramp' as const), durationS: dur, fromHz: rate, toHz: rate }),
    fc
      .record({
        durationS: dur,
        meanHz: rate,
        depthFrac: fc.double({ min: 0, max: 1, noNaN: true }),
        freqHz: fc.double({ min: 0.01, max: 5, noNaN: true }),
        phaseDeg: fc.double({ min: -720, max: 720, noNaN: true }),
      })
      .map(({ depthFrac, meanHz, ...r }) => ({
        kind: 'sine' as const,
        meanHz,
        // Keep the whole sine inside [0, ceiling] whatever the phase.
        depthHz: depthFrac * Math.min(meanHz, ceiling - meanHz) * 0.999,
        ...r,
      })),
  );
}

export const specArb: fc.Arbitrary<Spec> = fc
  .record({
    clockHz: fc.constantFrom(1000, 10_000, 20_000, 30_000, 1_000_000),
    ceilingHz: fc.double({ min: 1, max: 300, noNaN: true }),
    widthMs: fc.double({ min: 0.05, max: 5, noNaN: true }),
    extraRefractoryMs: fc.double({ min: 0, max: 25, noNaN: true }),
    recoveryMs: fc.oneof(fc.constant(0), fc.double({ min: 0.1, max: 20, noNaN: true })),
    maxRateFactor: fc.option(fc.double({ min: 1, max: 3, noNaN: true }), { nil: undefined }),
    window: fc.option(fc.record({ seconds: fc.double({ min: 0.05, max: 5, noNaN: true }), maxPulses: fc.integer({ min: 1, max: 40 }) }), { nil: undefined }),
    trials: fc.integer({ min: 1, max: 3 }),
    seed: fc.string({ minLength: 1, maxLength: 12 }),
    segFracs: fc.array(fc.constant(0), { minLength: 1, maxLength: 4 }),
  })
  .chain((r) =>
    fc.tuple(fc.constant(r), fc.array(segmentArb(r.ceilingHz), { minLength: r.segFracs.length, maxLength: r.segFracs.length })),
  )
  .map(([r, envelope]) => {
    const widthMs = Math.max(r.widthMs, 1000 / r.clockHz);
    const max = envelopeMax(envelope);
    const caps: Spec['caps'] = {};
    if (r.maxRateFactor !== undefined && max > 0) caps.maxRateHz = max * r.maxRateFactor;
    if (r.window) caps.window = r.window;
    const spec: Spec = {
      format: 'pulseloom-spec/1',
      envelope,
      ceilingHz: r.ceilingHz,
      refractory: { absoluteMs: widthMs + r.extraRefractoryMs, recoveryMs: r.recoveryMs },
      ...(Object.keys(caps).length ? { caps } : {}),
      pulse: { widthMs, amplitude: 3, unit: 'mW' },
      trials: r.trials,
      seed: r.seed,
      clockHz: r.clockHz,
    };
    return spec;
  })
  .filter((s) => parseSpec(s).ok);
