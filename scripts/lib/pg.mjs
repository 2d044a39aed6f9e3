// A private PostgreSQL cluster for Pulseloom: Debian's server binaries, a data folder of
// our own, listening on 127.0.0.1 only, with its socket inside the data folder.
import { chownSync, existsSync, mkdirSync, readdirSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { run, runQuiet, fail } from './proc.mjs';

const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;

export function findPgBin() {
  const base = '/usr/lib/postgresql';
  if (!existsSync(base)) return null;
  const versions = readdirSync(base)
    .filter((v) => existsSync(join(base, v, 'bin', 'initdb')))
    .sort((a, b) => Number(b) - Number(a));
  return versions.length ? join(base, versions[0], 'bin') : null;
}

/** Debian's PostgreSQL server, installed with apt-get when missing and we are root. */
export function ensurePostgresInstalled() {
  let bin = findPgBin();
  if (bin) return bin;
  if (!isRoot) fail("PostgreSQL's server is not installed. Run: sudo apt-get install -y postgresql");
  console.log('pulseloom: installing PostgreSQL (apt-get)…');
  run('apt-get', ['update', '-qq']);
  if (run('apt-get', ['install', '-y', '-qq', 'postgresql']) !== 0) fail('apt-get install postgresql failed.');
  bin = findPgBin();
  if (!bin) fail('PostgreSQL was installed but its binaries were not found under /usr/lib/postgresql.');
  return bin;
}

function asOwner(bin, tool, args) {
  const cmd = join(bin, tool);
  return isRoot ? runQuiet('runuser', ['-u', 'postgres', '--', cmd, ...args]) : runQuiet(cmd, args);
}

export function clusterRunning(bin, dataDir) {
  if (!existsSync(join(dataDir, 'PG_VERSION'))) return false;
  return asOwner(bin, 'pg_ctl', ['-D', dataDir, 'status']).status === 0;
}

/** Creates (once) and starts the cluster; returns the connection URL of `database`. */
export function startCluster({ bin, dataDir, port, database, throwaway = false }) {
  const log = join(dataDir, 'server.log');
  if (!existsSync(join(dataDir, 'PG_VERSION'))) {
    mkdirSync(dataDir, { recursive: true });
    if (isRoot) {
      // initdb refuses root: the cluster belongs to the postgres system user.
      const ids = runQuiet('id', ['-u', 'postgres']);
      const gid = runQuiet('id', ['-g', 'postgres']);
      chownSync(dataDir, Number(ids.stdout.trim()), Number(gid.stdout.trim()));
    }
    const init = asOwner(bin, 'initdb', ['-D', dataDir, '-U', 'postgres', '-A', 'trust', '-E', 'UTF8', '--no-locale']);
    if (init.status !== 0) fail(`initdb failed: ${(init.stderr || init.stdout).trim().split('\n').pop()}`);
  }
  if (!clusterRunning(bin, dataDir)) {
    const start = asOwner(bin, 'pg_ctl', [
      '-D', dataDir, '-l', log, '-w', '-t', '30',
      // Test clusters are thrown away, so they skip the durability work.
      '-o', `-c listen_addresses=127.0.0.1 -p ${port} -k ${dataDir}${throwaway ? ' -c fsync=off -c full_page_writes=off -c synchronous_commit=off' : ''}`,
      'start',
    ]);
    if (start.status !== 0) fail(`PostgreSQL did not start on 127.0.0.1:${port}; see ${log}`);
  }
  const exists = runQuiet(join(bin, 'psql'), ['-h', '127.0.0.1', '-p', String(port), '-U', 'postgres', '-tAc',
    `SELECT 1 FROM pg_database WHERE datname = '${database}'`]);
  if (exists.status !== 0) fail(`cannot reach PostgreSQL on 127.0.0.1:${port}; see ${log}`);
  if (exists.stdout.trim() !== '1') {
    const created = runQuiet(join(bin, 'createdb'), ['-h', '127.0.0.1', '-p', String(port), '-U', 'postgres', database]);
    if (created.status !== 0) fail(`createdb ${database} failed: ${created.stderr.trim()}`);
  }
  return `postgres://postgres@127.0.0.1:${port}/${database}`;
}

export function stopCluster(bin, dataDir) {
  if (clusterRunning(bin, dataDir)) asOwner(bin, 'pg_ctl', ['-D', dataDir, '-m', 'fast', '-w', 'stop']);
}

export function removeCluster(bin, dataDir) {
  stopCluster(bin, dataDir);
  rmSync(dataDir, { recursive: true, force: true });
}
