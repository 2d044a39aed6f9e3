import { and, desc, eq, isNull } from 'drizzle-orm';
import { db } from '../client';
import { invitations, memberships, users } from '../schema';
import type { Role } from '@/lib/auth/roles';

/** Members of one lab. Every query here is scoped by lab id. */
export async function listMembers({ labId }: { labId: string }) {
  return db
    .select({ userId: users.id, email: users.email, name: users.name, roles: memberships.roles, since: memberships.createdAt })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.labId, labId))
    .orderBy(users.name);
}

export async function listOpenInvitations({ labId }: { labId: string }) {
  return db
    .select({ id: invitations.id, email: invitations.email, roles: invitations.roles, expiresAt: invitations.expiresAt })
    .from(invitations)
    .where(and(eq(invitations.labId, labId), isNull(invitations.acceptedAt)))
    .orderBy(desc(invitations.createdAt));
}

export async function setMemberRoles({ labId, userId, roles }: { labId: string; userId: string; roles: Role[] }) {
  const rows = await db
    .update(memberships)
    .set({ roles })
    .where(and(eq(memberships.labId, labId), eq(memberships.userId, userId)))
    .returning({ userId: memberships.userId });
  return rows.length === 1;
}
