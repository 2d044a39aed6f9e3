import { SPEC_FORMAT, type Spec } from '@/lib/schedule/spec';

/** A cue-paired optical block from our own example lab: ramp up, hold, slow wobble. */
export function opticalSpec(over: Partial<Spec> = {}): Spec {
  return {
    format: SPEC_FORMAT,
    envelope: [
      { kind: 'ramp', durationS: 10, fromHz: 5, toHz: 40 },
      { kind: 'ramp', durationS: 10, fromHz: 40, toHz: 40 },
      { kind: 'sine', durationS: 20, meanHz: 20, depthHz: 15, freqHz: 0.5, phaseDeg: 0 },
    ],
    ceilingHz: 100,
    refractory: { absoluteMs: 10, recoveryMs: 0 },
    caps: { maxRateHz: 80 },
    pulse: { widthMs: 5, amplitude: 10, unit: 'mW' },
    trials: 20,
    seed: 'cue-block-a',
    clockHz: 10000,
    ...over,
  };
}
