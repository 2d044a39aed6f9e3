'use server';

import { revalidatePath } from 'next/cache';
import { headers } from 'next/headers';
import { z } from 'zod';
import { createLimitProfile, deleteLimitProfile, updateLimitProfile } from '@/db/queries/limit-profiles';
import { memberAction } from '@/lib/auth/guard';
import { clientAddress } from '@/lib/auth/rate-limit';
import type { Member } from '@/lib/auth/session';
import { limitProfileSchema } from '@/lib/safety';

// Every action checks 'limits.manage' (safety officers and lab admins) through
// memberAction before it reads its input; the query functions write the audit row in
// the same transaction as the change.

async function actor(m: Member) {
  return { userId: m.user.id, label: m.user.email, ip: clientAddress(await headers()) };
}

export const createLimitProfileAction = memberAction('limits.manage', limitProfileSchema, async (input, member) => {
  const saved = await createLimitProfile({ labId: member.lab.id, input, actor: await actor(member) });
  revalidatePath('/limits');
  return { id: saved.id };
});

const updateSchema = z.object({
  id: z.uuid(),
  /** When the editor loaded the profile: a save over a newer save is refused. */
  loadedAt: z.iso.datetime({ offset: true }),
  profile: limitProfileSchema,
});

export const updateLimitProfileAction = memberAction('limits.manage', updateSchema, async (input, member) => {
  const saved = await updateLimitProfile({
    labId: member.lab.id,
    id: input.id,
    input: input.profile,
    actor: await actor(member),
    expectedUpdatedAt: new Date(input.loadedAt),
  });
  revalidatePath('/limits');
  return { id: saved.id, updatedAt: saved.updatedAt.toISOString() };
});

export const deleteLimitProfileAction = memberAction('limits.manage', z.object({ id: z.uuid() }), async (input, member) => {
  await deleteLimitProfile({ labId: member.lab.id, id: input.id, actor: await actor(member) });
  revalidatePath('/limits');
  return undefined;
});
