import type { Permission } from '@/lib/auth/roles';

export const NAV: { href: string; label: string; permission: Permission }[] = [
  { href: '/', label: 'Overview', permission: 'lab.view' },
  { href: '/envelopes', label: 'Envelopes', permission: 'envelopes.view' },
  { href: '/protocols', label: 'Protocols', permission: 'protocols.view' },
  { href: '/reviews', label: 'Reviews', permission: 'reviews.view' },
  { href: '/rigs', label: 'Rigs', permission: 'rigs.view' },
  { href: '/limits', label: 'Limits', permission: 'limits.manage' },
  { href: '/audit', label: 'Audit', permission: 'audit.view' },
  { href: '/members', label: 'Members', permission: 'members.manage' },
];
