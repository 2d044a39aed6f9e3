import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { judge, type RowStatus } from '@/lib/safety/status';

// Pulseloom's rule (issue 5): beyond the hard limit fails, beyond the warning level
// warns, a value at the limit is within it; no limit set means nothing is checked.

describe('judge, maximum limits', () => {
  const limit = { warn: 20, hard: 30 };
  it.each<[number, RowStatus, number]>([
    [10, 'pass', 20],
    [20, 'pass', 10],
    [25, 'warn', 5],
    [30, 'warn', 0],
    [31, 'fail', -1],
  ])('%s against warn 20 / hard 30 is %s with margin %s', (value, status, margin) => {
    expect(judge(value, limit, 'max')).toEqual({ status, margin });
  });

  it('works with only one level set', () => {
    expect(judge(31, { hard: 30 }, 'max').status).toBe('fail');
    expect(judge(29, { hard: 30 }, 'max').status).toBe('pass');
    expect(judge(31, { warn: 30 }, 'max')).toEqual({ status: 'warn', margin: -1 });
  });

  it('does not fail a value that equals the limit up to floating-point rounding', () => {
    expect(0.1 * 3).not.toBe(0.3);
    expect(judge(0.1 * 3, { hard: 0.3 }, 'max').status).toBe('pass');
    expect(judge(0.3001, { hard: 0.3 }, 'max').status).toBe('fail');
  });
});

describe('judge, minimum limits', () => {
  const limit = { warn: 5, hard: 2 };
  it.each<[number, RowStatus, number]>([
    [10, 'pass', 8],
    [5, 'pass', 3],
    [3, 'warn', 1],
    [2, 'warn', 0],
    [1, 'fail', -1],
  ])('%s against warn 5 / hard 2 is %s with margin %s', (value, status, margin) => {
    expect(judge(value, limit, 'min')).toEqual({ status, margin });
  });
});

describe('judge, missing pieces', () => {
  it('reports not-set when the profile leaves the limit empty', () => {
    expect(judge(1e9, undefined, 'max')).toEqual({ status: 'not-set', margin: null });
    expect(judge(1e9, {}, 'max')).toEqual({ status: 'not-set', margin: null });
  });

  it('never passes a value it could not compute when a limit is set', () => {
    expect(judge(null, { hard: 1 }, 'max')).toEqual({ status: 'warn', margin: null });
    expect(judge(null, { hard: 1 }, 'max', 'fail')).toEqual({ status: 'fail', margin: null });
    expect(judge(Number.NaN, { hard: 1 }, 'max').status).toBe('warn');
  });
});

describe('judge, ordering (property)', () => {
  const rank: Record<RowStatus, number> = { pass: 0, warn: 1, fail: 2, info: -1, 'not-set': -1 };
  it('never gets better as a value moves further past a maximum', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 1e6, noNaN: true }),
        fc.double({ min: 0, max: 1e6, noNaN: true }),
        fc.double({ min: 0, max: 1e3, noNaN: true }),
        fc.double({ min: 0, max: 1e3, noNaN: true }),
        (a, b, warn, extra) => {
          const limit = { warn, hard: warn + extra };
          const [lo, hi] = a <= b ? [a, b] : [b, a];
          expect(rank[judge(hi, limit, 'max').status]).toBeGreaterThanOrEqual(rank[judge(lo, limit, 'max').status]);
          expect(rank[judge(lo, limit, 'min').status]).toBeGreaterThanOrEqual(rank[judge(hi, limit, 'min').status]);
        },
      ),
    );
  });
});
