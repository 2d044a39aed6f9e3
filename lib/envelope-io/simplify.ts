import simplify from 'simplify-js';
import type { TracePoint } from './trace';

export interface SimplifyReport {
  /** Breakpoints before simplification. */
  from: number;
  /** Breakpoints kept. */
  to: number;
  /** Largest vertical distance, in Hz, between an original point and the simplified trace. */
  maxRateErrorHz: number;
}

/**
 * Reduces a long trace to at most `maxPoints` breakpoints with the
 * Ramer–Douglas–Peucker method (simplify-js implements it).
 *
 * simplify-js measures perpendicular distance in the plane, while the error that matters
 * here is vertical (Hz at a given time). Rate is scaled to [0, 1] and time is stretched so
 * that the shortest time step spans 10 rate-spans: every chord is then flat enough that
 * perpendicular distance is within 0.5 % of vertical distance. (The stretch is capped so
 * the whole trace stays within 10^6 units, where doubles still resolve 10^-9.) With
 * time and rate scaled alike instead, the near-vertical edges of a burst let points sit
 * close to a chord yet far from it in Hz. We pass `highQuality = true`: without it
 * simplify-js first runs a radial-distance filter, which is not part of RDP and, in these
 * stretched units, would drop nothing useful. The tolerance is bisected for the smallest
 * value that meets the point budget.
 *
 * The reported error is measured afterwards, vertically, against every original point.
 */
export function simplifyTrace(points: readonly TracePoint[], maxPoints: number): { points: TracePoint[]; report: SimplifyReport } {
  const from = points.length;
  if (maxPoints < 2) throw new RangeError('maxPoints must be at least 2');
  if (from <= maxPoints) return { points: [...points], report: { from, to: from, maxRateErrorHz: 0 } };

  const t0 = points[0].t;
  let dtMin = Infinity;
  let hzMin = Infinity;
  let hzMax = -Infinity;
  for (let i = 0; i < from; i++) {
    const p = points[i];
    if (p.hz < hzMin) hzMin = p.hz;
    if (p.hz > hzMax) hzMax = p.hz;
    const dt = i > 0 ? p.t - points[i - 1].t : 0;
    if (dt > 0 && dt < dtMin) dtMin = dt;
  }
  const hzSpan = hzMax - hzMin || 1;
  const tSpan = points[from - 1].t - t0;
  const xScale = Math.min(10 / (Number.isFinite(dtMin) ? dtMin : 1), tSpan > 0 ? 1e6 / tSpan : 1);
  // Carry the index so the kept points map back to the originals without float round-trips.
  const scaled = points.map((p, i) => ({ x: (p.t - t0) * xScale, y: (p.hz - hzMin) / hzSpan, i }));

  const run = (tolerance: number) => simplify(scaled, tolerance, true) as typeof scaled;
  // Every point is within one rate-span of any chord, so this tolerance keeps only the ends.
  let hi = 1.001;
  // Below 10^-8 of the rate span, differences are float noise: collinear points go.
  let lo = 1e-8;
  let best = run(lo);
  if (best.length > maxPoints) {
    best = run(hi);
    for (let iter = 0; iter < 40 && hi - lo > 1e-12; iter++) {
      const mid = (lo + hi) / 2;
      const kept = run(mid);
      if (kept.length <= maxPoints) {
        best = kept;
        hi = mid;
        // Within 2 % of the budget the error is as good as it will get; each pass costs a full RDP run.
        if (kept.length >= maxPoints * 0.98) break;
      } else {
        lo = mid;
      }
    }
  }
  const kept = best.map((s) => points[s.i]);
  return { points: kept, report: { from, to: kept.length, maxRateErrorHz: maxRateError(points, kept) } };
}

/**
 * Largest |rate| distance from each original point to the simplified trace at the same
 * time. Where the simplified trace steps (two points at one time) it covers every rate
 * between the two, so a point inside the step has zero error.
 */
export function maxRateError(original: readonly TracePoint[], kept: readonly TracePoint[]): number {
  let worst = 0;
  let seg = 0; // first kept segment that can still cover the current time (times are non-decreasing)
  for (const p of original) {
    while (seg < kept.length - 2 && kept[seg + 1].t < p.t) seg++;
    let best = Infinity;
    for (let s = seg; s < kept.length - 1 && kept[s].t <= p.t; s++) {
      const a = kept[s];
      const b = kept[s + 1];
      if (b.t < p.t) continue;
      let d: number;
      if (b.t === a.t) {
        const lo = Math.min(a.hz, b.hz);
        const hi = Math.max(a.hz, b.hz);
        d = p.hz < lo ? lo - p.hz : p.hz > hi ? p.hz - hi : 0;
      } else {
        d = Math.abs(p.hz - (a.hz + ((b.hz - a.hz) * (p.t - a.t)) / (b.t - a.t)));
      }
      if (d < best) best = d;
    }
    if (best !== Infinity && best > worst) worst = best;
  }
  return worst;
}
