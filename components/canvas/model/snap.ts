/** The grid the user sets; steps ≤ 0 switch snapping off on that axis. */
export interface SnapGrid {
  enabled: boolean;
  timeS: number;
  rateHz: number;
}

export const DEFAULT_GRID: SnapGrid = { enabled: true, timeS: 0.1, rateHz: 1 };

/**
 * Nearest multiple of `step`. The result goes through toPrecision(12) so 3 × 0.1 reads
 * back as 0.3: grid values end up in the spec and in the table, where noise digits
 * would look like user error.
 */
export function snap(value: number, step: number): number {
  if (!(step > 0) || !Number.isFinite(value)) return value;
  return Number((Math.round(value / step) * step).toPrecision(12));
}

export function snapPoint(t: number, hz: number, grid: SnapGrid | undefined): { t: number; hz: number } {
  if (!grid?.enabled) return { t, hz };
  return { t: snap(t, grid.timeS), hz: snap(hz, grid.rateHz) };
}
