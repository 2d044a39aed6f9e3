/**
 * CSV export, format `pulseloom-schedule/1` (documented in docs/export-formats.md).
 *
 *   # PREVIEW — NOT APPROVED FOR USE          ← first line, only for draft exports
 *   # format: pulseloom-schedule/1
 *   # engine: pulseloom-thinning/1
 *   # seed: <master seed>
 *   # clockHz: <Hz>
 *   # trials: <n>
 *   # pulses: <total>
 *   # checksum: sha256:<hex>
 *   # <meta key>: <value>                      ← protocol, version, approvedBy, approvedAt, status, channel, …
 *   # manifest: {…one line of JSON…}          ← enough for `pulseloom verify` to regenerate from this file alone
 *   trial,pulse_index,onset_s,onset_sample,width_ms,amplitude,unit,phase_width_us,phase_gap_us,leading_phase,channel
 *   0,0,0.0159,159,5,10,mW,,,,A1
 *
 * Rows: one per pulse, trials ascending, onsets ascending. onset_sample (integer tick of
 * the clockHz clock, from 0 at trial start) is the canonical time; onset_s is
 * onset_sample / clockHz written as the shortest decimal that reads back to the same
 * double. Phase columns are empty for optical pulses. Comment values are written as is
 * unless they hold control characters, edge spaces or start with a quote; then they are
 * JSON strings.
 *
 * Streaming: one pass computes the checksum (it heads the file), a second writes rows;
 * at most one 60 s block of pulses (and its text) is held at a time. When the checksum
 * and pulse count are known (options.known), a single pass writes the rows and checks
 * them against those values; the last chunk is held back until the check passes.
 */
import { compileSpec } from '../compile';
import { ENGINE_ID } from '../engine';
import { buildManifest, scanSchedule } from '../manifest';
import type { Spec } from '../spec';
import { trialBlocks } from '../stream';
import { assertValid } from '../validate';
import { ByteWriter, ascii, decimalPlan, writeRows } from './ascii';
import { KnownScheduleCheck, type ExportOptions, type KnownSchedule } from './known';
import { PREVIEW_NOTICE, SCHEDULE_FORMAT, metaEntries, type MetaValue, type ScheduleMeta } from './meta';

export const CSV_COLUMNS = [
  'trial',
  'pulse_index',
  'onset_s',
  'onset_sample',
  'width_ms',
  'amplitude',
  'unit',
  'phase_width_us',
  'phase_gap_us',
  'leading_phase',
  'channel',
] as const;

export const CSV_HEADER = CSV_COLUMNS.join(',');

/** RFC 4180 quoting when a cell needs it. */
export function csvCell(v: string): string {
  return /[",\r\n]/.test(v) ? `"${v.replace(/"/g, '""')}"` : v;
}

export function commentValue(v: MetaValue): string {
  const s = String(v);
  const plain = !/[\u0000-\u001f\u007f]/.test(s) && s === s.trim() && !s.startsWith('"');
  return typeof v === 'string' && !plain ? JSON.stringify(s) : s;
}

/** The constant tail of every row: `,width_ms,amplitude,unit,phase_width_us,phase_gap_us,leading_phase,channel`. */
export function rowSuffix(spec: Spec, channel: string | undefined): string {
  const p = spec.pulse;
  const ph = p.unit === 'uA' ? p.phases : undefined;
  return [
    '',
    String(p.widthMs),
    String(p.amplitude),
    p.unit,
    ph ? String(ph.widthUs) : '',
    ph ? String(ph.gapUs) : '',
    ph ? ph.leading : '',
    csvCell(channel ?? ''),
  ].join(',');
}

/**
 * The CSV as byte chunks (UTF-8): the header block, then one chunk per 60 s block of a
 * trial. Prefer this for HTTP bodies and files; csvLines gives the same text as strings.
 */
export function* csvBytes(spec: Spec, meta?: ScheduleMeta, options: ExportOptions = {}): Generator<Uint8Array, void, undefined> {
  assertValid(spec);
  const entries = metaEntries(meta);
  const scan = options.known ?? scanSchedule(spec);
  const manifest = buildManifest(spec, scan);
  const head: string[] = [];
  if (meta?.preview) head.push(`# ${PREVIEW_NOTICE}`);
  head.push(
    `# format: ${SCHEDULE_FORMAT}`,
    `# engine: ${ENGINE_ID}`,
    `# seed: ${commentValue(spec.seed)}`,
    `# clockHz: ${spec.clockHz}`,
    `# trials: ${spec.trials}`,
    `# pulses: ${scan.pulseCount}`,
    `# checksum: ${scan.checksum}`,
  );
  for (const [k, v] of entries) head.push(`# ${k}: ${commentValue(v)}`);
  head.push(`# manifest: ${JSON.stringify(manifest)}`, CSV_HEADER);
  yield ascii(head.join('\n') + '\n');

  const channel = meta?.channel === undefined ? undefined : String(meta.channel);
  if (options.known) yield* checkedRows(spec, channel, options.known);
  else yield* csvRowBytes(spec, range(spec.trials), channel);
}

/** All rows in one pass, checked against the known checksum and count; the last chunk waits for the check. */
function* checkedRows(spec: Spec, channel: string | undefined, known: KnownSchedule): Generator<Uint8Array, void, undefined> {
  const check = new KnownScheduleCheck(known);
  let held: Uint8Array | null = null;
  for (const chunk of csvRowBytes(spec, range(spec.trials), channel, check)) {
    if (held) yield held;
    held = chunk;
  }
  check.verify();
  if (held) yield held;
}

const range = (n: number) => Array.from({ length: n }, (_, i) => i);

/**
 * Just the rows, for the given trials in the given order, one chunk per 60 s block.
 * Workers can each write a share of the trials; the header needs the whole checksum.
 * With `check`, the rows' checksum lines go to it as they are written.
 */
export function* csvRowBytes(
  spec: Spec,
  trials: readonly number[],
  channel?: string,
  check?: KnownScheduleCheck,
): Generator<Uint8Array, void, undefined> {
  const c = compileSpec(spec);
  const clk = c.clockHz;
  const plan = decimalPlan(clk);
  const suffix = ascii(rowSuffix(spec, channel) + '\n');
  const w = new ByteWriter();
  const lines = check ? new ByteWriter() : null;
  for (const trial of trials) {
    const prefix = ascii(`${trial},`);
    for (const { samples, length, firstIndex } of trialBlocks(c, trial)) {
      writeRows(w, prefix, suffix, samples, length, firstIndex, clk, plan, lines);
      if (check && lines) {
        check.addLines(lines.buf.subarray(0, lines.pos), length);
        lines.pos = 0;
      }
      yield w.take();
    }
  }
}

/** The CSV as string chunks (same bytes as csvBytes, decoded). */
export function* csvLines(spec: Spec, meta?: ScheduleMeta, options: ExportOptions = {}): Generator<string, void, undefined> {
  const decoder = new TextDecoder();
  for (const chunk of csvBytes(spec, meta, options)) yield decoder.decode(chunk);
}
