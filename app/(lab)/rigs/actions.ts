'use server';

import { revalidatePath } from 'next/cache';
import { headers } from 'next/headers';
import { memberAction } from '@/lib/auth/guard';
import { clientAddress } from '@/lib/auth/rate-limit';
import type { Member } from '@/lib/auth/session';
import { createRig, createRigToken, revokeRigToken, setRigArchived, updateRig, type Actor } from '@/lib/rigs/manage';
import { rigRefSchema, rigSchema, rigUpdateSchema, tokenCreateSchema, tokenRevokeSchema } from '@/lib/rigs/schema';

async function actor(member: Member): Promise<Actor> {
  return { labId: member.lab.id, userId: member.user.id, email: member.user.email, ip: clientAddress(await headers()) };
}

export const createRigAction = memberAction('rigs.manage', rigSchema, async (input, member) => {
  const rig = await createRig(await actor(member), input);
  revalidatePath('/rigs');
  return { rigId: rig.id };
});

export const updateRigAction = memberAction('rigs.manage', rigUpdateSchema, async ({ rigId, ...values }, member) => {
  await updateRig(await actor(member), rigId, values);
  revalidatePath('/rigs');
  revalidatePath(`/rigs/${rigId}`);
  return { rigId };
});

export const archiveRigAction = memberAction('rigs.manage', rigRefSchema, async ({ rigId }, member) => {
  await setRigArchived(await actor(member), rigId, true);
  revalidatePath('/rigs');
  revalidatePath(`/rigs/${rigId}`);
  return undefined;
});

export const restoreRigAction = memberAction('rigs.manage', rigRefSchema, async ({ rigId }, member) => {
  await setRigArchived(await actor(member), rigId, false);
  revalidatePath('/rigs');
  revalidatePath(`/rigs/${rigId}`);
  return undefined;
});

/** Returns the secret to the one browser that asked; it is never shown again. */
export const createTokenAction = memberAction('tokens.manage', tokenCreateSchema, async (input, member) => {
  const t = await createRigToken(await actor(member), input);
  revalidatePath(`/rigs/${input.rigId}`);
  return { id: t.id, name: t.name, secret: t.secret, expiresAt: t.expiresAt.toISOString() };
});

export const revokeTokenAction = memberAction('tokens.manage', tokenRevokeSchema, async (input, member) => {
  await revokeRigToken(await actor(member), input);
  revalidatePath(`/rigs/${input.rigId}`);
  return undefined;
});
