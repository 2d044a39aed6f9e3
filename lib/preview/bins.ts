/** 1, 2 or 5 × 10^k nearest above `raw`: bin widths a reader can take in at a glance. */
export function niceStep(raw: number): number {
  if (!(raw > 0) || !Number.isFinite(raw)) return 1;
  const mag = 10 ** Math.floor(Math.log10(raw));
  const norm = raw / mag;
  const step = (norm <= 1 ? 1 : norm <= 2 ? 2 : norm <= 5 ? 5 : 10) * mag;
  return Number(step.toPrecision(12));
}

/** Counts of `values` in [k·width, (k+1)·width) for k = 0 … bins − 1; values past the last bin are counted apart. */
export function histogram(values: Iterable<number>, width: number, bins: number): { counts: number[]; over: number } {
  const counts = new Array<number>(bins).fill(0);
  let over = 0;
  for (const v of values) {
    const k = Math.floor(v / width);
    if (k >= bins) over++;
    else if (k >= 0) counts[k]++;
  }
  return { counts, over };
}
