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
 * held whole — regenerating is cheaper than holding hours of pulses.
 * `pulseloom generate` prints exactly this.
 */
import { compileSpec, type Compiled } from '../compile';
import { buildManifest, scanSchedule } from '../manifest';
import type { Spec } from '../spec';
import { trialBlocks } from '../stream';
import { assertValid } from '../validate';
import { ByteWriter, ascii, decimalPlan, writeSeconds } from './ascii';
import { PREVIEW_NOTICE, SCHEDULE_FORMAT, metaEntries, type ScheduleMeta } from './meta';

/** One trial's onsets as a comma-separated run of JSON numbers, block by block. */
function* numberRun(c: Compiled, trial: number, w: ByteWriter, asSeconds: boolean): Generator<Uint8Array> {
  const plan = decimalPlan(c.clockHz);
  let first = true;
  for (const { samples, length } of trialBlocks(c, trial)) {
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
export function* jsonBytes(spec: Spec, meta?: ScheduleMeta): Generator<Uint8Array, void, undefined> {
  assertValid(spec);
  const entries = metaEntries(meta);
  const scan = scanSchedule(spec);
  const manifest = buildManifest(spec, scan);
  const c = compileSpec(spec);
  const w = new ByteWriter();

  let head = `{"format":${JSON.stringify(SCHEDULE_FORMAT)},`;
  if (meta?.preview) head += `"preview":true,"notice":${JSON.stringify(PREVIEW_NOTICE)},`;
  head += `"meta":${JSON.stringify(Object.fromEntries(entries))},`;
  head += `"manifest":${JSON.stringify(manifest)},"trials":[`;
  yield ascii(head);
  for (let trial = 0; trial < spec.trials; trial++) {
    yield ascii(`${trial ? ',' : ''}\n{"trial":${trial},"onsetsS":[`);
    yield* numberRun(c, trial, w, true);
    yield ascii('],"onsetSamples":[');
    yield* numberRun(c, trial, w, false);
    yield ascii(']}');
  }
  yield ascii(`\n],"stats":${JSON.stringify(scan.stats)}}\n`);
}

export function* jsonChunks(spec: Spec, meta?: ScheduleMeta): Generator<string, void, undefined> {
  const decoder = new TextDecoder();
  for (const chunk of jsonBytes(spec, meta)) yield decoder.decode(chunk);
}
