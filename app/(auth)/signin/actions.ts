'use server';

import { AuthError, CredentialsSignin } from 'next-auth';
import { z } from 'zod';
import { signIn } from '@/lib/auth/config';
import { passwordSignInSchema } from '@/lib/auth/schemas';
import { zodIssues, type FieldIssue } from '@/lib/http/errors';

export type SignInState = { message?: string; fieldErrors?: FieldIssue[]; email?: string };

const emailLinkSchema = z.object({ email: z.string().trim().toLowerCase().email('Enter an e-mail address') });

function safeRedirect(target: FormDataEntryValue | null): string {
  const t = typeof target === 'string' ? target : '/';
  // Only same-site paths: a sign-in link must never bounce someone to another host.
  return t.startsWith('/') && !t.startsWith('//') ? t : '/';
}

export async function signInWithPassword(_prev: SignInState, form: FormData): Promise<SignInState> {
  const parsed = passwordSignInSchema.safeParse({ email: form.get('email'), password: form.get('password') });
  if (!parsed.success) return { fieldErrors: zodIssues(parsed.error), email: String(form.get('email') ?? '') };
  try {
    await signIn('password', { ...parsed.data, redirectTo: safeRedirect(form.get('next')) });
  } catch (err) {
    // signIn throws NEXT_REDIRECT on success: only Auth.js errors are ours to handle.
    if (err instanceof CredentialsSignin && err.code === 'rate_limited') {
      return { message: 'Too many failed attempts. Wait a few minutes and try again.', email: parsed.data.email };
    }
    if (err instanceof AuthError) return { message: 'That e-mail and password do not match an account.', email: parsed.data.email };
    throw err;
  }
  return {};
}

export async function signInWithEmailLink(_prev: SignInState, form: FormData): Promise<SignInState> {
  const parsed = emailLinkSchema.safeParse({ email: form.get('email') });
  if (!parsed.success) return { fieldErrors: zodIssues(parsed.error) };
  try {
    await signIn('email', { email: parsed.data.email, redirectTo: safeRedirect(form.get('next')) });
  } catch (err) {
    if (err instanceof AuthError) return { message: 'The sign-in link could not be sent. Try again in a moment.' };
    throw err;
  }
  return {};
}
