import { existsSync } from 'node:fs';
import { run, fail } from './proc.mjs';

export const CHROMIUM = '/usr/bin/chromium';

/** Debian's Chromium for the browser tests (Playwright cannot download browsers here). */
export function ensureChromium() {
  if (existsSync(CHROMIUM)) return;
  if (process.getuid?.() !== 0) fail('Chromium is missing. Run: sudo apt-get install -y chromium');
  console.log('pulseloom: installing Chromium (apt-get)…');
  run('apt-get', ['update', '-qq']);
  if (run('apt-get', ['install', '-y', '-qq', 'chromium']) !== 0 || !existsSync(CHROMIUM)) fail('apt-get install chromium failed.');
}
