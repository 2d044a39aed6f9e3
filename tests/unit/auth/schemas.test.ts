import { describe, expect, it } from 'vitest';
import { inviteSchema, memberRolesSchema, passwordSignInSchema } from '@/lib/auth/schemas';
import { formatPath, zodIssues } from '@/lib/http/errors';

describe('inviteSchema', () => {
  it('normalises the address and keeps the roles', () => {
    const r = inviteSchema.parse({ email: '  Lee.Park@Example.TEST ', roles: ['experimenter'] });
    expect(r).toEqual({ email: 'lee.park@example.test', roles: ['experimenter'] });
  });

  it('names the field and the reason for each problem', () => {
    const r = inviteSchema.safeParse({ email: 'not-an-address', roles: [] });
    expect(r.success).toBe(false);
    if (r.success) return;
    const issues = zodIssues(r.error);
    expect(issues).toContainEqual({ path: 'email', message: 'Enter an e-mail address' });
    expect(issues).toContainEqual({ path: 'roles', message: 'Pick at least one role' });
  });

  it('refuses a role that does not exist', () => {
    const r = inviteSchema.safeParse({ email: 'a@b.test', roles: ['owner'] });
    expect(r.success).toBe(false);
    if (!r.success) expect(zodIssues(r.error)[0]!.path).toBe('roles[0]');
  });
});

describe('memberRolesSchema', () => {
  it('keeps at least one role', () => {
    const r = memberRolesSchema.safeParse({ userId: '1b9d6bcd-bbfd-4b2d-9b5d-ab8dfbbd4bed', roles: [] });
    expect(r.success).toBe(false);
  });
});

describe('passwordSignInSchema', () => {
  it('accepts an address and a password', () => {
    expect(passwordSignInSchema.parse({ email: 'A@B.test', password: 'x' })).toEqual({ email: 'a@b.test', password: 'x' });
  });
  it('refuses an empty password and an over-long one', () => {
    expect(passwordSignInSchema.safeParse({ email: 'a@b.test', password: '' }).success).toBe(false);
    expect(passwordSignInSchema.safeParse({ email: 'a@b.test', password: 'x'.repeat(201) }).success).toBe(false);
  });
});

describe('formatPath', () => {
  it('writes JSON paths the way error lists show them', () => {
    expect(formatPath(['envelope', 3, 'toHz'])).toBe('envelope[3].toHz');
    expect(formatPath([])).toBe('(root)');
  });
});
