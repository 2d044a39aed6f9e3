/**
 * Who may move a protocol version from which state to which. Pure: the server runs it
 * before every change and the pages use it to decide which buttons to show, so the two
 * never disagree. The database adds its own guards (approved rows are immutable).
 */
import { may, type Permission, type Role } from '@/lib/auth/roles';
import type { VersionStatus } from './status';

export type VersionAction = 'edit' | 'submit' | 'approve' | 'return' | 'withdraw' | 'copy';

export type Actor = {
  roles: readonly Role[];
  /** True when this person wrote, edited or submitted the version. */
  contributed: boolean;
};

type Rule = {
  action: VersionAction;
  from: VersionStatus;
  /** The state after the action; for `copy`, the state of the new version. */
  to: VersionStatus;
  permission: Permission;
  /** Separation of duties: a contributor may not decide; only a contributor may pull back. */
  contributor?: 'forbidden' | 'required';
};

const RULES: readonly Rule[] = [
  { action: 'edit', from: 'draft', to: 'draft', permission: 'protocols.edit' },
  { action: 'submit', from: 'draft', to: 'in_review', permission: 'protocols.submit' },
  { action: 'approve', from: 'in_review', to: 'approved', permission: 'reviews.decide', contributor: 'forbidden' },
  { action: 'return', from: 'in_review', to: 'returned', permission: 'reviews.decide', contributor: 'forbidden' },
  // The author pulls a submission back; an officer takes an approved version off the rigs.
  { action: 'withdraw', from: 'in_review', to: 'withdrawn', permission: 'protocols.submit', contributor: 'required' },
  { action: 'withdraw', from: 'approved', to: 'withdrawn', permission: 'reviews.decide' },
  { action: 'copy', from: 'returned', to: 'draft', permission: 'protocols.edit' },
  { action: 'copy', from: 'approved', to: 'draft', permission: 'protocols.edit' },
  { action: 'copy', from: 'withdrawn', to: 'draft', permission: 'protocols.edit' },
];

export const ACTION_LABELS: Record<VersionAction, string> = {
  edit: 'Edit',
  submit: 'Submit for review',
  approve: 'Approve',
  return: 'Return with comments',
  withdraw: 'Withdraw',
  copy: 'Start a new version from this one',
};

export type Verdict =
  | { ok: true; to: VersionStatus }
  | { ok: false; reason: 'state' | 'role' | 'duty'; message: string };

const STATE_WORDS: Record<VersionStatus, string> = {
  draft: 'a draft',
  in_review: 'in review',
  approved: 'approved',
  returned: 'returned',
  withdrawn: 'withdrawn',
};

export function checkAction(action: VersionAction, status: VersionStatus, actor: Actor): Verdict {
  const rules = RULES.filter((r) => r.action === action && r.from === status);
  if (rules.length === 0) {
    return { ok: false, reason: 'state', message: `This version is ${STATE_WORDS[status]}; “${ACTION_LABELS[action]}” does not apply to it.` };
  }
  const allowed = rules.filter((r) => may(actor.roles, r.permission));
  if (allowed.length === 0) return { ok: false, reason: 'role', message: 'Your role in this lab does not allow this.' };
  for (const r of allowed) {
    if (r.contributor === 'forbidden' && actor.contributed) continue;
    if (r.contributor === 'required' && !actor.contributed) continue;
    return { ok: true, to: r.to };
  }
  const rule = allowed[0]!;
  return rule.contributor === 'forbidden'
    ? { ok: false, reason: 'duty', message: 'You wrote or edited this version, so another safety officer must decide it.' }
    : { ok: false, reason: 'duty', message: 'Only someone who wrote or submitted this version can pull it back from review.' };
}

/** Every action this person may take on a version in this state, in a stable order. */
export function availableActions(status: VersionStatus, actor: Actor): VersionAction[] {
  const order: VersionAction[] = ['edit', 'submit', 'approve', 'return', 'withdraw', 'copy'];
  return order.filter((a) => checkAction(a, status, actor).ok);
}

/** All (from, action) pairs the machine knows; for tests and documentation. */
export function transitions(): readonly { action: VersionAction; from: VersionStatus; to: VersionStatus }[] {
  return RULES.map(({ action, from, to }) => ({ action, from, to }));
}
