/**
 * JSON export, format `pulseloom-schedule/1` (documented in docs/export-formats.md):
 *
 *   { "format": "pulseloom-schedule/1",
 *     "preview": true, "notice": "PREVIEW — NOT APPROVED FOR USE",   ← draft exports only
 *     "meta": { protocol, version, approvedBy, approvedAt, status, channel, … },
 *     "manifest": { …see manifest.ts… },
 *     "trials": [ { "trial": 0, "onsetsS": [...], "onsetSamples": [...] }, … ],
 *     "stats": { …see stats.ts… } }
 *
 * onsetSamples are the canonical integers; onsetsS[i] = onsetSamples[i] / clockHz.
 * Streaming: the checksum and statistics come from a first pass; each trial is then
 * generated twice (once for onsetsS, once for onsetSamples) so that no trial is ever
 * held whole — regenerating is cheaper than holding hours of pulses. With a known
 * checksum and count (options.known) there is no first pass: statistics are gathered
 * on the way and the pulses checked before the closing chunk (see KnownSchedule).
 * `pulseloom generate` prints exactly this.
 */
import { compileSpec, type Compiled } from '../compile';
import { buildManifest, scanSchedule } from '../manifest';
import { summarize, trialStats, type TrialStats } from '../stats';
import type { SweepCounts } from '../sweep-state';
import type { Spec } from '../spec';
import { trialBlocks } from '../stream';
import { assertValid } from '../validate';
import { ByteWriter, ascii, decimalPlan, writeSeconds } from './ascii';
import { KnownScheduleCheck, type ExportOptions } from './known';
import { PREVIEW_NOTICE, SCHEDULE_FORMAT, metaEntries, type ScheduleMeta } from './meta';

/** One trial's onsets as a comma-separated run of JSON numbers, block by block; returns the trial's counters. */
function* numberRun(
  c: Compiled,
  trial: number,
  w: ByteWriter,
  asSeconds: boolean,
  onBlock?: (samples: Float64Array, length: number) => void,
): Generator<Uint8Array, SweepCounts, undefined> {
  const plan = decimalPlan(c.clockHz);
  let first = true;
  const blocks = trialBlocks(c, trial);
  for (;;) {
    const r = blocks.next();
    if (r.done) return r.value;
    const { samples, length } = r.value;
    onBlock?.(samples, length);
    w.ensure(length * 50);
    for (let i = 0; i < length; i++) {
      if (!first) w.buf[w.pos++] = 44;
      first = false;
      if (asSeconds) writeSeconds(w, samples[i], c.clockHz, plan);
      else w.uint(samples[i]);
    }
    yield w.take();
  }
}

/** The JSON export as UTF-8 byte chunks; jsonChunks gives the same text as strings. */
export function* jsonBytes(spec: Spec, meta?: ScheduleMeta, options: ExportOptions = {}): Generator<Uint8Array, void, undefined> {
  assertValid(spec);
  const entries = metaEntries(meta);
  const known = options.known;
  const scan = known ? null : scanSchedule(spec);
  const manifest = buildManifest(spec, known ?? scan!);
  const c = compileSpec(spec);
  const w = new ByteWriter();

  let head = `{"format":${JSON.stringify(SCHEDULE_FORMAT)},`;
  if (meta?.preview) head += `"preview":true,"notice":${JSON.stringify(PREVIEW_NOTICE)},`;
  head += `"meta":${JSON.stringify(Object.fromEntries(entries))},`;
  head += `"manifest":${JSON.stringify(manifest)},"trials":[`;
  yield ascii(head);
  const check = known ? new KnownScheduleCheck(known) : null;
  const perTrial: TrialStats[] = [];
  for (let trial = 0; trial < spec.trials; trial++) {
    yield ascii(`${trial ? ',' : ''}\n{"trial":${trial},"onsetsS":[`);
    yield* numberRun(c, trial, w, true);
    yield ascii('],"onsetSamples":[');
    const counts = yield* numberRun(c, trial, w, false, check ? (samples, n) => check.add(trial, samples, n) : undefined);
    yield ascii(']}');
    if (!scan) perTrial.push(trialStats(c, trial, counts));
  }
  check?.verify();
  const stats = scan ? scan.stats : summarize(c, perTrial);
  yield ascii(`\n],"stats":${JSON.stringify(stats)}}\n`);
}

export function* jsonChunks(spec: Spec, meta?: ScheduleMeta, options: ExportOptions = {}): Generator<string, void, undefined> {
  const decoder = new TextDecoder();
  for (const chunk of jsonBytes(spec, meta, options)) yield decoder.decode(chunk);
}
