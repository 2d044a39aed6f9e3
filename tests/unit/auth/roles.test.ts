import { describe, expect, it } from 'vitest';
import { may, PERMISSIONS, ROLES, type Permission, type Role } from '@/lib/auth/roles';

describe('may(roles, permission)', () => {
  it('lets only safety officers decide reviews', () => {
    expect(may(['safety_officer'], 'reviews.decide')).toBe(true);
    expect(may(['experimenter'], 'reviews.decide')).toBe(false);
    expect(may(['lab_admin'], 'reviews.decide')).toBe(false);
  });

  it('lets only lab admins manage members, rigs and rig tokens', () => {
    for (const p of ['members.manage', 'rigs.manage', 'tokens.manage'] as Permission[]) {
      expect(may(['lab_admin'], p)).toBe(true);
      expect(may(['experimenter', 'safety_officer'], p)).toBe(false);
    }
  });

  it('lets experimenters edit and submit, and nobody else', () => {
    for (const p of ['envelopes.edit', 'protocols.edit', 'protocols.submit'] as Permission[]) {
      expect(may(['experimenter'], p)).toBe(true);
      expect(may(['safety_officer', 'lab_admin'], p)).toBe(false);
    }
  });

  it('unions the permissions of several roles', () => {
    expect(may(['experimenter', 'safety_officer'], 'reviews.decide')).toBe(true);
    expect(may(['experimenter', 'safety_officer'], 'protocols.submit')).toBe(true);
  });

  it('grants nothing to a member without roles', () => {
    for (const p of Object.keys(PERMISSIONS) as Permission[]) expect(may([], p)).toBe(false);
  });

  it('gives every role at least the lab overview, and every permission to some role', () => {
    for (const r of ROLES) expect(may([r as Role], 'lab.view')).toBe(true);
    for (const [p, roles] of Object.entries(PERMISSIONS)) expect(roles.length, p).toBeGreaterThan(0);
  });
});
