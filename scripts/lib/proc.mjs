// Small process helpers for the start and test scripts: plain Node, no dependencies,
// because they run before `npm ci` has installed anything.
import { spawn, spawnSync } from 'node:child_process';
import net from 'node:net';

export function run(cmd, args, opts = {}) {
  const res = spawnSync(cmd, args, { stdio: 'inherit', ...opts });
  if (res.error) throw res.error;
  return res.status ?? 1;
}

export function runQuiet(cmd, args, opts = {}) {
  return spawnSync(cmd, args, { encoding: 'utf8', ...opts });
}

/** Starts a long-running child in its own process group so the whole tree can be stopped. */
export function startService(cmd, args, opts = {}) {
  return spawn(cmd, args, { stdio: 'inherit', detached: true, ...opts });
}

export function stopService(child, signal = 'SIGTERM') {
  if (!child || child.exitCode !== null || child.pid === undefined) return;
  try {
    process.kill(-child.pid, signal);
  } catch {
    /* already gone */
  }
}

export function portFree(port, host = '127.0.0.1') {
  return new Promise((resolve) => {
    const srv = net.createServer();
    srv.once('error', () => resolve(false));
    srv.listen(port, host, () => srv.close(() => resolve(true)));
  });
}

/** A free port chosen by the kernel (for throwaway test services). */
export function freePort() {
  return new Promise((resolve, reject) => {
    const srv = net.createServer();
    srv.once('error', reject);
    srv.listen(0, '127.0.0.1', () => {
      const { port } = srv.address();
      srv.close(() => resolve(port));
    });
  });
}

export async function waitForPort(port, timeoutMs = 30_000, host = '127.0.0.1') {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    const open = await new Promise((resolve) => {
      const s = net.connect(port, host);
      s.once('connect', () => (s.destroy(), resolve(true)));
      s.once('error', () => resolve(false));
    });
    if (open) return true;
    await new Promise((r) => setTimeout(r, 150));
  }
  return false;
}

export function fail(message) {
  console.error(`pulseloom: ${message}`);
  process.exit(1);
}
