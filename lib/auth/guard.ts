import 'server-only';
import { forbidden, redirect } from 'next/navigation';
import { z } from 'zod';
import { getCurrentMember, type Member } from './session';
import { may, type Permission } from './roles';
import { AppError, type FieldIssue, zodIssues } from '@/lib/http/errors';

/** For pages: signed in, in a lab, and allowed — else sign-in, lab-less page, or a real 403. */
export async function requireMember(permission: Permission = 'lab.view'): Promise<Member> {
  const member = await getCurrentMember();
  if (!member) redirect('/signin');
  if (!member.lab.id) redirect('/no-lab');
  if (!may(member.roles, permission)) forbidden();
  return member;
}

export type ActionResult<T = undefined> =
  | { ok: true; data: T; message?: string }
  | { ok: false; message: string; fieldErrors: FieldIssue[] };

/**
 * For server actions: parse the input with the shared schema, read the session, check the
 * permission in the current lab, then run the body. Actions are public endpoints: this is
 * the first thing every one of them does.
 */
export function memberAction<S extends z.ZodType, T>(
  permission: Permission,
  schema: S,
  body: (input: z.infer<S>, member: Member) => Promise<T>,
) {
  return async (input: unknown): Promise<ActionResult<T>> => {
    const member = await getCurrentMember();
    if (!member) return { ok: false, message: 'Your session has ended. Sign in again.', fieldErrors: [] };
    if (!member.lab.id || !may(member.roles, permission)) {
      return { ok: false, message: 'Your role in this lab does not allow this.', fieldErrors: [] };
    }
    const parsed = schema.safeParse(input instanceof FormData ? Object.fromEntries(input) : input);
    if (!parsed.success) {
      return { ok: false, message: 'Some fields need attention.', fieldErrors: zodIssues(parsed.error) };
    }
    try {
      return { ok: true, data: await body(parsed.data, member) };
    } catch (err) {
      if (err instanceof AppError) return { ok: false, message: err.message, fieldErrors: err.issues };
      throw err;
    }
  };
}
