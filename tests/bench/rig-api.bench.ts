/**
 * Rig API load benchmark: ratios and latencies, not pass/fail. Run with `npm run bench -- rig-api`
 * (which provides a throwaway migrated database in DATABASE_URL), or
 *   DATABASE_URL=… npx tsx tests/bench/rig-api.bench.ts
 * It builds the app if the build is stale (PULSELOOM_DIST_DIR, default .next-bench), writes
 * its own lab, rig, token and approved versions with postgres.js, starts `next start` on a
 * free loopback port, and loads it with autocannon (20 connections, fixed durations, rounds
 * interleaved between targets so that load from other work on the machine hits them alike).
 *
 * Rows, measured back to back on one machine:
 *  1. bare node:http returning the download's bytes from memory — the machine's floor
 *  2. /api/rig/v1/sample.csv: a route handler of the same app returning an in-memory file
 *     of the same schedule (same spec and pulses; only its header lines differ), with no
 *     token, database or audit work — the framework's floor
 *  3. /api/rig/v1/versions/<id>.csv with a bearer token: token lookup, version lookup,
 *     audit row, bytes from the cache of approved files
 *  4. /api/rig/v1/versions: the listing
 * Goals (from the issue): row 3 ≥ 0.7 × row 2, p99 < 100 ms, zero errors.
 * Then: one 1 h × 100-trial download streamed to nowhere while the server's resident memory
 * is sampled every 50 ms (goal: flat — the peak grows by far less than the file's size).
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { randomBytes, createHash } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { cpus, loadavg } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import postgres from 'postgres';
import { scanSchedule, type Spec } from '../../lib/schedule';
import { SAMPLE_SPEC } from '../../lib/rig-api/sample';

const root = fileURLToPath(new URL('../..', import.meta.url));
// The machine is shared: load from elsewhere comes and goes. Each target is measured in
// ROUNDS short runs, interleaved with the other targets, and the median round is reported.
const ROUND_SECONDS = Number(process.env.BENCH_SECONDS ?? 4);
const ROUNDS = Number(process.env.BENCH_ROUNDS ?? 3);
const WARMUP_SECONDS = 2;
const CONNECTIONS = 20;

type Proc = {
  freePort(): Promise<number>;
  waitForPort(port: number, timeoutMs?: number): Promise<boolean>;
  run(cmd: string, args: string[], opts?: object): number;
  startService(cmd: string, args: string[], opts?: object): ChildProcess;
  stopService(child: ChildProcess): void;
};
type Build = { buildIsCurrent(root: string): boolean; markBuilt(root: string): void };

type CannonResult = {
  requests: { average: number };
  latency: { p50: number; p99: number };
  errors: number;
  timeouts: number;
  non2xx: number;
  '2xx': number;
  throughput: { average: number };
};
type Cannon = (opts: Record<string, unknown>) => Promise<CannonResult>;
const autocannon = createRequire(import.meta.url)('autocannon') as Cannon;

/** A realistic long optogenetic session: 1 h trains around 10 Hz, 100 trials (≈ 3.6 M pulses). */
const LONG_SPEC: Spec = {
  format: 'pulseloom-spec/1',
  envelope: [{ kind: 'sine', durationS: 3600, meanHz: 10, depthHz: 8, freqHz: 0.05, phaseDeg: 0 }],
  ceilingHz: 20,
  refractory: { absoluteMs: 10, recoveryMs: 0 },
  pulse: { widthMs: 5, amplitude: 5, unit: 'mW' },
  trials: 100,
  seed: 'bench-long-2031',
  clockHz: 10_000,
};

async function seedData(url: string) {
  const sql = postgres(url, { max: 1, onnotice: () => {} });
  try {
    const tag = randomBytes(4).toString('hex');
    const [lab] = await sql<{ id: string }[]>`insert into labs (slug, name) values (${`bench-${tag}`}, ${`Bench lab ${tag}`}) returning id`;
    const [rig] = await sql<{ id: string }[]>`
      insert into rigs (lab_id, name, modality, clock_hz, channels, wavelength_nm, fibre_core_um, fibre_na)
      values (${lab!.id}, ${`Bench rig ${tag}`}, 'optical', 10000, 1, 473, 200, 0.39) returning id`;
    const secret = `plr_${randomBytes(32).toString('base64url')}`;
    await sql`
      insert into rig_tokens (lab_id, rig_id, name, token_hash, expires_at)
      values (${lab!.id}, ${rig!.id}, 'bench', ${createHash('sha256').update(secret).digest('hex')}, now() + interval '1 day')`;
    const version = async (name: string, spec: Spec) => {
      const checksum = scanSchedule(spec).checksum;
      const [p] = await sql<{ id: string }[]>`insert into protocols (lab_id, name, modality) values (${lab!.id}, ${name}, 'optical') returning id`;
      const [v] = await sql<{ id: string }[]>`
        insert into protocol_versions (lab_id, protocol_id, number, status, spec, rig_id, checksum, approved_checksum, decided_at)
        values (${lab!.id}, ${p!.id}, 1, 'approved', ${sql.json(spec as never)}, ${rig!.id}, ${checksum}, ${checksum}, now())
        returning id`;
      return { id: v!.id, checksum };
    };
    const t0 = performance.now();
    const session = await version('Bench session', SAMPLE_SPEC);
    const long = await version('Bench long session', LONG_SPEC);
    console.log(`data: lab, rig, token and two approved versions (checksums in ${((performance.now() - t0) / 1000).toFixed(1)} s)`);
    return { secret, session, long, tokenHash: createHash('sha256').update(secret).digest('hex') };
  } finally {
    await sql.end();
  }
}

/** Resident memory of a process group (the `next start` tree), in MB. */
function groupRssMb(pgid: number): number {
  let kb = 0;
  for (const pid of readdirSync('/proc').filter((d) => /^\d+$/.test(d))) {
    try {
      const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
      const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
      if (Number(fields[2]) !== pgid) continue; // field 5 of stat: process group
      const m = /VmRSS:\s+(\d+) kB/.exec(readFileSync(`/proc/${pid}/status`, 'utf8'));
      if (m) kb += Number(m[1]);
    } catch {
      /* the process ended between listing and reading */
    }
  }
  return kb / 1024;
}

/** The machine's floor: node:http in its own process, answering with fixed bytes. */
function bareServer(file: string, port: number): ChildProcess {
  const code = `
    const http = require('node:http');
    const body = require('node:fs').readFileSync(${JSON.stringify(file)});
    http.createServer((req, res) => {
      res.writeHead(200, { 'Content-Type': 'text/csv; charset=utf-8', 'Content-Length': body.length });
      res.end(body);
    }).listen(${port}, '127.0.0.1');`;
  return spawn(process.execPath, ['-e', code], { stdio: 'inherit', detached: true });
}

type Target = { name: string; bytes: number; url: string; headers?: Record<string, string> };
type Measured = Target & { median: CannonResult; rounds: CannonResult[] };

/** Warm every target up, then run the rounds in rotating order; the median round (by req/s) stands. */
async function measure(targets: Target[]): Promise<Measured[]> {
  for (const t of targets) await autocannon({ url: t.url, connections: CONNECTIONS, duration: WARMUP_SECONDS, headers: t.headers ?? {} });
  const rounds = targets.map(() => [] as CannonResult[]);
  for (let r = 0; r < ROUNDS; r++) {
    for (let k = 0; k < targets.length; k++) {
      const i = (k + r) % targets.length;
      const t = targets[i]!;
      rounds[i]!.push(await autocannon({ url: t.url, connections: CONNECTIONS, duration: ROUND_SECONDS, headers: t.headers ?? {} }));
    }
  }
  return targets.map((t, i) => {
    const sorted = [...rounds[i]!].sort((a, b) => a.requests.average - b.requests.average);
    return { ...t, median: sorted[Math.floor(sorted.length / 2)]!, rounds: rounds[i]! };
  });
}

const fmt = (n: number, d = 0) => n.toLocaleString('en', { maximumFractionDigits: d, minimumFractionDigits: d });

async function main() {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error('DATABASE_URL is not set: run `npm run bench -- rig-api`');
  const proc = (await import(pathToFileURL(join(root, 'scripts/lib/proc.mjs')).href)) as Proc;
  const build = (await import(pathToFileURL(join(root, 'scripts/lib/build.mjs')).href)) as Build;
  process.env.PULSELOOM_DIST_DIR ??= '.next-bench';
  const next = join(root, 'node_modules', '.bin', 'next');
  const env = {
    ...process.env,
    NODE_ENV: 'production',
    AUTH_SECRET: randomBytes(32).toString('base64url'),
    AUTH_TRUST_HOST: 'true',
    NEXT_TELEMETRY_DISABLED: '1',
  };

  if (!build.buildIsCurrent(root)) {
    console.log(`building the app into ${process.env.PULSELOOM_DIST_DIR} (next build)…`);
    if (proc.run(next, ['build'], { cwd: root, env, stdio: ['ignore', 'ignore', 'inherit'] }) !== 0) throw new Error('next build failed');
    build.markBuilt(root);
  }

  const data = await seedData(url);
  const port = await proc.freePort();
  const base = `http://127.0.0.1:${port}`;
  const server = proc.startService(next, ['start', '-H', '127.0.0.1', '-p', String(port)], {
    cwd: root,
    env: { ...env, APP_URL: base, AUTH_URL: base },
    stdio: ['ignore', 'ignore', 'inherit'],
  });
  let bare: ChildProcess | null = null;
  const tmp = join(root, '.test-data', `bench-rig-${process.pid}.csv`);
  try {
    if (!(await proc.waitForPort(port, 60_000))) throw new Error('next start did not open its port');
    const auth = { Authorization: `Bearer ${data.secret}` };
    const downloadUrl = `${base}/api/rig/v1/versions/${data.session.id}.csv`;

    // First download renders and fills the cache; keep its bytes for the bare server.
    const t0 = performance.now();
    const first = await fetch(downloadUrl, { headers: auth });
    const bytes = Buffer.from(await first.arrayBuffer());
    const coldMs = performance.now() - t0;
    if (first.status !== 200) throw new Error(`download answered ${first.status}: ${bytes.toString()}`);
    const sample = Buffer.from(await (await fetch(`${base}/api/rig/v1/sample.csv`)).arrayBuffer());
    const pulses = Number(/# pulses: (\d+)/.exec(bytes.toString('utf8', 0, 2000))?.[1]);
    console.log(`schedule: ${fmt(pulses)} pulses, download ${fmt(bytes.length)} B, sample ${fmt(sample.length)} B; cold first download ${fmt(coldMs, 1)} ms`);

    mkdirSync(join(root, '.test-data'), { recursive: true });
    writeFileSync(tmp, bytes);
    const barePort = await proc.freePort();
    bare = bareServer(tmp, barePort);
    if (!(await proc.waitForPort(barePort, 10_000))) throw new Error('bare server did not start');

    console.log(`load: ${CONNECTIONS} connections; per target ${WARMUP_SECONDS} s warm-up, then ${ROUNDS} rounds of ${ROUND_SECONDS} s interleaved with the others; loopback`);
    const sql = postgres(url, { max: 1, onnotice: () => {} });
    const audited = async () => Number((await sql`select count(*)::int as n from audit_log where actor_label = 'token bench' and action = 'rig.version_downloaded'`)[0]!.n);
    const auditsBefore = await audited();
    const loadBefore = loadavg()[0]!;
    const rows = await measure([
      { name: 'node:http, same bytes', bytes: bytes.length, url: `http://127.0.0.1:${barePort}/` },
      { name: 'route handler, no token/db/audit', bytes: sample.length, url: `${base}/api/rig/v1/sample.csv` },
      { name: 'token download (cached)', bytes: bytes.length, url: downloadUrl, headers: auth },
      { name: 'token listing', bytes: 0, url: `${base}/api/rig/v1/versions`, headers: auth },
    ]);
    const auditsAfter = await audited();
    console.log(`machine load average (1 min, ${cpus().length} cores): ${fmt(loadBefore, 1)} before the load runs, ${fmt(loadavg()[0]!, 1)} after`);
    await sql.end();

    const [machine, floor, dl, listing] = rows.map((r) => r.median) as [CannonResult, CannonResult, CannonResult, CannonResult];
    console.log('\n| target | bytes | req/s (median round) | rounds req/s | × route floor | × node:http | p50 ms | p99 ms | errors (all rounds) |');
    console.log('|---|---:|---:|---|---:|---:|---:|---:|---:|');
    for (const r of rows) {
      const m = r.median;
      const errors = r.rounds.reduce((n, x) => n + x.errors + x.timeouts + x.non2xx, 0);
      console.log(
        `| ${r.name} | ${r.bytes ? fmt(r.bytes) : '—'} | ${fmt(m.requests.average)} | ${r.rounds.map((x) => fmt(x.requests.average)).join(' / ')} | ${fmt(m.requests.average / floor.requests.average, 2)} | ${fmt(m.requests.average / machine.requests.average, 2)} | ${m.latency.p50} | ${m.latency.p99} | ${errors} |`,
      );
    }
    const answered = rows[2]!.rounds.reduce((n, x) => n + x['2xx'], 0);
    console.log(`\naudit rows 'rig.version_downloaded' written during the load: ${fmt(auditsAfter - auditsBefore)} (2xx downloads in the measured rounds: ${fmt(answered)}, plus the warm-up's)`);
    const ratio = dl.requests.average / floor.requests.average;
    console.log(`goal download ≥ 0.7 × route floor: ${fmt(ratio, 2)} ${ratio >= 0.7 ? 'met' : 'NOT met'}`);
    console.log(`goal p99 < 100 ms: download ${dl.latency.p99} ms ${dl.latency.p99 < 100 ? 'met' : 'NOT met'}; listing ${listing.latency.p99} ms ${listing.latency.p99 < 100 ? 'met' : 'NOT met'}`);
    const errs = rows.slice(2).reduce((n, r) => n + r.rounds.reduce((k, x) => k + x.errors + x.timeouts + x.non2xx, 0), 0);
    console.log(`goal zero errors (download and listing): ${errs} ${errs === 0 ? 'met' : 'NOT met'}`);

    // Memory while streaming a long export (above the cache's per-entry limit: streamed from the engine).
    const pgid = server.pid!;
    await new Promise((r) => setTimeout(r, 1000));
    const baseline = groupRssMb(pgid);
    let peak = baseline;
    const sampler = setInterval(() => (peak = Math.max(peak, groupRssMb(pgid))), 50);
    const t1 = performance.now();
    const res = await fetch(`${base}/api/rig/v1/versions/${data.long.id}.csv`, { headers: auth });
    let size = 0;
    let firstByteMs = 0;
    const reader = res.body!.getReader();
    for (;;) {
      const { done, value } = await reader.read();
      if (done) break;
      if (!firstByteMs) firstByteMs = performance.now() - t1;
      size += value.byteLength;
    }
    const seconds = (performance.now() - t1) / 1000;
    clearInterval(sampler);
    peak = Math.max(peak, groupRssMb(pgid));
    console.log(
      `\n1 h × 100 trials CSV: ${res.status}, ${fmt(size / 1e6, 1)} MB in ${fmt(seconds, 1)} s (${fmt(size / 1e6 / seconds, 1)} MB/s, first byte after ${fmt(firstByteMs / 1000, 1)} s)`,
    );
    console.log(`server RSS: ${fmt(baseline, 0)} MB before, peak ${fmt(peak, 0)} MB during (+${fmt(peak - baseline, 0)} MB for a ${fmt(size / 1e6, 0)} MB file)`);
  } finally {
    if (existsSync(tmp)) rmSync(tmp);
    if (bare) proc.stopService(bare);
    proc.stopService(server);
  }
}

main().catch((err: Error) => {
  console.error(`rig-api bench: ${err.message}`);
  process.exit(1);
});
