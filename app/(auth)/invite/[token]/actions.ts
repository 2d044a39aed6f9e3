'use server';

import { cookies } from 'next/headers';
import { AuthError } from 'next-auth';
import { z } from 'zod';
import { signIn } from '@/lib/auth/config';
import { findOpenInvitation } from '@/lib/auth/invitations';
import { LAB_COOKIE } from '@/lib/auth/session';

const acceptSchema = z.object({ token: z.string().min(10).max(200), name: z.string().trim().max(120).optional() });

export type AcceptState = { message?: string };

export async function acceptInvitationAction(_prev: AcceptState, form: FormData): Promise<AcceptState> {
  const parsed = acceptSchema.safeParse({ token: form.get('token'), name: form.get('name') || undefined });
  if (!parsed.success) return { message: 'This invitation link is not valid.' };
  const inv = await findOpenInvitation(parsed.data.token);
  if (!inv) return { message: 'This invitation has expired or was already used. Ask your lab admin for a new one.' };
  // Land in the lab that invited them, even if they already belong to others.
  (await cookies()).set(LAB_COOKIE, inv.labId, { httpOnly: true, sameSite: 'lax', path: '/', maxAge: 60 * 60 * 24 * 365 });
  try {
    await signIn('invitation', { token: parsed.data.token, name: parsed.data.name ?? '', redirectTo: '/' });
  } catch (err) {
    if (err instanceof AuthError) return { message: 'This invitation has expired or was already used. Ask your lab admin for a new one.' };
    throw err;
  }
  return {};
}
