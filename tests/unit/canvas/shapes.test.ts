import { describe, expect, it } from 'vitest';
import { envelopeDuration, rateAt } from '@/lib/schedule/envelope';
import type { Shape } from '@/components/canvas/model';
import { insertShape, segmentPart } from '@/components/canvas/model';
import { doc, hold, probeTimes, ramp, sine } from './helpers';

/** The shape's own formula, written out here rather than taken from the model. */
function shapeRate(shape: Shape, local: number, duration: number): number {
  if (shape.kind === 'hold') return shape.rateHz;
  if (shape.kind === 'ramp') return shape.fromHz + ((shape.toHz - shape.fromHz) * local) / duration;
  return shape.meanHz + shape.depthHz * Math.sin(2 * Math.PI * shape.freqHz * local + (shape.phaseDeg * Math.PI) / 180);
}

const base = doc(ramp(10, 5, 40), sine(20, 20, 15, 2, 30), hold(10, 12));

describe('insertShape', () => {
  const cases: [string, Shape][] = [
    ['hold', { kind: 'hold', rateHz: 25 }],
    ['ramp', { kind: 'ramp', fromHz: 3, toHz: 70 }],
    ['sine', { kind: 'sine', meanHz: 30, depthHz: 10, freqHz: 0.7, phaseDeg: 45 }],
  ];

  for (const [name, shape] of cases) {
    it(`${name}: exact inside the span, envelope untouched outside, across cut ramps and sines`, () => {
      const span = { startS: 6.25, endS: 17.5 };
      const out = insertShape(base, shape, span);
      expect(envelopeDuration(out.segments)).toBeCloseTo(40, 9);
      for (const t of probeTimes(40)) {
        const expected = t >= span.startS && t < span.endS ? shapeRate(shape, t - span.startS, span.endS - span.startS) : rateAt(base.segments, t);
        expect(rateAt(out.segments, t)).toBeCloseTo(expected, 8);
      }
    });
  }

  it('a sine stays one sine segment with the given parameters, not a polyline', () => {
    const shape: Shape = { kind: 'sine', meanHz: 30, depthHz: 10, freqHz: 0.7, phaseDeg: 45 };
    const out = insertShape(base, shape, { startS: 2, endS: 8 });
    expect(out.segments.map((s) => s.kind)).toEqual(['ramp', 'sine', 'ramp', 'sine', 'ramp']);
    expect(out.segments[1]).toEqual({ kind: 'sine', durationS: 6, meanHz: 30, depthHz: 10, freqHz: 0.7, phaseDeg: 45 });
    expect(out.segments.filter((s) => s.kind === 'sine')).toHaveLength(2);
  });

  it('a cut sine keeps its waveform: same parameters, phase advanced to the cut', () => {
    const s = sine(20, 20, 15, 2, 30);
    const tail = segmentPart(s, 0.3, 20);
    expect(tail).toMatchObject({ kind: 'sine', meanHz: 20, depthHz: 15, freqHz: 2 });
    // 30° + 360° × 2 Hz × 0.3 s = 246°
    expect((tail as { phaseDeg: number }).phaseDeg).toBeCloseTo(246, 9);
  });

  it('selects the new segment’s breakpoints', () => {
    const out = insertShape(doc(hold(10, 5)), { kind: 'hold', rateHz: 30 }, { startS: 2, endS: 4 });
    expect(out.segments).toEqual([hold(2, 5), hold(2, 30), hold(6, 5)]);
    expect(out.selection).toEqual(['1>', '2<']);
  });

  it('past the end: holds the last rate up to the span, then adds the shape', () => {
    const out = insertShape(doc(ramp(4, 0, 8)), { kind: 'ramp', fromHz: 8, toHz: 0 }, { startS: 6, endS: 9 });
    expect(out.segments).toEqual([ramp(4, 0, 8), hold(2, 8), ramp(3, 8, 0)]);
  });

  it('over the whole envelope: replaces it', () => {
    const out = insertShape(base, { kind: 'hold', rateHz: 1 }, { startS: 0, endS: 40 });
    expect(out.segments).toEqual([hold(40, 1)]);
  });

  it('accepts the span corners in either order and ignores an empty span', () => {
    const a = insertShape(base, { kind: 'hold', rateHz: 1 }, { startS: 5, endS: 3 });
    const b = insertShape(base, { kind: 'hold', rateHz: 1 }, { startS: 3, endS: 5 });
    expect(a.segments).toEqual(b.segments);
    expect(insertShape(base, { kind: 'hold', rateHz: 1 }, { startS: 3, endS: 3 })).toBe(base);
  });
});
