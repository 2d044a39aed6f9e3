import type { RampSegment, Segment, SineSegment } from '@/lib/schedule/spec';
import { boundaries, createDoc, endRate, startRate, type EditorDoc } from './doc';
import { knotKey, normalizeSelection, parseKnotKey } from './knots';

/**
 * What the numeric table and the canvas share: the table shows `doc.segments` as rows
 * and writes edits back through these functions, the canvas writes through points.ts;
 * both read the same doc, so each shows the other's edits.
 */

/** One table row: the segment plus its (derived, read-only) start time. */
export interface SegmentRow {
  index: number;
  startS: number;
  segment: Segment;
}

export function segmentRows(doc: EditorDoc, from = 0, count = doc.segments.length): SegmentRow[] {
  const starts = boundaries(doc.segments);
  const out: SegmentRow[] = [];
  for (let i = Math.max(0, from); i < Math.min(doc.segments.length, from + count); i++) {
    out.push({ index: i, startS: starts[i], segment: doc.segments[i] });
  }
  return out;
}

/** Writes one edited row back. Returns the same doc when nothing changed. */
export function updateSegment(doc: EditorDoc, index: number, segment: Segment): EditorDoc {
  const old = doc.segments[index];
  if (!old || sameSegment(old, segment)) return doc;
  const next = doc.segments.slice();
  next[index] = segment;
  return createDoc(next, normalizeSelection(next, doc.selection));
}

/** Writes a block of rows (a table page) back. */
export function updateSegments(doc: EditorDoc, from: number, segments: readonly Segment[]): EditorDoc {
  let next = doc;
  segments.forEach((s, k) => {
    next = updateSegment(next, from + k, s);
  });
  return next;
}

/** Adds a hold after row `index` (or at the start for -1), continuing from that row's end rate. */
export function insertSegmentAfter(doc: EditorDoc, index: number, durationS = 1): EditorDoc {
  const prev = doc.segments[index];
  const rate = prev ? endRate(prev) : doc.segments[0] ? startRate(doc.segments[0]) : 0;
  const seg: RampSegment = { kind: 'ramp', durationS, fromHz: rate, toHz: rate };
  const next = [...doc.segments.slice(0, index + 1), seg, ...doc.segments.slice(index + 1)];
  return createDoc(next, shiftSelection(doc.selection, index + 1, +1, next));
}

export function removeSegment(doc: EditorDoc, index: number): EditorDoc {
  if (doc.segments.length <= 1 || !doc.segments[index]) return doc;
  const next = [...doc.segments.slice(0, index), ...doc.segments.slice(index + 1)];
  return createDoc(next, shiftSelection(doc.selection, index + 1, -1, next));
}

/** Switches a row between ramp and sine, keeping its duration and average level. */
export function convertSegment(seg: Segment, kind: Segment['kind']): Segment {
  if (seg.kind === kind) return seg;
  if (seg.kind === 'ramp') {
    const sine: SineSegment = { kind: 'sine', durationS: seg.durationS, meanHz: (seg.fromHz + seg.toHz) / 2, depthHz: 0, freqHz: 1, phaseDeg: 0 };
    return sine;
  }
  return { kind: 'ramp', durationS: seg.durationS, fromHz: seg.meanHz, toHz: seg.meanHz };
}

/** Index of the first segment that touches any selected knot (the table scrolls there). */
export function firstSelectedSegment(doc: EditorDoc): number | null {
  let best: number | null = null;
  for (const key of doc.selection) {
    const p = parseKnotKey(key);
    if (!p) continue;
    const i = p.side === 'in' ? p.boundary - 1 : Math.min(p.boundary, doc.segments.length - 1);
    if (best === null || i < best) best = i;
  }
  return best;
}

function shiftSelection(selection: readonly string[], fromBoundary: number, by: number, segments: readonly Segment[]): string[] {
  const keys: string[] = [];
  for (const key of selection) {
    const p = parseKnotKey(key);
    if (!p) continue;
    if (p.boundary < fromBoundary) keys.push(key);
    else if (p.boundary + by >= fromBoundary) keys.push(knotKey(p.boundary + by, p.side));
  }
  return normalizeSelection(segments, keys);
}

function sameSegment(a: Segment, b: Segment): boolean {
  if (a.kind !== b.kind || a.durationS !== b.durationS) return false;
  if (a.kind === 'ramp' && b.kind === 'ramp') return a.fromHz === b.fromHz && a.toHz === b.toHz;
  if (a.kind === 'sine' && b.kind === 'sine') return a.meanHz === b.meanHz && a.depthHz === b.depthHz && a.freqHz === b.freqHz && a.phaseDeg === b.phaseDeg;
  return false;
}
