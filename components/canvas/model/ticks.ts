/**
 * Axis ticks at 1, 2 or 5 × 10^k, about `target` of them over [min, max]; used by the
 * editor's axes and the preview plots so they read alike at every zoom.
 */
export function niceTicks(min: number, max: number, target = 6): { step: number; ticks: number[] } {
  if (!(max > min) || !Number.isFinite(min) || !Number.isFinite(max)) return { step: 0, ticks: Number.isFinite(min) ? [min] : [] };
  const raw = (max - min) / Math.max(1, target);
  const mag = 10 ** Math.floor(Math.log10(raw));
  const norm = raw / mag;
  const step = (norm < 1.5 ? 1 : norm < 3.5 ? 2 : norm < 7.5 ? 5 : 10) * mag;
  const ticks: number[] = [];
  const first = Math.ceil(min / step - 1e-9);
  for (let k = first; k * step <= max + step * 1e-9; k++) ticks.push(Number((k * step).toPrecision(12)));
  return { step, ticks };
}

/** Tick label with just enough decimals for the step. */
export function formatTick(value: number, step: number): string {
  const decimals = step > 0 ? Math.max(0, -Math.floor(Math.log10(step) + 1e-9)) : 0;
  return value.toFixed(Math.min(decimals, 6));
}
