import type { Limit } from './profile';
import { judge, type Direction, type RowStatus } from './status';

export interface SheetRow {
  id: string;
  label: string;
  /** null when it cannot be computed; `help` then says what is missing. */
  value: number | null;
  unit: string;
  /** The profile's levels for this metric; null for information-only rows. */
  limit: Limit | null;
  /** 'max': the value must stay at or below the limit; 'min': at or above. */
  direction: Direction | null;
  /** Headroom in `unit` to the hard limit (or the warning level if no hard limit); positive = inside. */
  margin: number | null;
  status: RowStatus;
  /** Where the formula and the limit come from, with the facts tag (a)/(b)/(c). */
  source: string;
  help: string;
}

export interface CheckedRowInput {
  id: string;
  label: string;
  value: number | null;
  unit: string;
  limit: Limit | undefined;
  direction: Direction;
  source: string;
  help: string;
}

export function checkedRow(input: CheckedRowInput, whenUnknown: 'warn' | 'fail'): SheetRow {
  const { status, margin } = judge(input.value, input.limit, input.direction, whenUnknown);
  return { ...input, value: finiteOrNull(input.value), limit: input.limit ?? null, status, margin };
}

export function infoRow(input: Omit<CheckedRowInput, 'limit' | 'direction'>, status: RowStatus = 'info'): SheetRow {
  return { ...input, value: finiteOrNull(input.value), limit: null, direction: null, margin: null, status };
}

function finiteOrNull(x: number | null): number | null {
  return x !== null && Number.isFinite(x) ? x : null;
}

/** Positive finite number or null: rig records and schedule summaries may hold gaps. */
export function positive(x: number | null | undefined): number | null {
  return typeof x === 'number' && Number.isFinite(x) && x > 0 ? x : null;
}

/** Four significant digits for help texts; the UI formats `value` itself. */
export function fmt(x: number): string {
  return Number.isFinite(x) ? String(Number(x.toPrecision(4))) : String(x);
}
