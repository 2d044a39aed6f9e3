import { RateLimiterMemory, RateLimiterRes } from 'rate-limiter-flexible';

// In-process limiters: Pulseloom runs as one server process per lab installation, so
// memory is the honest store; a multi-process deployment would swap in a shared store.
const perAccount = new RateLimiterMemory({ keyPrefix: 'signin-account', points: 5, duration: 15 * 60 });
const perAddress = new RateLimiterMemory({ keyPrefix: 'signin-address', points: 20, duration: 15 * 60 });
const rigTokenFailures = new RateLimiterMemory({ keyPrefix: 'rig-token', points: 10, duration: 60 });

export type LimitCheck = { allowed: true } | { allowed: false; retryAfterS: number };

async function peek(limiter: RateLimiterMemory, key: string): Promise<LimitCheck> {
  const res = await limiter.get(key);
  if (res && res.consumedPoints >= limiter.points) {
    return { allowed: false, retryAfterS: Math.ceil(res.msBeforeNext / 1000) };
  }
  return { allowed: true };
}

async function spend(limiter: RateLimiterMemory, key: string): Promise<void> {
  try {
    await limiter.consume(key);
  } catch (e) {
    if (!(e instanceof RateLimiterRes)) throw e;
  }
}

/** Sign-in failures are counted per account and per address; success leaves counts alone. */
export async function checkSignIn(email: string, address: string): Promise<LimitCheck> {
  const a = await peek(perAccount, email.toLowerCase());
  if (!a.allowed) return a;
  return peek(perAddress, address);
}

export async function recordSignInFailure(email: string, address: string): Promise<void> {
  await Promise.all([spend(perAccount, email.toLowerCase()), spend(perAddress, address)]);
}

export async function checkRigToken(address: string): Promise<LimitCheck> {
  return peek(rigTokenFailures, address);
}

export async function recordRigTokenFailure(address: string): Promise<void> {
  await spend(rigTokenFailures, address);
}

/** The caller's address as the proxy in front of us reports it; loopback otherwise. */
export function clientAddress(headers: Headers): string {
  const fwd = headers.get('x-forwarded-for');
  if (fwd) return fwd.split(',')[0]!.trim();
  return headers.get('x-real-ip') ?? 'local';
}
