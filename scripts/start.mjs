// `npm start`: dependencies, private PostgreSQL, migrations, demo data, fake SMTP, build, serve.
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { ensureDependencies } from './lib/deps.mjs';
import { clusterRunning, ensurePostgresInstalled, startCluster, stopCluster } from './lib/pg.mjs';
import { fail, portFree, run, startService, stopService, waitForPort } from './lib/proc.mjs';
import { buildIsCurrent, markBuilt } from './lib/build.mjs';
import { authSecret, DEMO_PASSWORD, DEMO_SIGN_INS } from './lib/config.mjs';

const root = fileURLToPath(new URL('..', import.meta.url));
const dataRoot = join(root, '.data');
const appPort = Number(process.env.PORT ?? 3000);
const pgPort = Number(process.env.PULSELOOM_PG_PORT ?? 54329);
const mailPort = Number(process.env.MAIL_CATCHER_PORT ?? 2525);
const host = '127.0.0.1';
const dev = process.argv.includes('--dev');

ensureDependencies(root);
const bin = ensurePostgresInstalled();

if (!(await portFree(appPort, host))) fail(`port ${appPort} is taken; set PORT to another port or stop what is using it.`);
if (!process.env.SMTP_URL && !(await portFree(mailPort, host))) {
  fail(`port ${mailPort} (fake SMTP) is taken; set MAIL_CATCHER_PORT to another port.`);
}

const pgData = join(dataRoot, 'pg');
if (!process.env.DATABASE_URL && !clusterRunning(bin, pgData) && !(await portFree(pgPort, host))) {
  fail(`port ${pgPort} (PostgreSQL) is taken; set PULSELOOM_PG_PORT to another port.`);
}
const databaseUrl = process.env.DATABASE_URL ?? startCluster({ bin, dataDir: pgData, port: pgPort, database: 'pulseloom' });
// Auth.js builds its links on localhost; one host everywhere keeps cookies and links together.
const appUrl = process.env.APP_URL ?? `http://localhost:${appPort}`;
const env = {
  ...process.env,
  DATABASE_URL: databaseUrl,
  AUTH_SECRET: authSecret(dataRoot),
  AUTH_URL: process.env.AUTH_URL ?? appUrl,
  AUTH_TRUST_HOST: 'true',
  APP_URL: appUrl,
  MAIL_CATCHER_PORT: String(mailPort),
  // The fake mailbox page is on whenever the fake SMTP server is the one receiving mail.
  PULSELOOM_DEV_MAILBOX: process.env.PULSELOOM_DEV_MAILBOX ?? (process.env.SMTP_URL ? '0' : '1'),
  NEXT_TELEMETRY_DISABLED: '1',
};

const tsx = join(root, 'node_modules', '.bin', 'tsx');
const next = join(root, 'node_modules', '.bin', 'next');
if (run(tsx, ['db/migrate.ts'], { cwd: root, env }) !== 0) fail('migrations failed; see the output above.');
if (run(tsx, ['db/seed.ts'], { cwd: root, env }) !== 0) fail('loading the demo data failed; see the output above.');

const services = [];
let stopping = false;
function shutdown(code = 0) {
  if (stopping) return;
  stopping = true;
  console.log('\npulseloom: stopping…');
  for (const s of services.reverse()) stopService(s);
  setTimeout(() => {
    if (!process.env.DATABASE_URL) stopCluster(bin, pgData);
    console.log('pulseloom: stopped.');
    process.exit(code);
  }, 500);
}
process.on('SIGINT', () => shutdown(0));
process.on('SIGTERM', () => shutdown(0));

if (!process.env.SMTP_URL) {
  services.push(startService(tsx, ['scripts/mail-catcher.ts'], { cwd: root, env, detached: true }));
}

if (!dev && !buildIsCurrent(root)) {
  console.log('pulseloom: building the app (next build)…');
  if (run(next, ['build'], { cwd: root, env: { ...env, NODE_ENV: 'production' } }) !== 0) {
    shutdown(1);
    await new Promise(() => {});
  }
  markBuilt(root);
}

const app = startService(next, [dev ? 'dev' : 'start', '-H', host, '-p', String(appPort)], {
  cwd: root,
  env: { ...env, NODE_ENV: dev ? 'development' : 'production' },
});
services.push(app);
app.on('exit', (code) => {
  if (!stopping) {
    console.error(`pulseloom: the app exited (code ${code}).`);
    shutdown(code ?? 1);
  }
});

if (await waitForPort(appPort, 60_000, host)) {
  console.log(`\nPulseloom is running at ${appUrl}`);
  console.log('Demo sign-ins (password for all: ' + DEMO_PASSWORD + '):');
  for (const [role, email] of DEMO_SIGN_INS) console.log(`  ${role.padEnd(15)} ${email}`);
  if (env.PULSELOOM_DEV_MAILBOX === '1') console.log(`Development mailbox: ${appUrl}/dev/mailbox`);
  console.log('Press Ctrl-C to stop the app, the mail server and PostgreSQL.\n');
}
