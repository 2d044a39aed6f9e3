import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { rateAt } from '@/lib/schedule/envelope';
import { addPoint, deletePoints, dragPoints, listKnots, movePoints, nudge, MIN_SEGMENT_S } from '@/components/canvas/model';
import { doc, hold, probeTimes, ramp, sine } from './helpers';

const grid = { enabled: true, timeS: 0.5, rateHz: 5 };

describe('addPoint', () => {
  it('splits the ramp under the click into two ramps meeting at the new point', () => {
    const r = addPoint(doc(ramp(10, 5, 40)), 4, 60);
    expect(r.added).toBe('1');
    expect(r.doc.segments).toEqual([ramp(4, 5, 60), ramp(6, 60, 40)]);
    expect(r.doc.selection).toEqual(['1']);
  });

  it('leaves the envelope unchanged when the new point lies on it', () => {
    const before = doc(ramp(10, 5, 40), sine(20, 20, 15, 2), hold(5, 12));
    const t = 3.3;
    const after = addPoint(before, t, rateAt(before.segments, t)).doc;
    expect(after.segments).toHaveLength(4);
    for (const p of probeTimes(35)) expect(rateAt(after.segments, p)).toBeCloseTo(rateAt(before.segments, p), 9);
  });

  it('snaps the new point to the grid', () => {
    const r = addPoint(doc(hold(10, 20)), 3.26, 31, grid);
    expect(r.doc.segments).toEqual([ramp(3.5, 20, 30), ramp(6.5, 30, 20)]);
  });

  it('extends the envelope from its last rate when clicked past the end', () => {
    const r = addPoint(doc(ramp(10, 5, 40)), 12, 0);
    expect(r.doc.segments).toEqual([ramp(10, 5, 40), ramp(2, 40, 0)]);
    expect(r.added).toBe('2<');
  });

  it('continues from the value where a sine ends', () => {
    const r = addPoint(doc(sine(1, 20, 10, 1, 90)), 2, 0);
    expect(r.doc.segments[1]).toMatchObject({ kind: 'ramp', durationS: 1, toHz: 0 });
    expect((r.doc.segments[1] as { fromHz: number }).fromHz).toBeCloseTo(30, 9);
  });

  it('starts an empty envelope with a hold', () => {
    const r = addPoint(doc(), 5, 10);
    expect(r.doc.segments).toEqual([hold(5, 10)]);
  });

  it('refuses inside a sine, at 0 s and on top of a point, with a reason', () => {
    const d = doc(hold(5, 10), sine(10, 20, 5, 1));
    for (const [t, hz] of [
      [7, 10],
      [0, 5],
      [5 + MIN_SEGMENT_S / 2, 10],
    ]) {
      const r = addPoint(d, t, hz);
      expect(r.added).toBeNull();
      expect(r.doc).toBe(d);
      expect(r.reason).toMatch(/\w/);
    }
  });

  it('clamps a negative rate to 0', () => {
    expect(addPoint(doc(hold(10, 5)), 5, -3).doc.segments[0]).toEqual(ramp(5, 5, 0));
  });
});

describe('movePoints', () => {
  const d = doc(ramp(2, 0, 10), ramp(3, 10, 30), hold(5, 30));

  it('moves a joint in time and rate, changing both neighbours', () => {
    const out = movePoints(d, ['1'], { dt: 0.5, dHz: 5 });
    expect(out.segments).toEqual([ramp(2.5, 0, 15), ramp(2.5, 15, 30), hold(5, 30)]);
  });

  it('keeps a moved point from crossing its neighbour', () => {
    const out = movePoints(d, ['1'], { dt: 100, dHz: 0 });
    expect(out.segments[1].durationS).toBeCloseTo(MIN_SEGMENT_S, 12);
    expect(out.segments[0].durationS).toBeCloseTo(5 - MIN_SEGMENT_S, 12);
    const left = movePoints(d, ['1'], { dt: -100, dHz: 0 });
    expect(left.segments[0].durationS).toBeCloseTo(MIN_SEGMENT_S, 12);
  });

  it('never moves the start point in time', () => {
    const out = movePoints(d, ['0>'], { dt: 1, dHz: 4 });
    expect(out.segments[0]).toEqual(ramp(2, 4, 10));
  });

  it('moves the end point, lengthening the last segment', () => {
    expect(movePoints(d, ['3<'], { dt: 2, dHz: 0 }).segments[2]).toEqual(hold(7, 30));
  });

  it('moves a group rigidly: inner gaps kept, outer gaps limit the shift, rates stop at 0 together', () => {
    const out = movePoints(d, ['1', '2'], { dt: 10, dHz: -50 });
    const [a, b, c] = out.segments;
    expect(b.durationS).toBe(3);
    expect(c.durationS).toBeCloseTo(MIN_SEGMENT_S, 12);
    expect(a.durationS).toBeCloseTo(2 + 5 - MIN_SEGMENT_S, 9);
    // the group moves down by 10 (the lower point hits 0), the other keeps its offset
    expect(b).toMatchObject({ fromHz: 0, toHz: 20 });
  });

  it('moves only one side of a step, keeping the other', () => {
    const step = doc(hold(2, 10), hold(2, 30));
    expect(listKnots(step.segments).map((k) => k.key)).toEqual(['0>', '1<', '1>', '2<']);
    const out = movePoints(step, ['1>'], { dt: 0, dHz: -5 });
    expect(out.segments).toEqual([hold(2, 10), ramp(2, 25, 30)]);
  });

  it('renames the selection when a step closes', () => {
    const step = { ...doc(hold(2, 10), hold(2, 30)), selection: ['1>'] };
    const out = movePoints(step, ['1>'], { dt: 0, dHz: -20 });
    expect(out.segments).toEqual([hold(2, 10), ramp(2, 10, 30)]);
    expect(out.selection).toEqual(['1']);
  });

  it('keeps a sine exact when its boundary moves (only its duration changes)', () => {
    const s = sine(4, 20, 5, 2, 30);
    const out = movePoints(doc(ramp(2, 0, 10), s), ['1<'], { dt: 1, dHz: 0 });
    expect(out.segments[1]).toEqual({ ...s, durationS: 3 });
  });
});

describe('dragPoints', () => {
  const anchor = doc(ramp(2, 0, 10), ramp(3, 10, 30), hold(5, 30));

  it('puts the dragged point on the snapped pointer and moves the rest by the same amount', () => {
    const r = dragPoints(anchor, ['1', '2'], '1', { t: 2.8, hz: 13 }, grid);
    expect(r).toMatchObject({ t: 3, hz: 15 });
    expect(r.doc.segments).toEqual([ramp(3, 0, 15), ramp(3, 15, 35), ramp(4, 35, 30)]);
  });

  it('does not accumulate snapping over many frames (always from the anchor)', () => {
    let last = anchor;
    for (let k = 0; k <= 40; k++) last = dragPoints(anchor, ['1'], '1', { t: 2 + k * 0.01, hz: 10 + k * 0.1 }, grid).doc;
    expect(last.segments[0]).toEqual(ramp(2.5, 0, 15));
  });

  it('reports the time and rate shown while dragging', () => {
    const r = dragPoints(anchor, ['1'], '1', { t: 3.33, hz: 12.34 });
    expect(r.t).toBeCloseTo(3.33, 9);
    expect(r.hz).toBeCloseTo(12.34, 9);
  });
});

describe('deletePoints', () => {
  it('joins the two ramps at a deleted joint', () => {
    const out = deletePoints(doc(ramp(4, 5, 60), ramp(6, 60, 40)), ['1']);
    expect(out.doc.segments).toEqual([ramp(10, 5, 40)]);
    expect(out.kept).toEqual([]);
  });

  it('removes a step when either of its sides is deleted', () => {
    expect(deletePoints(doc(hold(2, 10), hold(3, 30)), ['1<']).doc.segments).toEqual([ramp(5, 10, 30)]);
    expect(deletePoints(doc(hold(2, 10), hold(3, 30)), ['1>', '1<']).doc.segments).toEqual([ramp(5, 10, 30)]);
  });

  it('drops the last ramp when the end point is deleted', () => {
    expect(deletePoints(doc(hold(2, 10), ramp(3, 10, 30)), ['2<']).doc.segments).toEqual([hold(2, 10)]);
  });

  it('keeps the start point, sine ends and the last segment, saying why', () => {
    const d = doc(hold(2, 10), sine(3, 20, 5, 1), hold(1, 3));
    const out = deletePoints(d, ['0>', '1<', '2>']);
    expect(out.doc).toBe(d);
    expect(out.kept.map((k) => k.key).sort()).toEqual(['0>', '1<', '2>']);
    for (const k of out.kept) expect(k.reason).toMatch(/\w/);
    const single = doc(hold(2, 10));
    expect(deletePoints(single, ['1<']).doc).toBe(single);
  });

  it('deletes several points at once, keeping the envelope between the survivors', () => {
    const d = doc(ramp(1, 0, 10), ramp(1, 10, 20), ramp(1, 20, 5), ramp(1, 5, 8));
    const out = deletePoints(d, ['1', '3']);
    expect(out.doc.segments).toEqual([ramp(2, 0, 20), ramp(2, 20, 8)]);
  });

  it('keeps a refused point selected under its new number after a merge before it', () => {
    const d = { ...doc(ramp(1, 0, 10), ramp(1, 10, 20), sine(2, 20, 5, 1), hold(1, 4)), selection: ['1', '3>'] };
    const out = deletePoints(d, ['1', '3>']);
    expect(out.doc.segments).toHaveLength(3);
    expect(out.doc.selection).toEqual(['2>']);
  });
});

describe('nudge', () => {
  const d = doc(ramp(2, 0, 10), hold(3, 10));
  it('moves by one grid step, ten with Shift', () => {
    expect(nudge(d, ['1'], 'right', false, grid).segments.map((s) => s.durationS)).toEqual([2.5, 2.5]);
    expect(nudge(d, ['1'], 'up', false, grid).segments[0]).toEqual(ramp(2, 0, 15));
    expect(nudge(d, ['1'], 'down', true, grid).segments[0]).toEqual(ramp(2, 0, 0));
    expect(nudge(d, ['1'], 'left', true, { timeS: 0.1, rateHz: 1 }).segments[0].durationS).toBe(1);
  });
});

describe('model invariants (property-based)', () => {
  const segArb = fc.oneof(
    fc.record({ kind: fc.constant('ramp' as const), durationS: fc.double({ min: 0.01, max: 20, noNaN: true }), fromHz: fc.double({ min: 0, max: 100, noNaN: true }), toHz: fc.double({ min: 0, max: 100, noNaN: true }) }),
    fc.record({
      kind: fc.constant('sine' as const),
      durationS: fc.double({ min: 0.01, max: 20, noNaN: true }),
      meanHz: fc.double({ min: 20, max: 50, noNaN: true }),
      depthHz: fc.double({ min: 0, max: 20, noNaN: true }),
      freqHz: fc.double({ min: 0.1, max: 5, noNaN: true }),
      phaseDeg: fc.double({ min: -360, max: 360, noNaN: true }),
    }),
  );

  it('moving points keeps every duration positive, boundaries ordered and rates ≥ 0', () => {
    fc.assert(
      fc.property(fc.array(segArb, { minLength: 1, maxLength: 8 }), fc.double({ min: -50, max: 50, noNaN: true }), fc.double({ min: -200, max: 200, noNaN: true }), fc.integer({ min: 0, max: 1000 }), (segs, dt, dHz, pick) => {
        const d = doc(...segs);
        const knots = listKnots(d.segments);
        if (knots.length === 0) return;
        const keys = knots.filter((_, i) => (pick >> i % 10) & 1 || i === pick % knots.length).map((k) => k.key);
        const out = movePoints(d, keys, { dt, dHz });
        expect(out.segments).toHaveLength(segs.length);
        for (const s of out.segments) {
          expect(s.durationS).toBeGreaterThan(0);
          if (s.kind === 'ramp') {
            expect(s.fromHz).toBeGreaterThanOrEqual(0);
            expect(s.toHz).toBeGreaterThanOrEqual(0);
          }
        }
        out.segments.forEach((s, i) => {
          if (s.kind === 'sine') expect({ ...s, durationS: 0 }).toEqual({ ...segs[i], durationS: 0 });
        });
      }),
      { numRuns: 300 },
    );
  });
});
