import { existsSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { run, fail } from './proc.mjs';

/** Installs dependencies when node_modules is missing or older than the lock file. */
export function ensureDependencies(root) {
  const lock = join(root, 'package-lock.json');
  const marker = join(root, 'node_modules', '.package-lock.json');
  const stale = !existsSync(marker) || (existsSync(lock) && statSync(lock).mtimeMs > statSync(marker).mtimeMs + 1000);
  if (!stale) return;
  console.log('pulseloom: installing dependencies (npm ci)…');
  const status = run('npm', ['ci', '--no-audit', '--no-fund', '--loglevel=error'], { cwd: root });
  if (status !== 0) fail('npm ci failed; see the output above.');
}
