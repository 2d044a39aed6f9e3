import 'server-only';
import { z } from 'zod';
import { AppError, badRequest, forbiddenError, unauthenticated, zodIssues } from './errors';
import { getCurrentMember, type Member } from '@/lib/auth/session';
import { may, type Permission } from '@/lib/auth/roles';

export function errorResponse(err: unknown): Response {
  if (err instanceof AppError) {
    return Response.json(
      { error: { code: err.code, message: err.message, issues: err.issues } },
      { status: err.status, headers: err.headers },
    );
  }
  console.error('[pulseloom] unhandled route error', err);
  return Response.json({ error: { code: 'internal', message: 'Something went wrong on our side.' } }, { status: 500 });
}

/** Reads the session and checks the permission in the current lab; first line of every handler. */
export async function requireRouteMember(permission: Permission): Promise<Member> {
  const member = await getCurrentMember();
  if (!member) throw unauthenticated();
  if (!member.lab.id || !may(member.roles, permission)) throw forbiddenError();
  return member;
}

/** Parses a JSON body with a shared schema: bad JSON or bad fields are a 400 with paths. */
export async function readJson<S extends z.ZodType>(request: Request, schema: S, maxBytes = 2_000_000): Promise<z.infer<S>> {
  const length = Number(request.headers.get('content-length') ?? 0);
  if (length > maxBytes) throw new AppError(413, 'too_large', `Request body is over ${maxBytes} bytes.`);
  const text = await request.text();
  if (text.length > maxBytes) throw new AppError(413, 'too_large', `Request body is over ${maxBytes} bytes.`);
  let body: unknown;
  try {
    body = JSON.parse(text);
  } catch {
    throw badRequest('The request body is not valid JSON.', [{ path: '(root)', message: 'not valid JSON' }]);
  }
  const parsed = schema.safeParse(body);
  if (!parsed.success) throw badRequest('Some fields are not valid.', zodIssues(parsed.error));
  return parsed.data;
}

/** Wraps a handler so every failure becomes a typed JSON error, never a stack trace. */
export function route<A extends unknown[]>(fn: (...args: A) => Promise<Response>) {
  return async (...args: A): Promise<Response> => {
    try {
      return await fn(...args);
    } catch (err) {
      return errorResponse(err);
    }
  };
}
