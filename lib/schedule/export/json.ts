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
import { PREVIEW_NOTICE, SCHEDULE_FORMAT, metaEntries, type ScheduleMeta } from './meta';

function* numberArray(c: Compiled, trial: number, toValue: (sample: number) => number): Generator<string> {
  let first = true;
  for (const { samples, length } of trialBlocks(c, trial)) {
    let chunk = '';
    for (let i = 0; i < length; i++) {
      chunk += (first ? '' : ',') + toValue(samples[i]);
      first = false;
    }
    yield chunk;
  }
}

export function* jsonChunks(spec: Spec, meta?: ScheduleMeta): Generator<string, void, undefined> {
  assertValid(spec);
  const entries = metaEntries(meta);
  const scan = scanSchedule(spec);
  const manifest = buildManifest(spec, scan);
  const c = compileSpec(spec);
  const clk = c.clockHz;

  let head = `{"format":${JSON.stringify(SCHEDULE_FORMAT)},`;
  if (meta?.preview) head += `"preview":true,"notice":${JSON.stringify(PREVIEW_NOTICE)},`;
  head += `"meta":${JSON.stringify(Object.fromEntries(entries))},`;
  head += `"manifest":${JSON.stringify(manifest)},"trials":[`;
  yield head;
  for (let trial = 0; trial < spec.trials; trial++) {
    yield `${trial ? ',' : ''}\n{"trial":${trial},"onsetsS":[`;
    yield* numberArray(c, trial, (s) => s / clk);
    yield '],"onsetSamples":[';
    yield* numberArray(c, trial, (s) => s);
    yield ']}';
  }
  yield `\n],"stats":${JSON.stringify(scan.stats)}}\n`;
}
