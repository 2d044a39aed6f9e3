import 'server-only';
import { cache } from 'react';
import { cookies } from 'next/headers';
import { eq } from 'drizzle-orm';
import { db } from '@/db/client';
import { labs, memberships, users } from '@/db/schema';
import { auth } from './config';
import type { Role } from './roles';

export const LAB_COOKIE = 'pulseloom-lab';

export type LabMembership = { labId: string; labName: string; labSlug: string; roles: Role[] };
export type Member = {
  user: { id: string; email: string; name: string | null };
  lab: { id: string; name: string; slug: string };
  roles: Role[];
  labs: LabMembership[];
};

export async function membershipsOf(userId: string): Promise<LabMembership[]> {
  const rows = await db
    .select({ labId: labs.id, labName: labs.name, labSlug: labs.slug, roles: memberships.roles })
    .from(memberships)
    .innerJoin(labs, eq(labs.id, memberships.labId))
    .where(eq(memberships.userId, userId))
    .orderBy(labs.name);
  return rows;
}

/**
 * The signed-in user in their current lab (cookie, else their first lab), or null.
 * Memoised per request; roles come from the database on every request, never from the JWT,
 * so a role change takes effect at once.
 */
export const getCurrentMember = cache(async (): Promise<Member | null> => {
  const session = await auth();
  const userId = session?.user?.id;
  if (!userId) return null;
  const [user] = await db
    .select({ id: users.id, email: users.email, name: users.name })
    .from(users)
    .where(eq(users.id, userId))
    .limit(1);
  if (!user?.email) return null;
  const all = await membershipsOf(userId);
  if (all.length === 0) return { user: { ...user, email: user.email }, lab: { id: '', name: '', slug: '' }, roles: [], labs: [] };
  const wanted = (await cookies()).get(LAB_COOKIE)?.value;
  const current = all.find((m) => m.labId === wanted) ?? all[0]!;
  return {
    user: { ...user, email: user.email },
    lab: { id: current.labId, name: current.labName, slug: current.labSlug },
    roles: current.roles,
    labs: all,
  };
});
