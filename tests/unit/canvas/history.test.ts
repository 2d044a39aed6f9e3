import { describe, expect, it } from 'vitest';
import { addPoint, canRedo, canUndo, commit, createHistory, dragPoints, endGesture, redo, setSelection, undo, type History } from '@/components/canvas/model';
import { doc, hold } from './helpers';

describe('history', () => {
  it('undoes and redoes an edit, and a new edit clears redo', () => {
    let h = createHistory(doc(hold(10, 5)));
    const first = h.present;
    h = commit(h, addPoint(h.present, 4, 20).doc);
    const second = h.present;
    h = undo(h);
    expect(h.present).toBe(first);
    expect(canRedo(h)).toBe(true);
    h = redo(h);
    expect(h.present).toBe(second);
    h = undo(h);
    h = commit(h, addPoint(h.present, 6, 1).doc);
    expect(canRedo(h)).toBe(false);
  });

  it('keeps at least 100 steps: 150 edits undo back to the start', () => {
    let h = createHistory(doc(hold(200, 5)));
    const start = h.present;
    const states = [start];
    for (let k = 1; k <= 150; k++) {
      h = commit(h, addPoint(h.present, k, k % 40).doc);
      states.push(h.present);
    }
    expect(h.present.segments).toHaveLength(151);
    for (let k = 149; k >= 0; k--) {
      h = undo(h);
      expect(h.present).toBe(states[k]);
    }
    expect(canUndo(h)).toBe(false);
    for (let k = 1; k <= 150; k++) h = redo(h);
    expect(h.present).toBe(states[150]);
  });

  it('drops the oldest steps past its limit', () => {
    let h = createHistory(doc(hold(500, 5)), 120);
    for (let k = 1; k <= 130; k++) h = commit(h, addPoint(h.present, k, 1).doc);
    expect(h.past).toHaveLength(120);
    let undone = 0;
    while (canUndo(h)) {
      h = undo(h);
      undone++;
    }
    expect(undone).toBe(120);
    expect(h.present.segments).toHaveLength(11);
  });

  it('coalesces a whole drag (many frames, one tag) into one step', () => {
    const anchor = addPoint(doc(hold(10, 5)), 4, 20).doc;
    let h = createHistory(anchor);
    for (let frame = 0; frame < 60; frame++) {
      h = commit(h, dragPoints(anchor, ['1'], '1', { t: 4 + frame * 0.01, hz: 20 + frame }).doc, 'drag-1');
    }
    expect(h.past).toHaveLength(1);
    h = endGesture(h);
    h = commit(h, dragPoints(h.present, ['1'], '1', { t: 5, hz: 1 }).doc, 'drag-1');
    expect(h.past).toHaveLength(2);
    h = undo(undo(h));
    expect(h.present).toBe(anchor);
  });

  it('does not record selection changes as steps', () => {
    let h = createHistory(doc(hold(10, 5)));
    h = setSelection(h, ['0>']);
    expect(canUndo(h)).toBe(false);
    expect(h.present.selection).toEqual(['0>']);
  });

  it('ignores a commit of the same doc', () => {
    const h: History = createHistory(doc(hold(10, 5)));
    expect(commit(h, h.present)).toBe(h);
  });
});
