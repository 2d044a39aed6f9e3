import { createHash, randomBytes } from 'node:crypto';

/** 256 bits of randomness, URL-safe; only its SHA-256 is ever stored. */
export function newSecret(prefix = ''): string {
  return prefix + randomBytes(32).toString('base64url');
}

export function hashSecret(secret: string): string {
  return createHash('sha256').update(secret, 'utf8').digest('hex');
}
