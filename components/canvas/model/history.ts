import { createDoc, type EditorDoc } from './doc';

/**
 * Undo/redo as snapshots. Docs are immutable and edits copy only the segment array
 * (segment objects are shared), so a snapshot of a 5,000-segment envelope costs one
 * array of pointers.
 */
export interface History {
  readonly past: readonly EditorDoc[];
  readonly present: EditorDoc;
  readonly future: readonly EditorDoc[];
  readonly limit: number;
  /** Tag of the last commit; a commit with the same tag replaces it (one drag = one step). */
  readonly lastTag: string | null;
}

export const HISTORY_LIMIT = 200;

export function createHistory(doc: EditorDoc, limit = HISTORY_LIMIT): History {
  return { past: [], present: doc, future: [], limit, lastTag: null };
}

/**
 * Records an edit. Give the same `tag` to every commit of one gesture (a drag, a run of
 * arrow-key nudges) and they undo as one step.
 */
export function commit(h: History, doc: EditorDoc, tag?: string): History {
  if (doc === h.present) return h;
  if (tag !== undefined && tag === h.lastTag) {
    return { ...h, present: doc, future: [] };
  }
  const past = [...h.past, h.present];
  if (past.length > h.limit) past.splice(0, past.length - h.limit);
  return { ...h, past, present: doc, future: [], lastTag: tag ?? null };
}

/** Selection changes are not edits: they replace the present without an undo step. */
export function setSelection(h: History, selection: readonly string[]): History {
  return { ...h, present: createDoc(h.present.segments, selection) };
}

/** Replaces the present doc without an undo step (selection-only changes from the model). */
export function replacePresent(h: History, doc: EditorDoc): History {
  return doc === h.present ? h : { ...h, present: doc };
}

/** Ends a gesture so the next commit with the same tag starts a new step. */
export function endGesture(h: History): History {
  return h.lastTag === null ? h : { ...h, lastTag: null };
}

export function canUndo(h: History): boolean {
  return h.past.length > 0;
}

export function canRedo(h: History): boolean {
  return h.future.length > 0;
}

export function undo(h: History): History {
  if (!canUndo(h)) return h;
  const previous = h.past[h.past.length - 1];
  return { ...h, past: h.past.slice(0, -1), present: previous, future: [h.present, ...h.future], lastTag: null };
}

export function redo(h: History): History {
  if (!canRedo(h)) return h;
  const [next, ...future] = h.future;
  return { ...h, past: [...h.past, h.present], present: next, future, lastTag: null };
}
