/**
 * What the sweep carries between blocks of a trial (state), what it counts, and where
 * it puts kept onsets. Kept apart from the algorithm in sweep.ts.
 */
import type { Compiled } from './compile';
import { BLOCK_SECONDS } from './seeds';

export interface SweepCounts {
  candidates: number;
  thinned: number;
  refractory: number;
  clock: number;
  maxRate: number;
  window: number;
  kept: number;
}

export const zeroCounts = (): SweepCounts => ({
  candidates: 0,
  thinned: 0,
  refractory: 0,
  clock: 0,
  maxRate: 0,
  window: 0,
  kept: 0,
});

export function addCounts(into: SweepCounts, from: SweepCounts): void {
  into.candidates += from.candidates;
  into.thinned += from.thinned;
  into.refractory += from.refractory;
  into.clock += from.clock;
  into.maxRate += from.maxRate;
  into.window += from.window;
  into.kept += from.kept;
}

/** Everything the sweep remembers from earlier pulses of the same trial. */
export interface SweepState {
  /** Sample of the last kept onset, −Infinity before the first. */
  lastSample: number;
  /** Last min(kept, windowMax) kept samples, oldest first at `head` (ring buffer). */
  ring: Float64Array;
  ringCount: number;
  ringHead: number;
}

export function freshState(c: Compiled): SweepState {
  return { lastSample: -Infinity, ring: new Float64Array(c.windowMax), ringCount: 0, ringHead: 0 };
}

/** State as it would be after the given kept samples (ascending), e.g. read from a file. */
export function stateFromSamples(c: Compiled, samples: ArrayLike<number>): SweepState {
  const st = freshState(c);
  const n = samples.length;
  if (n > 0) st.lastSample = samples[n - 1];
  const k = Math.min(n, c.windowMax);
  for (let i = 0; i < k; i++) st.ring[i] = samples[n - k + i];
  st.ringCount = k;
  st.ringHead = 0;
  return st;
}

/** Growable buffer of kept samples, reused block after block. */
export class SampleBuffer {
  data: Float64Array = new Float64Array(4096);
  length = 0;
  push(s: number): void {
    this.reserve(1);
    this.data[this.length++] = s;
  }
  /** Make room for `extra` more values; returns the (possibly new) backing array. */
  reserve(extra: number): Float64Array {
    if (this.length + extra > this.data.length) {
      const next = new Float64Array(Math.max(this.data.length * 2, this.length + extra));
      next.set(this.data.subarray(0, this.length));
      this.data = next;
    }
    return this.data;
  }
  clear(): void {
    this.length = 0;
  }
}

export function blockSampleRange(c: Compiled, block: number): { from: number; to: number } {
  return {
    from: block * BLOCK_SECONDS * c.clockHz,
    to: Math.min((block + 1) * BLOCK_SECONDS * c.clockHz, c.endSample),
  };
}
