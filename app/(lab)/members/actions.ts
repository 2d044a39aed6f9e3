'use server';

import { revalidatePath } from 'next/cache';
import { headers } from 'next/headers';
import { and, eq } from 'drizzle-orm';
import { db } from '@/db/client';
import { memberships } from '@/db/schema';
import { recordAudit } from '@/db/queries/audit';
import { memberAction } from '@/lib/auth/guard';
import { inviteSchema, memberRolesSchema } from '@/lib/auth/schemas';
import { createInvitationWith } from '@/lib/auth/invite';
import { conflict, notFound } from '@/lib/http/errors';
import { clientAddress } from '@/lib/auth/rate-limit';
import { deliverSoon } from '@/lib/mail/deliver';
import { env } from '@/lib/env';

export const inviteMember = memberAction('members.manage', inviteSchema, async (input, member) => {
  const ip = clientAddress(await headers());
  await db.transaction(async (tx) => {
    await createInvitationWith(tx, {
      lab: member.lab,
      email: input.email,
      roles: input.roles,
      invitedBy: member.user,
      appUrl: env().APP_URL,
      ip,
    });
  });
  deliverSoon();
  revalidatePath('/members');
  return { email: input.email };
});

export const setMemberRoles = memberAction('members.manage', memberRolesSchema, async (input, member) => {
  await db.transaction(async (tx) => {
    const rows = await tx
      .select({ userId: memberships.userId, roles: memberships.roles })
      .from(memberships)
      .where(eq(memberships.labId, member.lab.id))
      .for('update');
    const target = rows.find((r) => r.userId === input.userId);
    if (!target) throw notFound('That person is not a member of this lab.');
    const adminsAfter = rows.filter((r) =>
      r.userId === input.userId ? input.roles.includes('lab_admin') : r.roles.includes('lab_admin'),
    );
    if (adminsAfter.length === 0) throw conflict('A lab keeps at least one lab admin.');
    await tx
      .update(memberships)
      .set({ roles: input.roles })
      .where(and(eq(memberships.labId, member.lab.id), eq(memberships.userId, input.userId)));
    await recordAudit(tx, {
      labId: member.lab.id,
      actor: { userId: member.user.id, label: member.user.email },
      action: 'member.roles_changed',
      subjectType: 'user',
      subjectId: input.userId,
      details: { from: target.roles, to: input.roles },
    });
  });
  revalidatePath('/members');
  return undefined;
});
