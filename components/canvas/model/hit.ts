import type { Segment } from '@/lib/schedule/spec';
import { boundaryAtOrAfter, listKnots, type Knot } from './knots';
import { hzToY, timeToX, xToTime, type PlotRect, type Viewport } from './viewport';

/**
 * The knot under the pointer, within `radiusPx`. Knots are not Konva nodes (5,000 of
 * them would make every frame slow), so hits are found here: a binary search for the
 * boundaries near the pointer's time, then distance in pixels.
 */
export function knotAtPointer(
  segments: readonly Segment[],
  starts: Float64Array,
  vp: Viewport,
  rect: PlotRect,
  x: number,
  y: number,
  radiusPx = 8,
): Knot | null {
  const tLo = xToTime(vp, rect, x - radiusPx);
  const tHi = xToTime(vp, rect, x + radiusPx);
  const bFrom = boundaryAtOrAfter(starts, tLo);
  let bTo = boundaryAtOrAfter(starts, tHi);
  if (bTo >= starts.length || starts[bTo] > tHi) bTo--;
  if (bTo < bFrom) return null;
  let best: Knot | null = null;
  let bestD = radiusPx * radiusPx;
  // Past ~40 boundaries in 16 px the knots overlap anyway: check the closest ones only.
  const span = bTo - bFrom;
  const from = span > 40 ? Math.max(bFrom, boundaryAtOrAfter(starts, xToTime(vp, rect, x)) - 20) : bFrom;
  const to = span > 40 ? Math.min(bTo, from + 40) : bTo;
  for (const k of listKnots(segments, from, to, starts)) {
    const dx = timeToX(vp, rect, k.t) - x;
    const dy = hzToY(vp, rect, k.hz) - y;
    const d = dx * dx + dy * dy;
    if (d <= bestD) {
      best = k;
      bestD = d;
    }
  }
  return best;
}

/** Boundaries [from, to] whose knots fall in the visible time range, padded by one on each side so lines leave the edge. */
export function visibleBoundaries(starts: Float64Array, vp: Viewport): { from: number; to: number } {
  const from = Math.max(0, boundaryAtOrAfter(starts, vp.t0) - 1);
  const to = Math.min(starts.length - 1, boundaryAtOrAfter(starts, vp.t1));
  return { from, to };
}
