import { rateAt } from '@/lib/schedule/envelope';
import { boundaries, type EditorDoc } from './doc';
import { findKnot, listKnots } from './knots';
import { addPoint, type AddPointResult } from './points';
import { select } from './select';

/** Keyboard selection: the knot before/after the last selected one (or the first/last). */
export function selectStep(doc: EditorDoc, by: -1 | 1, extend: boolean): EditorDoc {
  const knots = listKnots(doc.segments);
  if (knots.length === 0) return doc;
  const selected = new Set(doc.selection);
  let idx = -1;
  knots.forEach((k, i) => {
    if (selected.has(k.key) && (idx === -1 || (by > 0 ? i > idx : i < idx))) idx = i;
  });
  const next = idx === -1 ? (by > 0 ? 0 : knots.length - 1) : Math.min(knots.length - 1, Math.max(0, idx + by));
  return select(doc, [knots[next].key], extend ? 'add' : 'replace');
}

/**
 * Keyboard add: a point halfway between the (last) selected knot and the next boundary,
 * on the envelope, so the shape does not change until the user nudges it.
 */
export function addPointAfterSelection(doc: EditorDoc): AddPointResult {
  const starts = boundaries(doc.segments);
  const last = [...doc.selection].map((k) => findKnot(doc.segments, k, starts)).filter((k) => k !== null).sort((a, b) => b.t - a.t)[0];
  const b = last ? last.boundary : 0;
  if (b >= doc.segments.length) return { doc, added: null, reason: 'Select a point that has a segment after it.' };
  const t = (starts[b] + starts[b + 1]) / 2;
  return addPoint(doc, t, rateAt(doc.segments, t));
}
