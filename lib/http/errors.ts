import type { z } from 'zod';

export type FieldIssue = { path: string; message: string };

/** The few failures a request can end in; mapped to HTTP in one place (lib/http/route.ts). */
export class AppError extends Error {
  constructor(
    readonly status: 400 | 401 | 403 | 404 | 409 | 413 | 422 | 429,
    readonly code: string,
    message: string,
    readonly issues: FieldIssue[] = [],
    readonly headers: Record<string, string> = {},
  ) {
    super(message);
  }
}

export const badRequest = (message: string, issues: FieldIssue[] = []) => new AppError(400, 'invalid_input', message, issues);
export const unauthenticated = (message = 'Sign in first.') => new AppError(401, 'unauthenticated', message);
export const forbiddenError = (message = 'Your role in this lab does not allow this.') => new AppError(403, 'forbidden', message);
export const notFound = (message = 'Not found.') => new AppError(404, 'not_found', message);
export const conflict = (message: string) => new AppError(409, 'conflict', message);

/** zod issues → `a.b[2].c` paths, the form every Pulseloom error list uses. */
export function zodIssues(error: z.ZodError): FieldIssue[] {
  return error.issues.map((i) => ({ path: formatPath(i.path), message: i.message }));
}

export function formatPath(path: readonly PropertyKey[]): string {
  let out = '';
  for (const p of path) {
    if (typeof p === 'number') out += `[${p}]`;
    else out += out ? `.${String(p)}` : String(p);
  }
  return out || '(root)';
}
