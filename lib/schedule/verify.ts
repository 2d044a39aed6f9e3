/**
 * Reading schedule files back and proving them: regenerate from the manifest alone and
 * compare pulse by pulse, then the checksum. Accepts the CSV and the JSON export.
 * The whole file is held in memory (it was read whole); regeneration streams.
 */
import { canonicalSpecJson } from './canonical';
import { ChecksumWriter, sha256Text } from './checksum';
import { compileSpec } from './compile';
import { SUPPORTED_ENGINES } from './engine';
import { CSV_HEADER, rowSuffix } from './export/csv';
import { PREVIEW_NOTICE, SCHEDULE_FORMAT } from './export/meta';
import { MANIFEST_FORMAT } from './manifest';
import { parseSpec, type Spec } from './spec';
import { trialBlocks } from './stream';

export interface FileTrial {
  trial: number;
  onsetSamples: number[];
  /** As written: numbers from JSON, exact text from CSV. */
  onsetsS: (number | string)[];
}

export interface ScheduleFile {
  kind: 'csv' | 'json';
  /** Marked PREVIEW — NOT APPROVED FOR USE (a draft). Verification still checks the pulses. */
  preview: boolean;
  manifest: unknown;
  /** Header fields (CSV comments / JSON meta) that must agree with the manifest. */
  header: Record<string, string>;
  trials: FileTrial[];
  /** CSV only: per row, the text after onset_sample (must match the spec's pulse and the channel). */
  rowTails?: string[][];
}

export type ReadResult = { ok: true; file: ScheduleFile } | { ok: false; firstDifference: string };
export type VerifyResult =
  | { ok: true; pulses: number; checksum: string; preview: boolean }
  | { ok: false; firstDifference: string };

export function readScheduleFile(text: string): ReadResult {
  try {
    const trimmed = text.replace(/^\uFEFF/, '').trimStart();
    if (trimmed.startsWith('{')) return readJson(trimmed);
    if (trimmed.startsWith('#')) return readCsv(trimmed);
    return fail('not a Pulseloom schedule: expected JSON ({…}) or CSV starting with # comments');
  } catch (err) {
    return fail(`unreadable schedule file: ${err instanceof Error ? err.message : String(err)}`);
  }
}

const fail = (firstDifference: string) => ({ ok: false as const, firstDifference });

function readJson(text: string): ReadResult {
  const doc = JSON.parse(text) as Record<string, unknown>;
  if (doc?.format !== SCHEDULE_FORMAT) return fail(`format is ${JSON.stringify(doc?.format)}, expected "${SCHEDULE_FORMAT}"`);
  if (!Array.isArray(doc.trials)) return fail('trials is missing');
  const trials: FileTrial[] = [];
  for (const [i, t] of (doc.trials as unknown[]).entries()) {
    const tr = t as Record<string, unknown>;
    if (!tr || !Array.isArray(tr.onsetSamples) || !Array.isArray(tr.onsetsS)) {
      return fail(`trials[${i}] needs onsetsS and onsetSamples arrays`);
    }
    trials.push({ trial: Number(tr.trial), onsetSamples: tr.onsetSamples as number[], onsetsS: tr.onsetsS as number[] });
  }
  return { ok: true, file: { kind: 'json', preview: doc.preview === true, manifest: doc.manifest, header: {}, trials } };
}

function readCsv(text: string): ReadResult {
  const lines = text.split(/\r?\n/);
  const header: Record<string, string> = {};
  let i = 0;
  for (; i < lines.length && lines[i].startsWith('#'); i++) {
    const m = /^# ([A-Za-z][A-Za-z0-9_]*): (.*)$/.exec(lines[i]);
    if (m) header[m[1]] = m[2];
  }
  if (header.format !== SCHEDULE_FORMAT) return fail(`# format is ${JSON.stringify(header.format)}, expected "${SCHEDULE_FORMAT}"`);
  if (header.manifest === undefined) return fail('no "# manifest:" line: this CSV cannot be regenerated');
  if (lines[i] !== CSV_HEADER) return fail(`line ${i + 1}: column header differs from "${CSV_HEADER}"`);
  const manifest = JSON.parse(header.manifest) as unknown;
  const trials: FileTrial[] = [];
  const rowTails: string[][] = [];
  for (i++; i < lines.length; i++) {
    const line = lines[i];
    if (line === '') continue;
    // trial,pulse_index,onset_s,onset_sample,<tail>
    const parts = line.split(',', 4);
    const tailStart = parts.slice(0, 4).join(',').length;
    const trial = strictInt(parts[0]);
    const index = strictInt(parts[1]);
    const sample = strictInt(parts[3]);
    if (trial === null || index === null || sample === null) return fail(`line ${i + 1}: trial, pulse_index and onset_sample must be whole numbers`);
    let cur = trials[trials.length - 1];
    if (!cur || cur.trial !== trial) {
      cur = { trial, onsetSamples: [], onsetsS: [] };
      trials.push(cur);
      rowTails.push([]);
    }
    if (index !== cur.onsetSamples.length) return fail(`line ${i + 1}: trial ${trial} pulse_index ${index}, expected ${cur.onsetSamples.length}`);
    cur.onsetSamples.push(sample);
    cur.onsetsS.push(parts[2]);
    rowTails[rowTails.length - 1].push(line.slice(tailStart + 1));
  }
  const preview = lines[0] === `# ${PREVIEW_NOTICE}`;
  return { ok: true, file: { kind: 'csv', preview, manifest, header, trials, rowTails } };
}

function strictInt(s: string | undefined): number | null {
  if (s === undefined || !/^(0|[1-9][0-9]*)$/.test(s)) return null;
  const n = Number(s);
  return Number.isSafeInteger(n) ? n : null;
}

interface ManifestLike {
  format?: unknown;
  engineVersion?: unknown;
  spec?: unknown;
  specSha256?: unknown;
  checksum?: unknown;
  pulseCount?: unknown;
}

/** Regenerate from the file's manifest and compare everything; stops at the first difference. */
export function verifySchedule(input: ScheduleFile | string): VerifyResult {
  let file: ScheduleFile;
  if (typeof input === 'string') {
    const r = readScheduleFile(input);
    if (!r.ok) return r;
    file = r.file;
  } else file = input;
  try {
    return verifyFile(file);
  } catch (err) {
    return fail(`verification failed: ${err instanceof Error ? err.message : String(err)}`);
  }
}

function verifyFile(file: ScheduleFile): VerifyResult {
  const m = (file.manifest ?? {}) as ManifestLike;
  if (m.format !== MANIFEST_FORMAT) return fail(`manifest format ${JSON.stringify(m.format)}, expected "${MANIFEST_FORMAT}"`);
  if (typeof m.engineVersion !== 'string' || !SUPPORTED_ENGINES.includes(m.engineVersion)) {
    return fail(`manifest engine ${JSON.stringify(m.engineVersion)} is not available here (have ${SUPPORTED_ENGINES.join(', ')})`);
  }
  const parsed = parseSpec(m.spec);
  if (!parsed.ok) return fail(`manifest spec invalid: ${parsed.errors[0].path}: ${parsed.errors[0].message}`);
  const spec: Spec = parsed.spec;
  const specHash = sha256Text(canonicalSpecJson(spec));
  if (m.specSha256 !== specHash) return fail(`manifest specSha256 ${String(m.specSha256)} does not match its spec (${specHash})`);

  const h = file.header;
  const expectHeader: Record<string, string> = {
    engine: m.engineVersion,
    seed: spec.seed,
    clockHz: String(spec.clockHz),
    trials: String(spec.trials),
    pulses: String(m.pulseCount),
    checksum: String(m.checksum),
  };
  if (file.kind === 'csv') {
    for (const [k, v] of Object.entries(expectHeader)) {
      const got = k === 'seed' ? decodeComment(h[k]) : h[k];
      if (got !== v) return fail(`header "# ${k}" is ${JSON.stringify(h[k])}, manifest says ${JSON.stringify(v)}`);
    }
  }

  if (file.trials.length !== spec.trials) return fail(`file has ${file.trials.length} trials, spec has ${spec.trials}`);
  const c = compileSpec(spec);
  const clk = c.clockHz;
  const tail = file.kind === 'csv' ? rowSuffix(spec, h.channel === undefined ? undefined : decodeComment(h.channel)).slice(1) : '';
  const fileSum = new ChecksumWriter();
  const regenSum = new ChecksumWriter();
  let total = 0;
  for (let trial = 0; trial < spec.trials; trial++) {
    const ft = file.trials[trial];
    if (ft.trial !== trial) return fail(`trial ${trial}: file has trial number ${ft.trial} in its place`);
    if (ft.onsetsS.length !== ft.onsetSamples.length) return fail(`trial ${trial}: ${ft.onsetsS.length} onsetsS but ${ft.onsetSamples.length} onsetSamples`);
    fileSum.add(trial, ft.onsetSamples);
    let k = 0;
    for (const { samples, length } of trialBlocks(c, trial)) {
      regenSum.add(trial, samples, length);
      for (let i = 0; i < length; i++, k++) {
        const want = samples[i];
        if (k >= ft.onsetSamples.length) return fail(`trial ${trial}: file ends after ${k} pulses; regenerated pulse ${k} at sample ${want}`);
        const got = ft.onsetSamples[k];
        if (got !== want) return fail(`trial ${trial}, pulse ${k}: file onset_sample ${got}, regenerated ${want}`);
        const s = ft.onsetsS[k];
        const wantS = want / clk;
        if (typeof s === 'string' ? s !== String(wantS) : s !== wantS) {
          return fail(`trial ${trial}, pulse ${k}: file onset_s ${s}, regenerated ${wantS}`);
        }
        if (file.rowTails && file.rowTails[trial][k] !== tail) {
          return fail(`trial ${trial}, pulse ${k}: pulse columns "${file.rowTails[trial][k]}", spec gives "${tail}"`);
        }
      }
    }
    if (k !== ft.onsetSamples.length) return fail(`trial ${trial}: file has ${ft.onsetSamples.length} pulses, regenerated ${k}`);
    total += k;
  }
  const fromFile = fileSum.digest();
  const regenerated = regenSum.digest();
  if (regenerated !== m.checksum) return fail(`manifest checksum ${String(m.checksum)}, regenerated ${regenerated}`);
  if (fromFile !== regenerated) return fail(`checksum of the file's pulses ${fromFile}, regenerated ${regenerated}`);
  if (m.pulseCount !== total) return fail(`manifest pulseCount ${String(m.pulseCount)}, regenerated ${total}`);
  return { ok: true, pulses: total, checksum: regenerated, preview: file.preview };
}

function decodeComment(v: string | undefined): string | undefined {
  if (v === undefined) return undefined;
  if (v.startsWith('"')) {
    try {
      return JSON.parse(v) as string;
    } catch {
      return v;
    }
  }
  return v;
}
