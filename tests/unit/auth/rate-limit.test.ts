import { describe, expect, it } from 'vitest';
import { checkRigToken, checkSignIn, clientAddress, recordRigTokenFailure, recordSignInFailure } from '@/lib/auth/rate-limit';

describe('sign-in failure limits', () => {
  it('slows an account after five failures, whatever the address', async () => {
    const email = `victim-${Math.random()}@example.test`;
    for (let i = 0; i < 5; i++) {
      expect((await checkSignIn(email, `10.0.0.${i}`)).allowed).toBe(true);
      await recordSignInFailure(email, `10.0.0.${i}`);
    }
    const blocked = await checkSignIn(email.toUpperCase(), '10.0.0.99');
    expect(blocked.allowed).toBe(false);
    if (!blocked.allowed) expect(blocked.retryAfterS).toBeGreaterThan(0);
    expect((await checkSignIn(`someone-else-${Math.random()}@example.test`, '10.0.0.99')).allowed).toBe(true);
  });

  it('slows an address after twenty failures across accounts', async () => {
    const address = `192.0.2.${Math.floor(Math.random() * 250)}-${Math.random()}`;
    for (let i = 0; i < 20; i++) await recordSignInFailure(`spray-${i}-${Math.random()}@example.test`, address);
    expect((await checkSignIn(`fresh-${Math.random()}@example.test`, address)).allowed).toBe(false);
    expect((await checkSignIn(`fresh-${Math.random()}@example.test`, 'another-address')).allowed).toBe(true);
  });

  it('limits failed rig tokens per address', async () => {
    const address = `rig-${Math.random()}`;
    for (let i = 0; i < 10; i++) await recordRigTokenFailure(address);
    expect((await checkRigToken(address)).allowed).toBe(false);
    expect((await checkRigToken(`${address}-other`)).allowed).toBe(true);
  });
});

describe('clientAddress', () => {
  it('takes the first forwarded address, then x-real-ip, else local', () => {
    expect(clientAddress(new Headers({ 'x-forwarded-for': '203.0.113.5, 10.0.0.1' }))).toBe('203.0.113.5');
    expect(clientAddress(new Headers({ 'x-real-ip': '203.0.113.9' }))).toBe('203.0.113.9');
    expect(clientAddress(new Headers())).toBe('local');
  });
});
