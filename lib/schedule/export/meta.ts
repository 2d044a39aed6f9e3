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

