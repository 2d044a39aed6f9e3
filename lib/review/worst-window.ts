// The busiest stretch of a schedule, counted the way the engine's window cap counts it:
// pulses a and b share a window of length w when b − a < w (a half-open window
// [t, t + w) can start at a). Onsets are clock samples, so comparisons are exact
// integers; `windowSamples` converts a length in seconds the same way the engine does.

/** A window of `seconds` in whole clock samples (rounded up, ignoring float dust like 0.1 × 30 000). */
export function windowSamples(seconds: number, clockHz: number): number {
  return Math.ceil(seconds * clockHz - 1e-9);
}

/**
 * Most onsets inside any window of `width`, for one trial's onsets in ascending order.
 * Two pointers: `lo` trails `hi` so that onsets[hi] − onsets[lo] < width; each index
 * moves forward only, so the sweep is linear.
 */
export function worstWindowCount(onsets: ArrayLike<number>, width: number): number {
  if (!(width > 0)) return 0;
  let best = 0;
  let lo = 0;
  for (let hi = 0; hi < onsets.length; hi++) {
    while (onsets[hi]! - onsets[lo]! >= width) lo++;
    if (hi - lo + 1 > best) best = hi - lo + 1;
  }
  return best;
}

/**
 * The same count fed one onset at a time, so a long schedule never has to sit in
 * memory: only the onsets of the current window are kept (a ring that grows as needed).
 * Call `reset()` between trials: windows never span two trials.
 */
export class WindowCounter {
  private ring = new Float64Array(64);
  private head = 0;
  private size = 0;
  best = 0;

  constructor(private readonly width: number) {}

  push(onset: number): void {
    if (!(this.width > 0)) return;
    while (this.size > 0 && onset - this.ring[this.head]! >= this.width) {
      this.head = (this.head + 1) % this.ring.length;
      this.size--;
    }
    if (this.size === this.ring.length) this.grow();
    this.ring[(this.head + this.size) % this.ring.length] = onset;
    this.size++;
    if (this.size > this.best) this.best = this.size;
  }

  reset(): void {
    this.head = 0;
    this.size = 0;
  }

  private grow(): void {
    const next = new Float64Array(this.ring.length * 2);
    for (let i = 0; i < this.size; i++) next[i] = this.ring[(this.head + i) % this.ring.length]!;
    this.ring = next;
    this.head = 0;
  }
}
