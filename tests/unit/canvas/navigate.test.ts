import { describe, expect, it } from 'vitest';
import { rateAt } from '@/lib/schedule/envelope';
import { addPointAfterSelection, selectStep } from '@/components/canvas/model';
import { doc, hold, probeTimes, ramp } from './helpers';

describe('keyboard selection and adding', () => {
  const d = doc(ramp(2, 0, 10), ramp(2, 10, 30), hold(2, 5));

  it('steps through knots in time order', () => {
    let s = selectStep(d, 1, false);
    expect(s.selection).toEqual(['0>']);
    s = selectStep(s, 1, false);
    expect(s.selection).toEqual(['1']);
    s = selectStep(s, 1, true);
    expect(s.selection).toEqual(['1', '2<']);
    expect(selectStep(d, -1, false).selection).toEqual(['3<']);
  });

  it('adds a point halfway to the next boundary without changing the envelope', () => {
    const r = addPointAfterSelection({ ...d, selection: ['1'] });
    expect(r.added).toBe('2');
    expect(r.doc.segments.slice(1, 3)).toEqual([ramp(1, 10, 20), ramp(1, 20, 30)]);
    for (const t of probeTimes(6)) expect(rateAt(r.doc.segments, t)).toBeCloseTo(rateAt(d.segments, t), 9);
  });

  it('says why when there is nothing after the selection', () => {
    const r = addPointAfterSelection({ ...d, selection: ['3<'] });
    expect(r.added).toBeNull();
    expect(r.reason).toMatch(/segment after/);
  });
});
