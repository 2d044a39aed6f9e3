/**
 * How many pulses survive refractoriness, before any pulse is drawn.
 *
 * At a constant candidate rate λ the kept pulses form a renewal process whose mean
 * interval is m(λ) = D + ∫₀^∞ exp(−λ·H(s)) ds, D the dead time after a kept onset
 * (absolute refractory, or 1/maxRateHz if longer, in whole ticks; less half a tick, see below) and H the integrated
 * recovery after it. Without recovery m = D + 1/λ, so the kept rate is λ/(1 + λD):
 * the non-paralyzable dead-time formula (Knoll, Radiation Detection and Measurement, ch. 4).
 *
 * For an envelope that changes, the estimate is quasi-static: ∫ 1/m(ρ(t)) dt, as if the
 * process settled at each instant. Exact for a long hold; close when ρ changes slowly
 * against the refractory period; the window cap is not modelled (its effect is counted).
 */
import type { Compiled } from './compile';

export interface DeadTimeModel {
  /** No pulse is kept sooner than this after a delivered onset (refractory or maxRate, whole ticks). */
  deadS: number;
  absoluteS: number;
  recoveryS: number;
  /**
   * An onset sits at the start of its tick, on average half a tick before the candidate
   * that made it; the next interval is measured from the onset, so in candidate time
   * intervals are half a tick shorter than the rules alone say.
   */
  halfTickS: number;
}

export function deadTimeModel(c: Compiled): DeadTimeModel {
  return {
    deadS: Math.max(c.refractoryTicks, c.maxRateTicks, c.absoluteS * c.clockHz) / c.clockHz,
    absoluteS: c.absoluteS,
    recoveryS: c.recoveryS,
    halfTickS: 0.5 / c.clockHz,
  };
}

/** Stationary kept rate at constant candidate rate λ. */
export function keptRate(lambda: number, m: DeadTimeModel): number {
  if (!(lambda > 0)) return 0;
  return 1 / (m.deadS - m.halfTickS + waitAfterDead(lambda, m));
}

/** Mean wait for a kept candidate once the dead time is over: 1/λ, or ∫ exp(−λ·H(s)) ds with recovery. */
function waitAfterDead(lambda: number, m: DeadTimeModel): number {
  const r = m.recoveryS;
  if (r === 0) return 1 / lambda;
  // Recovery already reached when the dead time ends (a maxRate dead time can outlast the absolute period).
  const a = Math.exp(-Math.max(0, m.deadS - m.absoluteS) / r);
  const H = (s: number) => s - r * a * (1 - Math.exp(-s / r));
  const S = 30 * r;
  const n = 4000;
  const h = S / n;
  let sum = 1 + Math.exp(-lambda * H(S));
  for (let i = 1; i < n; i++) sum += (i % 2 ? 4 : 2) * Math.exp(-lambda * H(i * h));
  const body = (sum * h) / 3;
  // Beyond 30 recovery constants h(x) = 1 to within e^-30, so the tail is exponential.
  const tail = Math.exp(-lambda * H(S)) / lambda;
  return body + tail;
}

/** ν(λ) as a function, tabulated when recovery makes each value costly. */
export function keptRateFn(c: Compiled): (lambda: number) => number {
  const model = deadTimeModel(c);
  if (model.recoveryS === 0) return (l) => keptRate(l, model);
  const n = 512;
  const top = c.ceilingHz;
  const table = new Float64Array(n + 1);
  for (let i = 0; i <= n; i++) table[i] = keptRate((top * i) / n, model);
  return (l) => {
    if (!(l > 0)) return 0;
    const x = Math.min(l / top, 1) * n;
    const i = Math.min(Math.floor(x), n - 1);
    const f = x - i;
    return table[i] * (1 - f) + table[i + 1] * f;
  };
}

/** Quasi-static expected delivered count per trial: Simpson's rule of ν(ρ(t)) per segment. */
export function expectedDeliveredCount(c: Compiled): number {
  const nu = keptRateFn(c);
  let total = 0;
  for (let i = 0; i < c.nSegments; i++) {
    const dur = c.starts[i + 1] - c.starts[i];
    if (c.kind[i] === 0) {
      const rate = (local: number) => c.c0[i] + c.c1[i] * (local / c.c2[i]);
      total += simpson((x) => nu(rate(x)), 0, dur, 16);
      continue;
    }
    const rate = (local: number) => c.c0[i] + c.c1[i] * Math.sin(c.c2[i] * local + c.c3[i]);
    // Whole cycles integrate to the same value: one period times their number, then the rest.
    const period = (2 * Math.PI) / c.c2[i];
    const whole = Math.floor(dur / period);
    if (whole > 0) total += whole * simpson((x) => nu(rate(x)), 0, period, 64);
    total += simpson((x) => nu(rate(x)), whole * period, dur, 64);
  }
  return total;
}

function simpson(f: (x: number) => number, a: number, b: number, n: number): number {
  if (!(b > a)) return 0;
  const h = (b - a) / n;
  let sum = f(a) + f(b);
  for (let k = 1; k < n; k++) sum += (k % 2 ? 4 : 2) * f(a + k * h);
  return (sum * h) / 3;
}
