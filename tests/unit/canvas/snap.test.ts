import { describe, expect, it } from 'vitest';
import { snap, snapPoint } from '@/components/canvas/model';

describe('snap', () => {
  it('rounds to the nearest grid multiple', () => {
    expect(snap(0.26, 0.1)).toBe(0.3);
    expect(snap(0.24, 0.1)).toBe(0.2);
    expect(snap(17.4, 5)).toBe(15);
    expect(snap(17.6, 5)).toBe(20);
    expect(snap(-0.26, 0.1)).toBe(-0.3);
  });

  it('gives clean decimals, not 0.30000000000000004', () => {
    expect(snap(0.3, 0.1)).toBe(0.3);
    expect(String(snap(0.7, 0.1))).toBe('0.7');
    expect(snap(1.15, 0.05)).toBe(1.15);
  });

  it('leaves the value alone when the step is 0 or negative', () => {
    expect(snap(0.1234, 0)).toBe(0.1234);
    expect(snap(0.1234, -1)).toBe(0.1234);
  });

  it('snapPoint applies only when the grid is on', () => {
    expect(snapPoint(1.23, 7.7, { enabled: true, timeS: 0.5, rateHz: 2 })).toEqual({ t: 1, hz: 8 });
    expect(snapPoint(1.23, 7.7, { enabled: false, timeS: 0.5, rateHz: 2 })).toEqual({ t: 1.23, hz: 7.7 });
  });
});
