/** Small spec builders for tests: our own invented values. */
import type { Segment, Spec } from '../../../../lib/schedule/spec';

export function holdSpec(over: Partial<Spec> & { rateHz?: number; durationS?: number } = {}): Spec {
  const { rateHz = 20, durationS = 60, ...rest } = over;
  return baseSpec({ envelope: [{ kind: 'ramp', durationS, fromHz: rateHz, toHz: rateHz }], ceilingHz: rateHz, ...rest });
}

export function baseSpec(over: Partial<Spec> = {}): Spec {
  return {
    format: 'pulseloom-spec/1',
    envelope: [{ kind: 'ramp', durationS: 30, fromHz: 10, toHz: 10 }] as Segment[],
    ceilingHz: 20,
    refractory: { absoluteMs: 2, recoveryMs: 0 },
    pulse: { widthMs: 1, amplitude: 5, unit: 'mW' },
    trials: 1,
    seed: 'test-seed',
    clockHz: 1_000_000,
    ...over,
  };
}
