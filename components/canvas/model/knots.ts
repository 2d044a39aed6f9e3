import type { Segment } from '@/lib/schedule/spec';
import { boundaries } from './doc';

/**
 * A knot is a draggable breakpoint: the end of a ramp. Boundary b sits between
 * segment b − 1 (its "in" side) and segment b (its "out" side). When both sides are
 * ramps meeting at the same rate the knot is one joint and moves both; when the
 * rates differ (a step) each side is its own knot at the same time. Sine ends are not
 * knots: a sine is defined by its parameters, not by points.
 *
 * Keys: `7` for a joint, `7<` for an in-side end, `7>` for an out-side end.
 */
export type KnotSide = 'in' | 'out' | 'both';

export interface Knot {
  key: string;
  boundary: number;
  side: KnotSide;
  t: number;
  hz: number;
}

export function knotKey(boundary: number, side: KnotSide): string {
  return side === 'both' ? String(boundary) : `${boundary}${side === 'in' ? '<' : '>'}`;
}

export function parseKnotKey(key: string): { boundary: number; side: KnotSide } | null {
  const m = /^(\d+)([<>]?)$/.exec(key);
  if (!m) return null;
  return { boundary: Number(m[1]), side: m[2] === '<' ? 'in' : m[2] === '>' ? 'out' : 'both' };
}

/** Knots at one boundary, 0 to 2 of them. */
export function knotsAt(segments: readonly Segment[], b: number, t: number): Knot[] {
  const before = b > 0 ? segments[b - 1] : undefined;
  const after = b < segments.length ? segments[b] : undefined;
  const inHz = before?.kind === 'ramp' ? before.toHz : undefined;
  const outHz = after?.kind === 'ramp' ? after.fromHz : undefined;
  if (inHz !== undefined && outHz !== undefined && inHz === outHz) {
    return [{ key: knotKey(b, 'both'), boundary: b, side: 'both', t, hz: inHz }];
  }
  const out: Knot[] = [];
  if (inHz !== undefined) out.push({ key: knotKey(b, 'in'), boundary: b, side: 'in', t, hz: inHz });
  if (outHz !== undefined) out.push({ key: knotKey(b, 'out'), boundary: b, side: 'out', t, hz: outHz });
  return out;
}

/** Knots whose boundaries lie in [bFrom, bTo] (all of them by default), in time order. */
export function listKnots(segments: readonly Segment[], bFrom = 0, bTo = segments.length, starts = boundaries(segments)): Knot[] {
  const out: Knot[] = [];
  for (let b = Math.max(0, bFrom); b <= Math.min(bTo, segments.length); b++) {
    for (const k of knotsAt(segments, b, starts[b])) out.push(k);
  }
  return out;
}

export function findKnot(segments: readonly Segment[], key: string, starts = boundaries(segments)): Knot | null {
  const parsed = parseKnotKey(key);
  if (!parsed || parsed.boundary > segments.length) return null;
  return knotsAt(segments, parsed.boundary, starts[parsed.boundary]).find((k) => k.key === key) ?? null;
}

/** First boundary with time ≥ t (binary search; n + 1 when t is past the end). */
export function boundaryAtOrAfter(starts: Float64Array, t: number): number {
  let lo = 0;
  let hi = starts.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (starts[mid] < t) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/**
 * Keeps a selection pointing at the same boundaries after an edit changed which sides
 * are joined: `3<` becomes `3` once the step closes, `3` becomes `3<`/`3>` once it opens.
 */
export function normalizeSelection(segments: readonly Segment[], keys: readonly string[]): string[] {
  const starts = boundaries(segments);
  const out = new Set<string>();
  for (const key of keys) {
    const parsed = parseKnotKey(key);
    if (!parsed || parsed.boundary > segments.length) continue;
    const here = knotsAt(segments, parsed.boundary, starts[parsed.boundary]);
    const exact = here.find((k) => k.key === key);
    if (exact) out.add(exact.key);
    else if (parsed.side === 'both') here.forEach((k) => out.add(k.key));
    else {
      const joint = here.find((k) => k.side === 'both');
      if (joint) out.add(joint.key);
    }
  }
  return [...out].sort();
}
