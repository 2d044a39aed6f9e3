import { describe, expect, it } from 'vitest';
import { boundaries, hzToY, knotAtPointer, listKnots, timeToX, visibleBoundaries } from '@/components/canvas/model';
import { hold, ramp } from './helpers';

const vp = { t0: 0, t1: 10, hz0: 0, hz1: 100 };
const rect = { x: 50, y: 10, width: 1000, height: 400 };

describe('knotAtPointer', () => {
  const segs = [ramp(2, 0, 10), hold(3, 50), ramp(5, 20, 40)];
  const starts = boundaries(segs);

  it('finds the knot under the pointer and nothing in empty space', () => {
    const x = timeToX(vp, rect, 2);
    expect(knotAtPointer(segs, starts, vp, rect, x + 3, hzToY(vp, rect, 10) - 2)?.key).toBe('1<');
    expect(knotAtPointer(segs, starts, vp, rect, x, hzToY(vp, rect, 50))?.key).toBe('1>');
    expect(knotAtPointer(segs, starts, vp, rect, timeToX(vp, rect, 1), hzToY(vp, rect, 5))).toBeNull();
  });

  it('on 5,000 knots, agrees with a search through all of them', () => {
    const many = Array.from({ length: 5000 }, (_, i) => ramp(0.002, (i * 7) % 90, ((i + 1) * 7) % 90));
    const st = boundaries(many);
    const zoomed = { t0: 3, t1: 3.2, hz0: 0, hz1: 100 };
    for (const [t, hz] of [
      [3.05, 20],
      [3.1, 63],
      [3.137, 40],
    ]) {
      const x = timeToX(zoomed, rect, t);
      const y = hzToY(zoomed, rect, hz);
      const got = knotAtPointer(many, st, zoomed, rect, x, y, 8);
      let best: string | null = null;
      let bestD = 64;
      for (const k of listKnots(many)) {
        const d = (timeToX(zoomed, rect, k.t) - x) ** 2 + (hzToY(zoomed, rect, k.hz) - y) ** 2;
        if (d <= bestD) {
          bestD = d;
          best = k.key;
        }
      }
      expect(got?.key ?? null).toBe(best);
    }
  });

  it('lists only boundaries around the visible range', () => {
    const many = Array.from({ length: 5000 }, () => hold(1, 5));
    const r = visibleBoundaries(boundaries(many), { t0: 100.5, t1: 120.5, hz0: 0, hz1: 10 });
    expect(r).toEqual({ from: 100, to: 121 });
  });
});
