import { createHash } from 'node:crypto';
import { existsSync, readFileSync, readdirSync, statSync, writeFileSync } from 'node:fs';
import { join, relative } from 'node:path';

const SOURCES = ['app', 'components', 'lib', 'db', 'public'];
const FILES = ['package-lock.json', 'next.config.ts', 'tailwind.config.ts', 'postcss.config.mjs', 'tsconfig.json'];

function walk(dir, out) {
  if (!existsSync(dir)) return;
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const p = join(dir, entry.name);
    if (entry.isDirectory()) walk(p, out);
    else out.push(p);
  }
}

/** A fingerprint of everything the production build reads, to skip rebuilding unchanged code. */
export function sourceFingerprint(root) {
  const files = [];
  for (const d of SOURCES) walk(join(root, d), files);
  for (const f of FILES) if (existsSync(join(root, f))) files.push(join(root, f));
  const h = createHash('sha256');
  for (const f of files.sort()) h.update(`${relative(root, f)}:${statSync(f).size}:${statSync(f).mtimeMs}\n`);
  return h.digest('hex');
}

const distDir = () => process.env.PULSELOOM_DIST_DIR ?? '.next';

export function buildIsCurrent(root) {
  const stamp = join(root, distDir(), 'pulseloom-build-stamp');
  return existsSync(join(root, distDir(), 'BUILD_ID')) && existsSync(stamp) && readFileSync(stamp, 'utf8') === sourceFingerprint(root);
}

export function markBuilt(root) {
  writeFileSync(join(root, distDir(), 'pulseloom-build-stamp'), sourceFingerprint(root));
}
