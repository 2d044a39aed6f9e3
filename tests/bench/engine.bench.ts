/**
 * Engine benchmark: ratios and sizes, not pass/fail. Run with
 *   npx tsx tests/bench/engine.bench.ts
 * The machine is shared, so absolute rates move from run to run; the ratios are
 * measured in one process, back to back, and are the numbers to compare.
 *
 * Rows:
 *  1. raw uniforms/s of the chosen RNG (seedrandom alea, called as a function)
 *  2. engine candidates/s (sweep only) and its ratio to half the raw rate (goal ≥ 0.5;
 *     a candidate needs ≥ 2 uniforms: position and height)
 *  3. the same envelope by the naive per-time-step Bernoulli method at 0.1 ms (goal: engine ≥ 10× faster)
 *     Rows 1–3 run interleaved in one fresh child process, best of seven each; the sweep is
 *     compiled and warmed once and timed over 8 trial-hours at a time (steady state: timing
 *     a fresh compile of 4 trial-hours each round read 15–25 % lower and varied more)
 *  4. 1 h and 4 h × 100 trials × 200 Hz ceiling streamed to CSV into a null sink, each in a
 *     fresh child process: seconds and peak RSS (goal < 5 s and < 150 MB for 1 h; RSS flat in
 *     duration). 1 h: fastest of three processes, the slowest shown beside it.
 *     Two ways: a submitted/approved version, whose checksum and pulse count are stored (what
 *     rigs download: one pass, pulses checked against them), and a bare spec (the CLI: a
 *     counting pass first, since the header carries the checksum)
 *  5. the CSV row pass split over 2 worker threads: speed-up against 1 thread
 */
import { spawnSync } from 'node:child_process';
import { Writable } from 'node:stream';
import { createRequire } from 'node:module';
import { loadavg } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { Worker, isMainThread, parentPort, workerData } from 'node:worker_threads';
import seedrandom from 'seedrandom';
import { pipeChunks } from '../../lib/cli/main';
import { compileSpec } from '../../lib/schedule/compile';
import { csvBytes, csvRowBytes } from '../../lib/schedule/export/csv';
import { scanSchedule } from '../../lib/schedule/manifest';
import type { Spec } from '../../lib/schedule/spec';
import { runTrial } from '../../lib/schedule/stream';

const here = fileURLToPath(import.meta.url);
const tsxDir = dirname(createRequire(import.meta.url).resolve('tsx/package.json'));
const tsxApi = pathToFileURL(join(tsxDir, 'dist/esm/api/index.mjs')).href;
/** Workers and children start plain node: load tsx first, then this file. */
const workerBoot = `import('${tsxApi}').then(async (m) => { m.register(); await import(${JSON.stringify(pathToFileURL(here).href)}); })`;

/** Our benchmark protocol: a deep 0.05 Hz sine under a 200 Hz ceiling, 2 ms refractory, 10 kHz clock. */
function benchSpec(hours: number, trials: number): Spec {
  return {
    format: 'pulseloom-spec/1',
    envelope: [{ kind: 'sine', durationS: hours * 3600, meanHz: 100, depthHz: 95, freqHz: 0.05, phaseDeg: 0 }],
    ceilingHz: 200,
    refractory: { absoluteMs: 2, recoveryMs: 0 },
    pulse: { widthMs: 1, amplitude: 5, unit: 'mW' },
    trials,
    seed: 'bench-2031',
    clockHz: 10_000,
  };
}

const nullSink = () =>
  new Writable({
    decodeStrings: true,
    write(_chunk, _enc, cb) {
      cb();
    },
  });

function rawUniformsPerSecond(): number {
  const rng = seedrandom.alea('raw');
  let acc = 0;
  for (let i = 0; i < 2e6; i++) acc += rng();
  const n = 2e7;
  const t0 = performance.now();
  for (let i = 0; i < n; i++) acc += rng();
  const dt = (performance.now() - t0) / 1000;
  if (acc < 0) console.log(acc);
  return n / dt;
}

function arc4UniformsPerSecond(): number {
  const rng = seedrandom('raw');
  let acc = 0;
  const n = 4e6;
  const t0 = performance.now();
  for (let i = 0; i < n; i++) acc += rng();
  const dt = (performance.now() - t0) / 1000;
  if (acc < 0) console.log(acc);
  return n / dt;
}

/** The sweep at steady state: compiled and warmed once, then 8 trial-hours per measurement. */
const engineSpec = benchSpec(1, 8);
let engineCompiled: ReturnType<typeof compileSpec> | null = null;

function engineCandidatesPerSecond(): { rate: number; seconds: number; durationS: number } {
  if (!engineCompiled) {
    engineCompiled = compileSpec(engineSpec);
    for (let t = 97; t < 100; t++) runTrial(engineCompiled, t, () => {}); // warm-up
  }
  const c = engineCompiled;
  let candidates = 0;
  const t0 = performance.now();
  for (let trial = 0; trial < engineSpec.trials; trial++) candidates += runTrial(c, trial, () => {}).candidates;
  const seconds = (performance.now() - t0) / 1000;
  return { rate: candidates / seconds, seconds, durationS: engineSpec.trials * 3600 };
}

/** The naive method: every 0.1 ms step draws one uniform and fires with probability ρ(t)·dt (same refractory rule). */
function naiveSecondsPerTrialSecond(): number {
  const dt = 1e-4;
  const durationS = 200;
  const rng = seedrandom.alea('naive');
  const w = 2 * Math.PI * 0.05;
  let last = -Infinity;
  let kept = 0;
  const t0 = performance.now();
  const steps = Math.round(durationS / dt);
  for (let k = 0; k < steps; k++) {
    const t = k * dt;
    const p = (100 + 95 * Math.sin(w * t)) * dt;
    if (rng() < p && t - last >= 0.002) {
      kept++;
      last = t;
    }
  }
  const seconds = (performance.now() - t0) / 1000;
  if (kept < 0) console.log(kept);
  return seconds / durationS;
}

async function csvRun(hours: number, stored: boolean): Promise<{ seconds: number; peakRssMb: number; bytes: number }> {
  let bytes = 0;
  const sink = new Writable({
    write(chunk: Buffer, _enc, cb) {
      bytes += chunk.length;
      cb();
    },
  });
  const spec = benchSpec(hours, 100);
  // The stored values come from submission, long before the download: not timed.
  const known = stored ? scanSchedule(spec) : undefined;
  const t0 = performance.now();
  await pipeChunks(csvBytes(spec, { channel: 'bench' }, { known: known && { checksum: known.checksum, pulseCount: known.pulseCount } }), sink);
  const seconds = (performance.now() - t0) / 1000;
  return { seconds, peakRssMb: process.resourceUsage().maxRSS / 1024, bytes };
}

type CsvRun = { seconds: number; peakRssMb: number; bytes: number };

/** Fastest of `runs` fresh processes (the machine is shared: one run can be 30 % slow), with the largest peak RSS seen. */
function csvInChild(hours: number, stored: boolean, runs = 1): CsvRun & { slowest: number } {
  const all = Array.from({ length: runs }, () => inChild<CsvRun>('--csv-child', String(hours), stored ? 'stored' : 'spec'));
  const best = all.reduce((a, b) => (b.seconds < a.seconds ? b : a));
  return { ...best, peakRssMb: Math.max(...all.map((r) => r.peakRssMb)), slowest: Math.max(...all.map((r) => r.seconds)) };
}

/** The CSV row pass for some trials (what each worker does), into a null sink. */
async function rowPass(hours: number, trials: number[]): Promise<void> {
  await pipeChunks(csvRowBytes(benchSpec(hours, 100), trials, 'bench'), nullSink());
}

async function workerSpeedup(hours: number): Promise<{ one: number; two: number }> {
  const all = Array.from({ length: 100 }, (_, i) => i);
  const runWorkers = async (groups: number[][]) => {
    const t0 = performance.now();
    await Promise.all(
      groups.map(
        (trials) =>
          new Promise<void>((resolve, reject) => {
            const w = new Worker(workerBoot, { eval: true, workerData: { hours, trials, entry: here } });
            w.once('message', () => resolve());
            w.once('error', reject);
          }),
      ),
    );
    return (performance.now() - t0) / 1000;
  };
  const one = await runWorkers([all]);
  const two = await runWorkers([all.filter((t) => t % 2 === 0), all.filter((t) => t % 2 === 1)]);
  return { one, two };
}

const fmt = (x: number, d = 2) => x.toFixed(d);
const mega = (x: number) => `${fmt(x / 1e6, 1)} M/s`;

type RatioRun = { raw: number; eng: { rate: number; seconds: number; durationS: number }; naive: number };

/** Rows 1–3, interleaved, each one's best of seven (the machine is shared). */
function ratioRun(): RatioRun {
  let raw = 0;
  let eng = { rate: 0, seconds: Infinity, durationS: 1 };
  let naive = Infinity;
  for (let rep = 0; rep < 7; rep++) {
    raw = Math.max(raw, rawUniformsPerSecond());
    const e = engineCandidatesPerSecond();
    if (e.rate > eng.rate) eng = e;
    naive = Math.min(naive, naiveSecondsPerTrialSecond());
  }
  return { raw, eng, naive };
}

/** Run a mode of this file in a fresh process (so earlier measurements leave no JIT or heap state behind). */
function inChild<T>(...args: string[]): T {
  const r = spawnSync(process.execPath, ['--import', pathToFileURL(join(tsxDir, 'dist/esm/index.mjs')).href, here, ...args], { encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`child failed: ${r.stderr}`);
  return JSON.parse(r.stdout.trim().split('\n').pop()!) as T;
}

async function main() {
  const { raw, eng, naive } = inChild<RatioRun>('--ratio-child');
  const arc4 = arc4UniformsPerSecond();
  const engineSecPerTrialSec = eng.seconds / eng.durationS;
  const csv1 = csvInChild(1, true, 3);
  const csv4 = csvInChild(4, true);
  const spec1 = csvInChild(1, false, 3);
  const spec4 = csvInChild(4, false);
  const par = await workerSpeedup(1);
  const rows: [string, string, string][] = [
    ['raw uniforms/s (seedrandom alea, chosen)', mega(raw), ''],
    ['raw uniforms/s (seedrandom default ARC4)', mega(arc4), ''],
    ['engine candidates/s (sweep only)', mega(eng.rate), ''],
    ['  ratio to half the raw rate', fmt(eng.rate / (raw / 2)), 'goal ≥ 0.5'],
    ['naive Bernoulli @ 0.1 ms, s per trial-second', fmt(naive * 1e3, 3) + ' ms', ''],
    ['engine, s per trial-second', fmt(engineSecPerTrialSec * 1e3, 3) + ' ms', ''],
    ['  engine speed-up over naive', fmt(naive / engineSecPerTrialSec, 1) + '×', 'goal ≥ 10×'],
    ['CSV 1 h × 100 × 200 Hz, stored checksum → null sink', `${fmt(csv1.seconds)} s (slowest of 3: ${fmt(csv1.slowest)} s), ${fmt(csv1.peakRssMb, 0)} MB peak RSS`, 'goal < 5 s, < 150 MB'],
    ['CSV 4 h × 100 × 200 Hz, stored checksum → null sink', `${fmt(csv4.seconds)} s, ${fmt(csv4.peakRssMb, 0)} MB peak RSS`, 'RSS flat in duration'],
    ['CSV 1 h × 100 × 200 Hz, bare spec (2 passes)', `${fmt(spec1.seconds)} s (slowest of 3: ${fmt(spec1.slowest)} s), ${fmt(spec1.peakRssMb, 0)} MB peak RSS`, ''],
    ['CSV 4 h × 100 × 200 Hz, bare spec (2 passes)', `${fmt(spec4.seconds)} s, ${fmt(spec4.peakRssMb, 0)} MB peak RSS`, ''],
    ['  CSV bytes (1 h / 4 h)', `${fmt(csv1.bytes / 1e9, 2)} GB / ${fmt(csv4.bytes / 1e9, 2)} GB`, ''],
    ['CSV row pass 1 h × 100, 1 worker', `${fmt(par.one)} s`, ''],
    ['CSV row pass 1 h × 100, 2 workers', `${fmt(par.two)} s`, ''],
    ['  worker speed-up (2 cores)', fmt(par.one / par.two) + '×', ''],
  ];
  const w0 = Math.max(...rows.map((r) => r[0].length));
  const w1 = Math.max(...rows.map((r) => r[1].length));
  console.log(`\nPulseloom engine benchmark (node ${process.version}, load average ${loadavg().map((x) => x.toFixed(1)).join(' ')})\n`);
  for (const [a, b, c] of rows) console.log(`${a.padEnd(w0)}  ${b.padStart(w1)}  ${c}`);
}

if (!isMainThread) {
  const { hours, trials } = workerData as { hours: number; trials: number[] };
  await rowPass(hours, trials);
  parentPort!.postMessage('done');
} else if (process.argv[2] === '--ratio-child') {
  console.log(JSON.stringify(ratioRun()));
} else if (process.argv[2] === '--csv-child') {
  console.log(JSON.stringify(await csvRun(Number(process.argv[3]), process.argv[4] === 'stored')));
} else {
  await main();
}
