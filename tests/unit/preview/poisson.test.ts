import { describe, expect, it } from 'vitest';
import { createRequire } from 'node:module';
import { poissonInterval95 } from '@/lib/preview';

// jstat ships no type declarations; load it untyped rather than declare a module for the whole project.
const jStat = createRequire(import.meta.url)('jstat') as { chisquare: { inv(p: number, dof: number): number } };

/** Exact (Garwood) limits from chi-square quantiles, computed by an outside package. */
function exact(k: number) {
  return {
    lower: k === 0 ? 0 : jStat.chisquare.inv(0.025, 2 * k) / 2,
    upper: jStat.chisquare.inv(0.975, 2 * k + 2) / 2,
  };
}

describe('poissonInterval95', () => {
  it('is exact for an empty bin', () => {
    const r = poissonInterval95(0);
    expect(r.lower).toBe(0);
    expect(r.upper).toBeCloseTo(exact(0).upper, 6);
    expect(r.upper).toBeCloseTo(3.6889, 3);
  });

  it('matches the exact limits up to 30 counts, and stays within 0.05 % above (Byar)', () => {
    for (const k of [1, 2, 3, 4, 5, 8, 13, 30, 31, 45, 100, 1000, 20000]) {
      const r = poissonInterval95(k);
      const e = exact(k);
      const tol = k <= 30 ? 1e-6 : 5e-4;
      expect(Math.abs(r.lower - e.lower) / e.lower).toBeLessThan(tol);
      expect(Math.abs(r.upper - e.upper) / e.upper).toBeLessThan(tol);
      expect(r.lower).toBeLessThan(k);
      expect(r.upper).toBeGreaterThan(k);
    }
  });
});
