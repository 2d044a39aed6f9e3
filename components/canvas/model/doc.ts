import type { Segment } from '@/lib/schedule/spec';
import { segmentRate, segmentStarts } from '@/lib/schedule/envelope';

/**
 * The editor's document: the spec's envelope segments, unchanged in shape, plus the
 * selected breakpoints. Everything the editor does is a pure function from one doc to
 * the next, so the canvas, the table and the tests share the same code.
 */
export interface EditorDoc {
  readonly segments: readonly Segment[];
  /** Knot keys (see knots.ts), sorted, no duplicates. */
  readonly selection: readonly string[];
}

/**
 * Shortest segment a drag or a click may create. Shorter segments are legal in a spec
 * (an import may bring them) and are left alone; this only stops a drag from collapsing one.
 */
export const MIN_SEGMENT_S = 0.001;

export function createDoc(segments: readonly Segment[], selection: readonly string[] = []): EditorDoc {
  return { segments, selection: sortedUnique(selection) };
}

/**
 * Times are sums of user-typed decimals; rounding to a nanosecond stops 0.1 + 0.2
 * from reaching the table as 0.30000000000000004 without touching any real value.
 */
export function roundS(x: number): number {
  return Math.round(x * 1e9) / 1e9;
}

/** Rate at the very end of segment `seg` (what a following segment continues from). */
export function endRate(seg: Segment): number {
  return seg.kind === 'ramp' ? seg.toHz : segmentRate(seg, seg.durationS);
}

export function startRate(seg: Segment): number {
  return seg.kind === 'ramp' ? seg.fromHz : segmentRate(seg, 0);
}

export function boundaries(segments: readonly Segment[]): Float64Array {
  return segmentStarts(segments);
}

export function totalDuration(segments: readonly Segment[]): number {
  let t = 0;
  for (const s of segments) t += s.durationS;
  return t;
}

export function sortedUnique(keys: readonly string[]): string[] {
  return [...new Set(keys)].sort();
}
