/**
 * Bearer-token authentication for the rig API. A token is accepted only from the
 * Authorization header: URLs end up in proxy logs, shell history and browser caches.
 * Failed attempts count against the caller's address; past the limit every request
 * from it gets 429 until the window passes, before any token is looked up. A token that
 * passed is kept a few seconds in memory (token-cache.ts) to spare a rig loop the lookup.
 */
import { findTokenByHash, touchToken } from '@/db/queries/rig-api';
import { checkRigToken, clientAddress, recordRigTokenFailure } from '@/lib/auth/rate-limit';
import { hashSecret } from '@/lib/auth/tokens';
import { AppError } from '@/lib/http/errors';
import { TOKEN_PREFIX } from '@/lib/rigs/schema';
import { cachedToken, rememberToken } from './token-cache';

export type RigAuth = {
  token: { id: string; name: string };
  rig: { id: string; name: string; modality: 'optical' | 'electrical'; clockHz: number };
  labId: string;
  address: string;
};

const CHALLENGE = 'Bearer realm="pulseloom-rig"';

function unauthorized(message: string, error = 'invalid_token'): AppError {
  return new AppError(401, 'unauthenticated', message, [], {
    'WWW-Authenticate': `${CHALLENGE}, error="${error}"`,
    'Cache-Control': 'no-store',
  });
}

/** Query parameters that look like a credential: a named token or any value with our prefix. */
function tokenInUrl(url: URL): boolean {
  for (const [k, v] of url.searchParams) {
    if (/^(access_)?token$|^key$|^auth/i.test(k) || v.startsWith(TOKEN_PREFIX)) return true;
  }
  return false;
}

export async function authenticateRig(request: Request): Promise<RigAuth> {
  const address = clientAddress(request.headers);
  const limit = await checkRigToken(address);
  if (!limit.allowed) {
    throw new AppError(429, 'rate_limited', `Too many failed token attempts from this address. Try again in ${limit.retryAfterS} s.`, [], {
      'Retry-After': String(limit.retryAfterS),
    });
  }

  if (tokenInUrl(new URL(request.url))) {
    await recordRigTokenFailure(address);
    throw new AppError(400, 'token_in_url', 'Rig tokens are accepted only in the Authorization header, never in the URL. Revoke a token that has been put in a URL: it may now be in logs.', [
      { path: '(query)', message: 'remove the token from the URL and send "Authorization: Bearer <token>"' },
    ]);
  }

  const header = request.headers.get('authorization');
  if (!header) throw new AppError(401, 'unauthenticated', 'Send the rig token as "Authorization: Bearer <token>".', [], { 'WWW-Authenticate': CHALLENGE, 'Cache-Control': 'no-store' });
  const m = /^Bearer[ ]+([A-Za-z0-9_\-]{1,200})[ ]*$/i.exec(header);
  if (!m) {
    await recordRigTokenFailure(address);
    throw unauthorized('The Authorization header must be "Bearer <token>".', 'invalid_request');
  }

  const tokenHash = hashSecret(m[1]!);
  const now = Date.now();
  let token = cachedToken(tokenHash, now);
  if (!token) {
    const row = await findTokenByHash({ tokenHash });
    let refusal: string | null = null;
    if (!row) refusal = 'This token is not valid.';
    else if (row.revokedAt) refusal = 'This token has been revoked. Ask a lab admin for a new one.';
    else if (row.rig.archivedAt) refusal = 'The rig of this token is archived.';
    if (refusal || !row) {
      await recordRigTokenFailure(address);
      throw unauthorized(refusal ?? 'This token is not valid.');
    }
    token = { id: row.id, name: row.name, labId: row.labId, expiresAt: row.expiresAt, lastUsedAt: row.lastUsedAt, rig: row.rig };
    if (row.expiresAt.getTime() > now) rememberToken(tokenHash, token, now);
  }
  if (token.expiresAt.getTime() <= now) {
    await recordRigTokenFailure(address);
    throw unauthorized('This token has expired. Ask a lab admin for a new one.');
  }

  if (!token.lastUsedAt || now - token.lastUsedAt.getTime() > 60_000) {
    await touchToken({ tokenId: token.id });
    token.lastUsedAt = new Date(now);
  }
  return {
    token: { id: token.id, name: token.name },
    rig: { id: token.rig.id, name: token.rig.name, modality: token.rig.modality, clockHz: token.rig.clockHz },
    labId: token.labId,
    address,
  };
}
