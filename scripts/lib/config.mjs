import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';

/** A per-installation AUTH_SECRET kept in the git-ignored data folder (or taken from the environment). */
export function authSecret(dataRoot) {
  if (process.env.AUTH_SECRET) return process.env.AUTH_SECRET;
  const file = join(dataRoot, 'auth-secret');
  if (!existsSync(file)) {
    mkdirSync(dataRoot, { recursive: true });
    writeFileSync(file, randomBytes(32).toString('base64url'), { mode: 0o600 });
  }
  return readFileSync(file, 'utf8').trim();
}

export const DEMO_SIGN_INS = [
  ['Experimenter', 'ada.quill@harborlane.test'],
  ['Safety officer', 'tomas.reyes@harborlane.test'],
  ['Lab admin', 'noor.hale@harborlane.test'],
];
export const DEMO_PASSWORD = 'pulseloom-demo';
