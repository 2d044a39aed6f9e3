/**
 * Descriptive fields carried by an exported schedule (who approved it, for which
 * channel…). They travel with the file but are not part of the regenerable pulses:
 * the checksum covers pulse timing, the manifest covers the spec.
 */
export const SCHEDULE_FORMAT = 'pulseloom-schedule/1';
export const PREVIEW_NOTICE = 'PREVIEW — NOT APPROVED FOR USE';

export type MetaValue = string | number | boolean;

export interface ScheduleMeta {
  /** Draft export: the file says PREVIEW — NOT APPROVED FOR USE first thing. */
  preview?: boolean;
  protocol?: string;
  version?: string | number;
  approvedBy?: string;
  approvedAt?: string;
  status?: string;
  /** Rig output channel; also written in every CSV row. */
  channel?: string;
  [key: string]: MetaValue | undefined;
}

/** Keys the writers set themselves; meta may not override them. */
export const RESERVED_KEYS = new Set([
  'format',
  'engine',
  'seed',
  'clockHz',
  'trials',
  'pulses',
  'checksum',
  'manifest',
  'notice',
  'preview',
]);

const KEY = /^[A-Za-z][A-Za-z0-9_]{0,63}$/;

/** Meta entries to write, in a stable order (given order, undefined dropped). Throws on bad keys. */
export function metaEntries(meta: ScheduleMeta | undefined): [string, MetaValue][] {
  const out: [string, MetaValue][] = [];
  for (const [k, v] of Object.entries(meta ?? {})) {
    if (v === undefined || k === 'preview') continue;
    if (!KEY.test(k)) throw new TypeError(`meta key ${JSON.stringify(k)}: letters, digits and _ only, starting with a letter`);
    if (RESERVED_KEYS.has(k)) throw new TypeError(`meta key "${k}" is written by the exporter itself`);
    if (typeof v !== 'string' && typeof v !== 'boolean' && !(typeof v === 'number' && Number.isFinite(v))) {
      throw new TypeError(`meta "${k}" must be a string, finite number or boolean`);
    }
    out.push([k, v]);
  }
  return out;
}

/**
 * What the caller already knows about the schedule, e.g. stored when the version was
 * submitted. With it the writers need no counting pass: they write the header from these
 * values, check every pulse against them as they go, and throw ScheduleMismatchError
 * before the last chunk if the pulses differ, so a stream that disagrees never completes.
 */
export interface KnownSchedule {
  checksum: string;
  pulseCount: number;
}

export interface ExportOptions {
  known?: KnownSchedule;
}

export class ScheduleMismatchError extends Error {
  constructor(
    readonly expected: KnownSchedule,
    readonly actual: KnownSchedule,
  ) {
    super(
      `the regenerated schedule differs from the stored one: ${actual.pulseCount} pulses, ${actual.checksum}; expected ${expected.pulseCount} pulses, ${expected.checksum}`,
    );
    this.name = 'ScheduleMismatchError';
  }
}
