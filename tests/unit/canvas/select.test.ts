import { describe, expect, it } from 'vitest';
import { knotsInBox, movePoints, select, selectAll, selectInBox } from '@/components/canvas/model';
import { doc, hold, ramp, sine } from './helpers';

const d = doc(ramp(2, 0, 10), ramp(2, 10, 30), hold(2, 5), sine(2, 20, 5, 1), ramp(2, 7, 7));

describe('box selection', () => {
  it('finds the knots inside the box, corners in any order', () => {
    // knots: 0> (0,0) 1 (2,10) 2< (4,30) 2> (4,5) 3< (6,5) 4> (8,7) 5< (10,7)
    expect(knotsInBox(d, { t0: 1, t1: 4.5, hz0: 0, hz1: 40 })).toEqual(['1', '2<', '2>']);
    expect(knotsInBox(d, { t0: 4.5, t1: 1, hz0: 40, hz1: 0 })).toEqual(['1', '2<', '2>']);
    expect(knotsInBox(d, { t0: 1, t1: 4.5, hz0: 8, hz1: 12 })).toEqual(['1']);
    expect(knotsInBox(d, { t0: -1, t1: 20, hz0: -1, hz1: 100 })).toHaveLength(7);
    expect(knotsInBox(d, { t0: 6.1, t1: 7.9, hz0: 0, hz1: 100 })).toEqual([]);
  });

  it('replaces, adds to or toggles the selection', () => {
    let s = selectInBox(d, { t0: 1, t1: 3, hz0: 0, hz1: 50 });
    expect(s.selection).toEqual(['1']);
    s = selectInBox(s, { t0: 9, t1: 11, hz0: 0, hz1: 50 }, 'add');
    expect(s.selection).toEqual(['1', '5<']);
    s = select(s, ['1', '0>'], 'toggle');
    expect(s.selection).toEqual(['0>', '5<']);
    expect(selectAll(d).selection).toHaveLength(7);
  });

  it('moves the boxed points together', () => {
    const s = selectInBox(d, { t0: 1, t1: 4.5, hz0: 0, hz1: 40 });
    const moved = movePoints(s, s.selection, { dt: 0.5, dHz: 1 });
    expect(moved.segments.slice(0, 3)).toEqual([ramp(2.5, 0, 11), ramp(2, 11, 31), ramp(1.5, 6, 5)]);
  });
});
