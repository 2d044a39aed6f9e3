'use server';

import { cookies } from 'next/headers';
import { redirect } from 'next/navigation';
import { z } from 'zod';
import { signOut } from '@/lib/auth/config';
import { getCurrentMember, LAB_COOKIE } from '@/lib/auth/session';

export async function signOutAction() {
  await signOut({ redirectTo: '/signin' });
}

const switchLabSchema = z.object({ labId: z.string().uuid() });

export async function switchLabAction(form: FormData) {
  const member = await getCurrentMember();
  if (!member) redirect('/signin');
  const parsed = switchLabSchema.safeParse({ labId: form.get('labId') });
  // Only labs the user belongs to; anything else is ignored rather than trusted.
  if (parsed.success && member.labs.some((l) => l.labId === parsed.data.labId)) {
    (await cookies()).set(LAB_COOKIE, parsed.data.labId, { httpOnly: true, sameSite: 'lax', path: '/', maxAge: 60 * 60 * 24 * 365 });
  }
  redirect('/');
}
