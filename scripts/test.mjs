// `npm test`: unit tests, integration tests against a throwaway PostgreSQL cluster, and
// browser tests in Debian's Chromium against a production build. Exits non-zero on any failure.
import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, rmSync } from 'node:fs';
import { join, relative } from 'node:path';
import { fileURLToPath } from 'node:url';
import { ensureDependencies } from './lib/deps.mjs';
import { ensurePostgresInstalled, removeCluster, startCluster } from './lib/pg.mjs';
import { ensureChromium } from './lib/chromium.mjs';
import { freePort, run, startService, stopService, waitForPort } from './lib/proc.mjs';
import { markBuilt } from './lib/build.mjs';

const root = fileURLToPath(new URL('..', import.meta.url));
// While developing: `npm test -- integ` runs one layer; further words are passed to its runner
// as file filters, e.g. `npm test -- e2e tests/e2e/rigs.e2e.ts`.
const LAYERS = ['unit', 'integ', 'e2e'];
const args = process.argv.slice(2);
const only = args.filter((a) => LAYERS.includes(a));
const filters = args.filter((a) => !LAYERS.includes(a));
const want = (layer) => only.length === 0 || only.includes(layer);

ensureDependencies(root);
const bin = ensurePostgresInstalled();
if (want('e2e')) ensureChromium();

const work = join(root, '.test-data', `run-${process.pid}`);
mkdirSync(work, { recursive: true });
const pgData = join(work, 'pg');
const pgPort = await freePort();
const databaseUrl = startCluster({ bin, dataDir: pgData, port: pgPort, database: 'pulseloom_test', throwaway: true });
const appPort = await freePort();
const mailPort = await freePort();
// Auth.js builds its links on localhost; one host everywhere keeps cookies and links together.
const appUrl = `http://localhost:${appPort}`;

const env = {
  ...process.env,
  DATABASE_URL: databaseUrl,
  PULSELOOM_PG_ADMIN_URL: `postgres://postgres@127.0.0.1:${pgPort}/postgres`,
  AUTH_SECRET: randomBytes(32).toString('base64url'),
  AUTH_URL: appUrl,
  AUTH_TRUST_HOST: 'true',
  APP_URL: appUrl,
  PULSELOOM_TEST_PORT: String(appPort),
  MAIL_CATCHER_PORT: String(mailPort),
  PULSELOOM_DEV_MAILBOX: '1',
  NEXT_TELEMETRY_DISABLED: '1',
};
delete env.SMTP_URL; // tests always use the local fake SMTP server

const bin_ = (name) => join(root, 'node_modules', '.bin', name);
const results = [];
const services = [];

function cleanup() {
  for (const s of services) stopService(s);
  removeCluster(bin, pgData);
  rmSync(work, { recursive: true, force: true });
}
process.on('SIGINT', () => (cleanup(), process.exit(130)));
process.on('SIGTERM', () => (cleanup(), process.exit(143)));

const firstLine = (text) => String(text ?? '').replace(/\x1b\[[0-9;]*m/g, '').split('\n').find((l) => l.trim())?.trim().slice(0, 200) ?? '';

/** Names of failed tests with the first line of their message, so the tail of a CI log says what broke. */
function failures(r, kind) {
  const out = [];
  if (kind === 'vitest') {
    for (const f of r.testResults ?? []) {
      const file = relative(root, f.name);
      const failedTests = (f.assertionResults ?? []).filter((a) => a.status === 'failed');
      for (const a of failedTests) out.push(`${file} › ${a.fullName ?? a.title}: ${firstLine(a.failureMessages?.[0])}`);
      if (!failedTests.length && f.status === 'failed') out.push(`${file}: ${firstLine(f.message)}`);
    }
    return out;
  }
  const walk = (suite, path) => {
    for (const spec of suite.specs ?? []) {
      for (const t of spec.tests ?? []) {
        if (t.status === 'unexpected' || t.status === 'flaky') {
          const err = t.results?.find((x) => x.error)?.error;
          out.push(`${spec.file} › ${[...path, spec.title].join(' › ')}: ${firstLine(err?.message)}`);
        }
      }
    }
    for (const child of suite.suites ?? []) walk(child, suite.title && !suite.title.endsWith('.ts') ? [...path, suite.title] : path);
  };
  try {
    for (const s of r.suites ?? []) walk(s, []);
  } catch {
    // A report shape we do not know only costs the list of names, never the summary.
  }
  return out;
}

function counts(file, kind) {
  if (!existsSync(file)) return null;
  const r = JSON.parse(readFileSync(file, 'utf8'));
  if (kind === 'vitest') return { passed: r.numPassedTests, failed: r.numFailedTests, skipped: r.numPendingTests + r.numTodoTests, failures: failures(r, kind) };
  const s = r.stats; // playwright
  return { passed: s.expected, failed: s.unexpected + (s.flaky ?? 0), skipped: s.skipped, failures: failures(r, kind) };
}

function layer(name, cmd, args, report, kind, extraEnv = {}) {
  console.log(`\n━━ ${name} ━━`);
  const status = run(cmd, args, { cwd: root, env: { ...env, ...extraEnv } });
  const c = counts(report, kind) ?? { passed: 0, failed: status === 0 ? 0 : 1, skipped: 0 };
  results.push({ name, status, ...c });
}

let exitCode = 0;
try {
  if (run(bin_('tsx'), ['db/migrate.ts'], { cwd: root, env }) !== 0) throw new Error('migrations failed');

  if (want('unit')) {
    const report = join(work, 'unit.json');
    layer('unit', bin_('vitest'), ['run', '--project', 'unit', '--reporter=default', '--reporter=json', `--outputFile.json=${report}`, ...filters], report, 'vitest');
  }
  if (want('integ')) {
    const report = join(work, 'integ.json');
    layer('integration (PostgreSQL)', bin_('vitest'), ['run', '--project', 'integ', '--reporter=default', '--reporter=json', `--outputFile.json=${report}`, ...filters], report, 'vitest');
  }
  if (want('e2e')) {
    console.log('\n━━ browser: production build ━━');
    if (run(bin_('tsx'), ['db/seed.ts'], { cwd: root, env }) !== 0) throw new Error('seeding failed');
    if (run(bin_('next'), ['build'], { cwd: root, env: { ...env, NODE_ENV: 'production' } }) !== 0) {
      results.push({ name: 'browser (build)', status: 1, passed: 0, failed: 1, skipped: 0 });
    } else {
      markBuilt(root);
      const catcher = startService(bin_('tsx'), ['scripts/mail-catcher.ts'], { cwd: root, env });
      services.push(catcher);
      await waitForPort(mailPort, 20_000);
      const report = join(work, 'e2e.json');
      layer('browser (Chromium)', bin_('playwright'), ['test', ...filters], report, 'playwright', { PLAYWRIGHT_JSON_OUTPUT_NAME: report });
    }
  }
} catch (err) {
  console.error(`pulseloom: ${err.message}`);
  exitCode = 1;
} finally {
  cleanup();
}

console.log('\n━━ summary ━━');
let passed = 0;
let failed = 0;
let skipped = 0;
for (const r of results) {
  console.log(`${r.status === 0 ? 'ok  ' : 'FAIL'} ${r.name.padEnd(26)} ${r.passed} passed, ${r.failed} failed${r.skipped ? `, ${r.skipped} skipped` : ''}`);
  for (const f of r.failures ?? []) console.log(`     ✗ ${f}`);
  passed += r.passed;
  failed += r.failed;
  skipped += r.skipped;
  if (r.status !== 0) exitCode = 1;
}
console.log(`${passed} passed, ${failed} failed${skipped ? `, ${skipped} skipped` : ''}`);
process.exit(exitCode);
