import type { Limit } from './profile';

export type RowStatus = 'pass' | 'warn' | 'fail' | 'info' | 'not-set';
export type Direction = 'max' | 'min';

// Computed values carry floating-point rounding (0.1 × 3 is not 0.3). A stimulator set
// exactly at the limit must not fail on the sixteenth digit, so "beyond" allows a
// relative slack far below any instrument's resolution.
const SLACK = 1e-9;

function beyond(value: number, limit: number, direction: Direction): boolean {
  const slack = SLACK * Math.max(1, Math.abs(limit));
  return direction === 'max' ? value > limit + slack : value < limit - slack;
}

/** Signed headroom in the row's unit: positive while inside the limit. */
function headroom(value: number, limit: number, direction: Direction): number {
  return direction === 'max' ? limit - value : value - limit;
}

export interface Verdict {
  status: RowStatus;
  /** Headroom to the hard limit, or to the warning level when no hard limit is set. */
  margin: number | null;
}

/**
 * Compare one value with one limit. A value that could not be computed (missing rig
 * data, no preview yet) is never silently passed when the lab set a limit: it gets
 * `whenUnknown`, which the profile chooses.
 */
export function judge(
  value: number | null,
  limit: Limit | undefined,
  direction: Direction,
  whenUnknown: 'warn' | 'fail' = 'warn',
): Verdict {
  const hard = limit?.hard;
  const warn = limit?.warn;
  if (hard === undefined && warn === undefined) return { status: 'not-set', margin: null };
  if (value === null || !Number.isFinite(value)) return { status: whenUnknown, margin: null };
  const reference = (hard ?? warn) as number;
  const margin = headroom(value, reference, direction);
  if (hard !== undefined && beyond(value, hard, direction)) return { status: 'fail', margin };
  if (warn !== undefined && beyond(value, warn, direction)) return { status: 'warn', margin };
  return { status: 'pass', margin };
}
