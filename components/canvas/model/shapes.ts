import type { Segment } from '@/lib/schedule/spec';
import { segmentRate } from '@/lib/schedule/envelope';
import { boundaries, createDoc, endRate, roundS, type EditorDoc } from './doc';
import { listKnots } from './knots';

/** The exact shapes a span can be replaced with. A hold is a ramp with equal ends. */
export type Shape =
  | { kind: 'hold'; rateHz: number }
  | { kind: 'ramp'; fromHz: number; toHz: number }
  | { kind: 'sine'; meanHz: number; depthHz: number; freqHz: number; phaseDeg: number };

export type ShapeKind = Shape['kind'];

export interface Span {
  startS: number;
  endS: number;
}

export function shapeSegment(shape: Shape, durationS: number): Segment {
  switch (shape.kind) {
    case 'hold':
      return { kind: 'ramp', durationS, fromHz: shape.rateHz, toHz: shape.rateHz };
    case 'ramp':
      return { kind: 'ramp', durationS, fromHz: shape.fromHz, toHz: shape.toHz };
    case 'sine':
      return { kind: 'sine', durationS, meanHz: shape.meanHz, depthHz: shape.depthHz, freqHz: shape.freqHz, phaseDeg: shape.phaseDeg };
  }
}

/**
 * The part of `seg` between local times a and b, as an exact segment: a ramp keeps its
 * line, a sine keeps its parameters with the phase advanced to where the part begins
 * (phase is measured from each segment's own start).
 */
export function segmentPart(seg: Segment, a: number, b: number): Segment {
  const durationS = roundS(b - a);
  if (seg.kind === 'ramp') {
    return { kind: 'ramp', durationS, fromHz: a === 0 ? seg.fromHz : segmentRate(seg, a), toHz: b === seg.durationS ? seg.toHz : segmentRate(seg, b) };
  }
  if (a === 0) return { ...seg, durationS };
  const phase = seg.phaseDeg + 360 * seg.freqHz * a;
  return { ...seg, durationS, phaseDeg: Number((((phase % 360) + 360) % 360).toPrecision(12)) };
}

/** Segments covering [0, t) of the envelope, cutting the one that straddles t. */
function before(segs: readonly Segment[], starts: Float64Array, t: number): Segment[] {
  const out: Segment[] = [];
  for (let i = 0; i < segs.length && starts[i] < t; i++) {
    out.push(starts[i + 1] <= t ? segs[i] : segmentPart(segs[i], 0, t - starts[i]));
  }
  return out;
}

/** Segments covering [t, T), cutting the one that straddles t. */
function after(segs: readonly Segment[], starts: Float64Array, t: number): Segment[] {
  const out: Segment[] = [];
  for (let i = 0; i < segs.length; i++) {
    if (starts[i + 1] <= t) continue;
    out.push(starts[i] >= t ? segs[i] : segmentPart(segs[i], t - starts[i], segs[i].durationS));
  }
  return out;
}

/**
 * Replaces [startS, endS] with one exact segment of the given shape; the segments on
 * either side are cut exactly. A span starting past the end is reached by holding the
 * last rate; a span reaching past the end lengthens the envelope. The new segment's
 * breakpoints become the selection.
 */
export function insertShape(doc: EditorDoc, shape: Shape, span: Span): EditorDoc {
  const startS = roundS(Math.max(0, Math.min(span.startS, span.endS)));
  const endS = roundS(Math.max(span.startS, span.endS));
  if (!(endS > startS)) return doc;
  const segs = doc.segments;
  const starts = boundaries(segs);
  const T = starts[segs.length];

  const head = before(segs, starts, startS);
  if (startS > T) {
    const rate = segs.length ? endRate(segs[segs.length - 1]) : 0;
    head.push({ kind: 'ramp', durationS: roundS(startS - T), fromHz: rate, toHz: rate });
  }
  const tail = after(segs, starts, endS);
  const next = [...head, shapeSegment(shape, roundS(endS - startS)), ...tail];
  const b = head.length;
  // Only the new segment's own ends: at a step, the neighbour's side stays unselected.
  const selection = listKnots(next, b, b + 1)
    .filter((k) => (k.boundary === b ? k.side !== 'in' : k.side !== 'out'))
    .map((k) => k.key);
  return createDoc(next, selection);
}
