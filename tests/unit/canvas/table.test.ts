import { describe, expect, it } from 'vitest';
import {
  addPoint,
  convertSegment,
  findKnot,
  firstSelectedSegment,
  insertSegmentAfter,
  listKnots,
  movePoints,
  removeSegment,
  segmentRows,
  updateSegment,
  updateSegments,
} from '@/components/canvas/model';
import { doc, hold, ramp, sine } from './helpers';

/**
 * The table and the canvas both write through the model and both read the doc: these
 * tests run the same functions the two components call.
 */
describe('table ↔ canvas sync', () => {
  const d = doc(ramp(10, 5, 40), sine(20, 20, 15, 2), hold(5, 12));

  it('rows carry each segment with its start time', () => {
    expect(segmentRows(d).map((r) => [r.index, r.startS, r.segment.kind])).toEqual([
      [0, 0, 'ramp'],
      [1, 10, 'sine'],
      [2, 30, 'ramp'],
    ]);
    expect(segmentRows(d, 1, 1)).toHaveLength(1);
  });

  it('a canvas drag shows up in the rows', () => {
    const dragged = movePoints(addPoint(d, 4, 60).doc, ['1'], { dt: 1, dHz: -10 });
    const rows = segmentRows(dragged);
    expect(rows[0].segment).toEqual(ramp(5, 5, 50));
    expect(rows[1]).toMatchObject({ startS: 5, segment: ramp(5, 50, 40) });
    expect(rows[2].startS).toBe(10);
  });

  it('a row edit shows up as moved knots on the canvas', () => {
    const edited = updateSegment(d, 0, ramp(12, 5, 44));
    expect(findKnot(edited.segments, '1<')).toMatchObject({ t: 12, hz: 44 });
    expect(findKnot(edited.segments, '3<')).toMatchObject({ t: 37, hz: 12 });
    expect(updateSegment(d, 0, ramp(10, 5, 40))).toBe(d);
  });

  it('a page of rows writes back in one go', () => {
    const out = updateSegments(d, 1, [sine(20, 25, 5, 1), hold(5, 13)]);
    expect(out.segments).toEqual([ramp(10, 5, 40), sine(20, 25, 5, 1), hold(5, 13)]);
  });

  it('keeps the selection on the same boundary when a row edit opens a step', () => {
    const joined = { ...doc(ramp(2, 0, 10), ramp(2, 10, 0)), selection: ['1'] };
    const opened = updateSegment(joined, 1, ramp(2, 20, 0));
    expect(opened.selection).toEqual(['1<', '1>']);
  });

  it('adds a row continuing the previous rate, and removes rows', () => {
    const added = insertSegmentAfter(d, 0, 2);
    expect(added.segments[1]).toEqual(hold(2, 40));
    expect(removeSegment(added, 1).segments).toEqual(d.segments);
    const single = doc(hold(1, 1));
    expect(removeSegment(single, 0)).toBe(single);
  });

  it('renumbers the selection when a row is inserted or removed before it', () => {
    const sel = { ...d, selection: ['3<'] };
    expect(insertSegmentAfter(sel, 0).selection).toEqual(['4<']);
    expect(removeSegment(sel, 0).selection).toEqual(['2<']);
  });

  it('switches a row between ramp and sine keeping duration and level', () => {
    expect(convertSegment(ramp(4, 10, 30), 'sine')).toEqual(sine(4, 20, 0, 1, 0));
    expect(convertSegment(sine(4, 20, 5, 1), 'ramp')).toEqual(hold(4, 20));
  });

  it('finds the row of the first selected knot (the table pages there)', () => {
    expect(firstSelectedSegment({ ...d, selection: ['3<'] })).toBe(2);
    expect(firstSelectedSegment({ ...d, selection: ['1<', '2>'] })).toBe(0);
    expect(firstSelectedSegment(d)).toBeNull();
  });

  it('lists knots only at ramp ends', () => {
    expect(listKnots(d.segments).map((k) => k.key)).toEqual(['0>', '1<', '2>', '3<']);
  });
});
