import { and, eq, gt, isNull, sql } from 'drizzle-orm';
import { db } from '@/db/client';
import { invitations, memberships, users } from '@/db/schema';
import { hashSecret } from './tokens';

/**
 * Redeems an invitation: creates the user when new, adds the lab membership (merging roles),
 * and marks the invitation used — all in one transaction, so a link works exactly once.
 */
export async function acceptInvitation(args: {
  token: string;
  name?: string;
}): Promise<{ id: string; email: string; name: string | null } | null> {
  if (!args.token || args.token.length > 200) return null;
  const hash = hashSecret(args.token);
  return db.transaction(async (tx) => {
    const [inv] = await tx
      .select()
      .from(invitations)
      .where(and(eq(invitations.tokenHash, hash), isNull(invitations.acceptedAt), gt(invitations.expiresAt, new Date())))
      .for('update')
      .limit(1);
    if (!inv) return null;

    let [user] = await tx.select().from(users).where(eq(users.email, inv.email)).limit(1);
    if (!user) {
      [user] = await tx
        .insert(users)
        .values({ email: inv.email, name: args.name || null, emailVerified: new Date() })
        .returning();
    }
    await tx
      .insert(memberships)
      .values({ labId: inv.labId, userId: user!.id, roles: inv.roles })
      .onConflictDoUpdate({
        target: [memberships.labId, memberships.userId],
        set: { roles: sql`(SELECT array_agg(DISTINCT r) FROM unnest(${memberships.roles} || excluded.roles) AS r)` },
      });
    await tx
      .update(invitations)
      .set({ acceptedAt: new Date(), acceptedBy: user!.id })
      .where(eq(invitations.id, inv.id));
    return { id: user!.id, email: user!.email!, name: user!.name };
  });
}

export async function findOpenInvitation(token: string) {
  if (!token || token.length > 200) return null;
  const [inv] = await db
    .select({ id: invitations.id, email: invitations.email, labId: invitations.labId, roles: invitations.roles })
    .from(invitations)
    .where(
      and(eq(invitations.tokenHash, hashSecret(token)), isNull(invitations.acceptedAt), gt(invitations.expiresAt, new Date())),
    )
    .limit(1);
  return inv ?? null;
}
