import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { WindowCounter, windowSamples, worstWindowCount } from '@/lib/review/worst-window';

// The reference is the definition itself, counted the slow way: for every onset a, the
// onsets b with a ≤ b < a + w (a window that starts at an onset holds at least as many
// as any other window, so these starts are enough). Same half-open rule as the
// engine's window cap (lib/schedule/sweep.ts: first to last ≥ windowTicks).
function bruteForce(onsets: number[], width: number): number {
  let best = 0;
  for (const a of onsets) {
    const n = onsets.filter((b) => b >= a && b < a + width).length;
    best = Math.max(best, n);
  }
  return best;
}

const sortedOnsets = fc
  .array(fc.integer({ min: 0, max: 5_000 }), { maxLength: 300 })
  .map((xs) => [...new Set(xs)].sort((a, b) => a - b));

describe('worst window', () => {
  it('matches a brute-force count on random onsets', () => {
    fc.assert(
      fc.property(sortedOnsets, fc.integer({ min: 1, max: 2_000 }), (onsets, width) => {
        expect(worstWindowCount(onsets, width)).toBe(bruteForce(onsets, width));
      }),
      { numRuns: 400 },
    );
  });

  it('the streaming counter agrees with the array sweep, trial by trial', () => {
    fc.assert(
      fc.property(fc.array(sortedOnsets, { minLength: 1, maxLength: 4 }), fc.integer({ min: 1, max: 800 }), (trials, width) => {
        const counter = new WindowCounter(width);
        for (const t of trials) {
          counter.reset();
          for (const x of t) counter.push(x);
        }
        const expected = Math.max(0, ...trials.map((t) => bruteForce(t, width)));
        expect(counter.best).toBe(expected);
      }),
      { numRuns: 300 },
    );
  });

  it('treats the window as half-open: two onsets exactly one window apart are not in the same window', () => {
    expect(worstWindowCount([0, 10, 20, 30], 10)).toBe(1);
    expect(worstWindowCount([0, 10, 20, 30], 11)).toBe(2);
    expect(worstWindowCount([0, 10, 20, 30], 31)).toBe(4);
  });

  it('never lets a window span two trials', () => {
    const counter = new WindowCounter(100);
    for (const x of [90, 95, 99]) counter.push(x);
    counter.reset();
    for (const x of [0, 5]) counter.push(x); // a new trial's clock starts again at 0
    expect(counter.best).toBe(3);
  });

  it('counts nothing for an empty schedule or a zero window', () => {
    expect(worstWindowCount([], 10)).toBe(0);
    expect(worstWindowCount([1, 2, 3], 0)).toBe(0);
  });

  it('converts seconds to clock samples like the engine (0.1 s at 30 kHz is 3000 samples, not 3001)', () => {
    // 0.1 × 30 000 is 3000.0000000000005 in binary floating point.
    expect(windowSamples(0.1, 30_000)).toBe(3_000);
    expect(windowSamples(1, 20_000)).toBe(20_000);
    expect(windowSamples(0.00005, 30_000)).toBe(2); // 1.5 samples rounds up
  });
});
