import { describe, expect, it } from 'vitest';
import { availableActions, checkAction, transitions, type VersionAction } from '@/lib/versions/machine';
import { VERSION_STATUSES, type VersionStatus } from '@/lib/versions/status';
import type { Role } from '@/lib/auth/roles';

// The rules as the product brief states them, written out by hand (not derived from the
// machine): drafts are edited and submitted by experimenters; only a safety officer who
// did not write the version decides it; approved versions can only be withdrawn; any
// non-draft outcome except "in review" can seed a new draft.
type Case = { status: VersionStatus; action: VersionAction; role: Role; contributed: boolean };
const ALLOWED: Case[] = [
  { status: 'draft', action: 'edit', role: 'experimenter', contributed: true },
  { status: 'draft', action: 'edit', role: 'experimenter', contributed: false },
  { status: 'draft', action: 'submit', role: 'experimenter', contributed: true },
  { status: 'draft', action: 'submit', role: 'experimenter', contributed: false },
  { status: 'in_review', action: 'approve', role: 'safety_officer', contributed: false },
  { status: 'in_review', action: 'return', role: 'safety_officer', contributed: false },
  { status: 'in_review', action: 'withdraw', role: 'experimenter', contributed: true },
  { status: 'approved', action: 'withdraw', role: 'safety_officer', contributed: false },
  { status: 'approved', action: 'withdraw', role: 'safety_officer', contributed: true },
  ...(['returned', 'approved', 'withdrawn'] as const).flatMap((status) =>
    [true, false].map((contributed) => ({ status, action: 'copy' as const, role: 'experimenter' as const, contributed })),
  ),
];

const ACTIONS: VersionAction[] = ['edit', 'submit', 'approve', 'return', 'withdraw', 'copy'];
const ROLES: Role[] = ['experimenter', 'safety_officer', 'lab_admin'];

describe('version state machine, one role at a time', () => {
  for (const status of VERSION_STATUSES) {
    for (const action of ACTIONS) {
      for (const role of ROLES) {
        for (const contributed of [false, true]) {
          const expected = ALLOWED.some((c) => c.status === status && c.action === action && c.role === role && c.contributed === contributed);
          it(`${role}${contributed ? ' (contributor)' : ''} ${expected ? 'may' : 'may not'} ${action} a ${status} version`, () => {
            expect(checkAction(action, status, { roles: [role], contributed }).ok).toBe(expected);
          });
        }
      }
    }
  }
});

describe('transition targets', () => {
  it('goes where the brief says', () => {
    const officer = { roles: ['safety_officer'] as Role[], contributed: false };
    const exp = { roles: ['experimenter'] as Role[], contributed: true };
    expect(checkAction('submit', 'draft', exp)).toEqual({ ok: true, to: 'in_review' });
    expect(checkAction('approve', 'in_review', officer)).toEqual({ ok: true, to: 'approved' });
    expect(checkAction('return', 'in_review', officer)).toEqual({ ok: true, to: 'returned' });
    expect(checkAction('withdraw', 'approved', officer)).toEqual({ ok: true, to: 'withdrawn' });
    expect(checkAction('copy', 'returned', exp)).toEqual({ ok: true, to: 'draft' });
  });

  it('never leaves approved except to withdrawn, and never leaves withdrawn', () => {
    for (const t of transitions()) {
      if (t.action === 'copy') continue; // copying makes a new row; the source is untouched
      if (t.from === 'approved') expect(t.to).toBe('withdrawn');
      expect(t.from).not.toBe('withdrawn');
    }
  });
});

describe('separation of duties', () => {
  it('stops an author who is also a safety officer from approving or returning their own version', () => {
    const both = { roles: ['experimenter', 'safety_officer'] as Role[], contributed: true };
    const approve = checkAction('approve', 'in_review', both);
    expect(approve).toMatchObject({ ok: false, reason: 'duty' });
    expect(checkAction('return', 'in_review', both)).toMatchObject({ ok: false, reason: 'duty' });
    // The same person may decide someone else's version.
    expect(checkAction('approve', 'in_review', { ...both, contributed: false }).ok).toBe(true);
  });

  it('lets a contributor with both roles pull their submission back, and nothing else in review', () => {
    const both = { roles: ['experimenter', 'safety_officer'] as Role[], contributed: true };
    expect(availableActions('in_review', both)).toEqual(['withdraw']);
  });

  it('explains why: state, role or duty', () => {
    expect(checkAction('edit', 'approved', { roles: ['experimenter'], contributed: true })).toMatchObject({ ok: false, reason: 'state' });
    expect(checkAction('approve', 'in_review', { roles: ['lab_admin'], contributed: false })).toMatchObject({ ok: false, reason: 'role' });
    expect(checkAction('withdraw', 'in_review', { roles: ['experimenter'], contributed: false })).toMatchObject({ ok: false, reason: 'duty' });
  });
});

describe('availableActions', () => {
  it('offers a lab admin nothing: they see protocols but do not design or decide them', () => {
    for (const s of VERSION_STATUSES) expect(availableActions(s, { roles: ['lab_admin'], contributed: false })).toEqual([]);
  });

  it('offers an experimenter edit and submit on a draft', () => {
    expect(availableActions('draft', { roles: ['experimenter'], contributed: false })).toEqual(['edit', 'submit']);
  });
});
