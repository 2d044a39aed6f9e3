import type { Spec } from '@/lib/schedule/spec';

/** Breakpoints of the benchmark envelope, 0.1 s apart: 5,000 of them make 4,999 ramps over 499.9 s. */
export const BREAKPOINTS = 5_000;
export const STEP_S = 0.1;

/** A wandering rate between 5 and 55 Hz, so neighbouring ramps differ and none is flat. */
export function rateAt(k: number): number {
  return Number((30 + 18 * Math.sin((2 * Math.PI * k) / 160) + 7 * Math.sin((2 * Math.PI * k) / 23)).toFixed(1));
}

export function dragBenchSpec(): Spec {
  const envelope: Spec['envelope'] = [];
  for (let k = 1; k < BREAKPOINTS; k++) envelope.push({ kind: 'ramp', durationS: STEP_S, fromHz: rateAt(k - 1), toHz: rateAt(k) });
  return {
    format: 'pulseloom-spec/1',
    envelope,
    ceilingHz: 80,
    refractory: { absoluteMs: 5, recoveryMs: 0 },
    pulse: { widthMs: 5, amplitude: 4, unit: 'mW' },
    trials: 10,
    seed: 'bench-drag-5000',
    clockHz: 10_000,
  };
}
