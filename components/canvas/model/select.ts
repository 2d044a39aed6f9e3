import { boundaries, createDoc, sortedUnique, type EditorDoc } from './doc';
import { boundaryAtOrAfter, listKnots } from './knots';

export interface Box {
  t0: number;
  t1: number;
  hz0: number;
  hz1: number;
}

export type SelectMode = 'replace' | 'add' | 'toggle';

/** Knots inside a box drawn on the canvas (corners in any order). Binary search keeps it cheap on long envelopes. */
export function knotsInBox(doc: EditorDoc, box: Box): string[] {
  const tLo = Math.min(box.t0, box.t1);
  const tHi = Math.max(box.t0, box.t1);
  const hzLo = Math.min(box.hz0, box.hz1);
  const hzHi = Math.max(box.hz0, box.hz1);
  const starts = boundaries(doc.segments);
  const bFrom = boundaryAtOrAfter(starts, tLo);
  let bTo = boundaryAtOrAfter(starts, tHi);
  if (bTo >= starts.length || starts[bTo] > tHi) bTo--;
  return listKnots(doc.segments, bFrom, bTo, starts)
    .filter((k) => k.hz >= hzLo && k.hz <= hzHi)
    .map((k) => k.key);
}

export function select(doc: EditorDoc, keys: readonly string[], mode: SelectMode = 'replace'): EditorDoc {
  let selection: string[];
  if (mode === 'replace') selection = [...keys];
  else if (mode === 'add') selection = [...doc.selection, ...keys];
  else {
    const now = new Set(doc.selection);
    for (const k of keys) {
      if (now.has(k)) now.delete(k);
      else now.add(k);
    }
    selection = [...now];
  }
  const next = sortedUnique(selection);
  if (next.length === doc.selection.length && next.every((k, i) => k === doc.selection[i])) return doc;
  return createDoc(doc.segments, next);
}

export function selectInBox(doc: EditorDoc, box: Box, mode: SelectMode = 'replace'): EditorDoc {
  return select(doc, knotsInBox(doc, box), mode);
}

export function selectAll(doc: EditorDoc): EditorDoc {
  return select(doc, listKnots(doc.segments).map((k) => k.key));
}
