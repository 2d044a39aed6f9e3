import type { RampSegment } from '@/lib/schedule/spec';
import { segmentIndexAt } from '@/lib/schedule/envelope';
import { boundaries, createDoc, endRate, MIN_SEGMENT_S, roundS, type EditorDoc } from './doc';
import { findKnot, knotKey, normalizeSelection, parseKnotKey } from './knots';
import { snapPoint, type SnapGrid } from './snap';

const ramp = (durationS: number, fromHz: number, toHz: number): RampSegment => ({ kind: 'ramp', durationS, fromHz, toHz });

export interface AddPointResult {
  doc: EditorDoc;
  /** Key of the new knot, or null when nothing was added. */
  added: string | null;
  /** Why nothing was added. */
  reason?: string;
}

/**
 * Adds a breakpoint at (t, hz): splits the ramp under t into two ramps meeting there.
 * Past the end, a ramp from the last rate to the new point extends the envelope.
 * Inside a sine nothing happens: a sine is edited through its parameters.
 */
export function addPoint(doc: EditorDoc, tIn: number, hzIn: number, grid?: SnapGrid): AddPointResult {
  const p = snapPoint(tIn, hzIn, grid);
  const t = roundS(p.t);
  const hz = Math.max(0, p.hz);
  const segs = doc.segments;
  const unchanged = (reason: string): AddPointResult => ({ doc, added: null, reason });
  if (!(t > 0)) return unchanged('A breakpoint needs a time after 0 s.');

  if (segs.length === 0) {
    return { doc: createDoc([ramp(t, hz, hz)], ['1<']), added: '1<' };
  }
  const starts = boundaries(segs);
  const end = starts[segs.length];
  if (t >= end) {
    if (t - end < MIN_SEGMENT_S) return unchanged('Too close to the last breakpoint.');
    const last = segs[segs.length - 1];
    const next = [...segs, ramp(roundS(t - end), endRate(last), hz)];
    const key = knotKey(segs.length + 1, 'in');
    return { doc: createDoc(next, [key]), added: key };
  }
  const i = segmentIndexAt(starts, t);
  const seg = segs[i];
  if (seg.kind === 'sine') return unchanged('This time falls inside a sine segment; change its parameters or replace it with a shape.');
  const left = roundS(t - starts[i]);
  const right = roundS(starts[i + 1] - t);
  if (left < MIN_SEGMENT_S || right < MIN_SEGMENT_S) return unchanged('Too close to an existing breakpoint.');
  const next = [...segs.slice(0, i), ramp(left, seg.fromHz, hz), ramp(right, hz, seg.toHz), ...segs.slice(i + 1)];
  const key = knotKey(i + 1, 'both');
  return { doc: createDoc(next, [key]), added: key };
}

export interface MoveDelta {
  dt: number;
  dHz: number;
}

/**
 * Moves knots by (dt, dHz) as a rigid group. Time: boundary 0 stays at 0, and each moved
 * boundary stays at least MIN_SEGMENT_S from an unmoved neighbour (or where it already
 * was, if closer), so points never cross. Rate: the group stops at 0 Hz. Sines keep
 * their parameters; only their durations follow the moved boundaries.
 */
export function movePoints(doc: EditorDoc, keys: readonly string[], delta: MoveDelta): EditorDoc {
  const segs = doc.segments;
  const n = segs.length;
  const parsed = keys.map(parseKnotKey).filter((k): k is NonNullable<typeof k> => k !== null && k.boundary <= n);
  if (parsed.length === 0) return doc;
  const starts = boundaries(segs);

  const moved = new Set(parsed.map((k) => k.boundary).filter((b) => b > 0));
  let dt = Number.isFinite(delta.dt) ? delta.dt : 0;
  for (const b of moved) {
    if (!moved.has(b - 1)) {
      const gap = starts[b] - starts[b - 1];
      dt = Math.max(dt, -(gap - Math.min(MIN_SEGMENT_S, gap)));
    }
    if (b < n && !moved.has(b + 1)) {
      const gap = starts[b + 1] - starts[b];
      dt = Math.min(dt, gap - Math.min(MIN_SEGMENT_S, gap));
    }
  }
  if (moved.size === 0) dt = 0;

  // Which ramp ends change rate: a joint moves both sides.
  const inSides = new Set<number>();
  const outSides = new Set<number>();
  for (const k of parsed) {
    if (k.side !== 'out' && segs[k.boundary - 1]?.kind === 'ramp') inSides.add(k.boundary);
    if (k.side !== 'in' && segs[k.boundary]?.kind === 'ramp') outSides.add(k.boundary);
  }
  let dHz = Number.isFinite(delta.dHz) ? delta.dHz : 0;
  for (const b of inSides) dHz = Math.max(dHz, -(segs[b - 1] as RampSegment).toHz);
  for (const b of outSides) dHz = Math.max(dHz, -(segs[b] as RampSegment).fromHz);
  if (dt === 0 && dHz === 0) return doc;

  const time = (b: number) => (moved.has(b) ? roundS(starts[b] + dt) : starts[b]);
  const touched = new Set<number>();
  for (const b of moved) {
    touched.add(b - 1);
    if (b < n) touched.add(b);
  }
  for (const b of inSides) touched.add(b - 1);
  for (const b of outSides) touched.add(b);

  const next = segs.slice();
  for (const i of touched) {
    const seg = segs[i];
    const durationS = dt !== 0 && (moved.has(i) || moved.has(i + 1)) ? roundS(time(i + 1) - time(i)) : seg.durationS;
    if (seg.kind === 'ramp') {
      next[i] = {
        ...seg,
        durationS,
        fromHz: outSides.has(i) ? cleanHz(seg.fromHz + dHz) : seg.fromHz,
        toHz: inSides.has(i + 1) ? cleanHz(seg.toHz + dHz) : seg.toHz,
      };
    } else if (durationS !== seg.durationS) {
      next[i] = { ...seg, durationS };
    }
  }
  return createDoc(next, normalizeSelection(next, doc.selection));
}

/** Rates are typed in the table with a few decimals; keep drag arithmetic from adding noise digits. */
function cleanHz(x: number): number {
  return Math.max(0, Number(x.toPrecision(12)));
}

/**
 * One drag frame: the pointer is at (t, hz) and `primary` follows it (snapped to the
 * grid); the rest of `keys` move by the same amount. Always computed from the doc at the
 * start of the drag, so snapping never accumulates.
 */
export function dragPoints(
  anchor: EditorDoc,
  keys: readonly string[],
  primary: string,
  pointer: { t: number; hz: number },
  grid?: SnapGrid,
): { doc: EditorDoc; t: number; hz: number } {
  const starts = boundaries(anchor.segments);
  const knot = findKnot(anchor.segments, primary, starts);
  if (!knot) return { doc: anchor, t: pointer.t, hz: pointer.hz };
  const target = snapPoint(pointer.t, pointer.hz, grid);
  const doc = movePoints(anchor, keys, { dt: target.t - knot.t, dHz: target.hz - knot.hz });
  const moved = findKnot(doc.segments, primary) ?? findKnotAtBoundary(doc, knot.boundary);
  return { doc, t: moved?.t ?? knot.t, hz: moved?.hz ?? knot.hz };
}

function findKnotAtBoundary(doc: EditorDoc, b: number) {
  const key = normalizeSelection(doc.segments, [knotKey(b, 'both')])[0];
  return key ? findKnot(doc.segments, key) : null;
}

export type NudgeDirection = 'left' | 'right' | 'up' | 'down';

/** Arrow keys: one grid step, ten with Shift. */
export function nudge(doc: EditorDoc, keys: readonly string[], direction: NudgeDirection, big: boolean, grid: Pick<SnapGrid, 'timeS' | 'rateHz'>): EditorDoc {
  const factor = big ? 10 : 1;
  const dt = direction === 'left' ? -grid.timeS : direction === 'right' ? grid.timeS : 0;
  const dHz = direction === 'down' ? -grid.rateHz : direction === 'up' ? grid.rateHz : 0;
  return movePoints(doc, keys, { dt: dt * factor, dHz: dHz * factor });
}

export interface DeleteResult {
  doc: EditorDoc;
  /** Knots that could not be removed, with the reason (shown to the user). */
  kept: { key: string; reason: string }[];
}

/**
 * Removes breakpoints. Inside the envelope, the two ramps meeting at the boundary become
 * one ramp from the first's start to the second's end (so deleting either side of a step
 * removes the step). The last point removes the last ramp. The start point stays (the
 * envelope begins at 0 s), as do ends touching a sine, and the last remaining segment.
 */
export function deletePoints(doc: EditorDoc, keys: readonly string[]): DeleteResult {
  const kept: DeleteResult['kept'] = [];
  const byBoundary = new Map<number, string>();
  for (const key of keys) {
    const p = parseKnotKey(key);
    if (p && p.boundary <= doc.segments.length && !byBoundary.has(p.boundary)) byBoundary.set(p.boundary, key);
  }
  const next = doc.segments.slice();
  // Highest boundary first, so a merge never renumbers one still to be processed;
  // knots already kept are renumbered by hand to stay selected.
  const stay: { boundary: number; key: string }[] = [];
  const keep = (b: number, key: string, reason: string) => {
    kept.push({ key, reason });
    stay.push({ boundary: b, key });
  };
  for (const b of [...byBoundary.keys()].sort((x, y) => y - x)) {
    const key = byBoundary.get(b)!;
    const before = next[b - 1];
    const after = next[b];
    if (b === 0) {
      keep(b, key, 'The envelope starts at 0 s; its first point cannot be removed.');
    } else if (next.length === 1) {
      keep(b, key, 'The envelope needs at least one segment.');
    } else if (b === next.length) {
      if (before.kind === 'ramp') next.pop();
      else keep(b, key, 'This end belongs to a sine segment.');
    } else if (before?.kind === 'ramp' && after?.kind === 'ramp') {
      next.splice(b - 1, 2, ramp(roundS(before.durationS + after.durationS), before.fromHz, after.toHz));
      for (const s of stay) if (s.boundary > b) s.boundary--;
    } else {
      keep(b, key, 'This point joins a sine segment; remove or replace the sine instead.');
    }
  }
  if (next.length === doc.segments.length) return { doc, kept };
  const selection = stay.map((s) => {
    const side = parseKnotKey(s.key)!.side;
    return knotKey(s.boundary, side);
  });
  return { doc: createDoc(next, normalizeSelection(next, selection)), kept };
}
