import { describe, expect, it } from 'vitest';
import { fitView, formatTick, hzToY, niceTicks, panTime, timeToX, xToTime, yToHz, zoomTime } from '@/components/canvas/model';
import { hold, ramp } from './helpers';

describe('viewport', () => {
  const vp = { t0: 0, t1: 10, hz0: 0, hz1: 100 };
  const rect = { x: 50, y: 10, width: 500, height: 200 };

  it('maps time and rate to pixels and back', () => {
    expect(timeToX(vp, rect, 5)).toBe(300);
    expect(xToTime(vp, rect, 300)).toBe(5);
    expect(hzToY(vp, rect, 0)).toBe(210);
    expect(hzToY(vp, rect, 100)).toBe(10);
    expect(yToHz(vp, rect, 110)).toBe(50);
  });

  it('zooms about the pointer and pans in time', () => {
    const z = zoomTime(vp, 2, 8);
    expect(z.t1 - z.t0).toBeCloseTo(5, 12);
    expect((8 - z.t0) / (z.t1 - z.t0)).toBeCloseTo(0.8, 12);
    expect(panTime(vp, 3)).toMatchObject({ t0: 3, t1: 13 });
    expect(panTime(vp, -100).t0).toBeCloseTo(-2.5, 12);
  });

  it('fits the envelope, the ceiling and the cap', () => {
    const f = fitView([ramp(10, 0, 40), hold(10, 40)], 100, 120);
    expect(f.t0).toBeLessThanOrEqual(0);
    expect(f.t1).toBeGreaterThanOrEqual(20);
    expect(f.hz1).toBeGreaterThanOrEqual(120);
  });
});

describe('niceTicks', () => {
  it('steps by 1, 2 or 5 × 10^k and adapts to the span', () => {
    expect(niceTicks(0, 10, 5)).toEqual({ step: 2, ticks: [0, 2, 4, 6, 8, 10] });
    expect(niceTicks(0, 1, 5).step).toBe(0.2);
    expect(niceTicks(3.21, 3.29, 4).ticks).toEqual([3.22, 3.24, 3.26, 3.28]);
    expect(niceTicks(0, 3600, 6).step).toBe(500);
  });

  it('labels with the decimals the step needs', () => {
    expect(formatTick(0.4, 0.2)).toBe('0.4');
    expect(formatTick(3.22, 0.02)).toBe('3.22');
    expect(formatTick(500, 500)).toBe('500');
  });
});
