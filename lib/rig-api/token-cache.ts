/**
 * Tokens that just passed authentication, kept for a few seconds so that a rig fetching
 * in a loop does not cost a database round trip per request for the token alone.
 *
 * Only valid tokens are kept (unknown secrets never are, so guessing cannot fill it).
 * Expiry is checked against the kept row on every use. Revoking a token or archiving its
 * rig (lib/rigs/manage.ts) drops it at once; the TTL bounds how long a change made
 * outside this process — another server process, a manual SQL edit — can go unseen.
 */
export const TOKEN_CACHE_TTL_MS = 5_000;
const MAX_ENTRIES = 1_000;

export type CachedToken = {
  id: string;
  name: string;
  labId: string;
  expiresAt: Date;
  lastUsedAt: Date | null;
  rig: { id: string; name: string; modality: 'optical' | 'electrical'; clockHz: number };
};

type Entry = { token: CachedToken; at: number };

// One map per server process, shared by the route handlers and the server actions.
const g = globalThis as unknown as { pulseloomRigTokens?: Map<string, Entry> };
const entries: Map<string, Entry> = (g.pulseloomRigTokens ??= new Map());

export function cachedToken(tokenHash: string, now = Date.now()): CachedToken | undefined {
  const e = entries.get(tokenHash);
  if (!e) return undefined;
  if (now - e.at > TOKEN_CACHE_TTL_MS) {
    entries.delete(tokenHash);
    return undefined;
  }
  return e.token;
}

export function rememberToken(tokenHash: string, token: CachedToken, now = Date.now()): void {
  if (entries.size >= MAX_ENTRIES && !entries.has(tokenHash)) entries.delete(entries.keys().next().value!);
  entries.set(tokenHash, { token, at: now });
}

/** After a revocation or an archived rig: the next request reads the database again. */
export function forgetTokens(match: { tokenId?: string; rigId?: string }): void {
  for (const [hash, e] of entries) {
    if ((match.tokenId && e.token.id === match.tokenId) || (match.rigId && e.token.rig.id === match.rigId)) entries.delete(hash);
  }
}
