import { z } from 'zod';

export const ROLES = ['experimenter', 'safety_officer', 'lab_admin'] as const;
export const roleSchema = z.enum(ROLES);
export type Role = z.infer<typeof roleSchema>;

export const ROLE_LABELS: Record<Role, string> = {
  experimenter: 'Experimenter',
  safety_officer: 'Safety officer',
  lab_admin: 'Lab admin',
};

/**
 * Who may do what inside a lab. One table, read by pages, route handlers and server actions,
 * so the navigation and the server never disagree.
 */
export const PERMISSIONS = {
  'lab.view': ['experimenter', 'safety_officer', 'lab_admin'],
  'envelopes.view': ['experimenter', 'safety_officer', 'lab_admin'],
  'envelopes.edit': ['experimenter'],
  'protocols.view': ['experimenter', 'safety_officer', 'lab_admin'],
  'protocols.edit': ['experimenter'],
  'protocols.submit': ['experimenter'],
  'reviews.view': ['safety_officer'],
  'reviews.decide': ['safety_officer'],
  'limits.manage': ['safety_officer', 'lab_admin'],
  'rigs.view': ['experimenter', 'safety_officer', 'lab_admin'],
  'rigs.manage': ['lab_admin'],
  'tokens.manage': ['lab_admin'],
  'members.manage': ['lab_admin'],
  'audit.view': ['safety_officer', 'lab_admin'],
  'exports.download': ['experimenter', 'safety_officer'],
} as const satisfies Record<string, readonly Role[]>;

export type Permission = keyof typeof PERMISSIONS;

export function may(roles: readonly Role[], permission: Permission): boolean {
  const allowed: readonly Role[] = PERMISSIONS[permission];
  return roles.some((r) => allowed.includes(r));
}
