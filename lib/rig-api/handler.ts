/**
 * Wrapper for the rig API's route handlers: the same JSON error shape as lib/http/route.ts
 * (`{ error: { code, message, issues } }`), without importing the session module, so the
 * handlers — which never read a session — can be called directly in integration tests.
 */
import { AppError } from '@/lib/http/errors';

export function rigErrorResponse(err: unknown): Response {
  if (err instanceof AppError) {
    return Response.json(
      { error: { code: err.code, message: err.message, issues: err.issues } },
      { status: err.status, headers: { 'Cache-Control': 'no-store', ...err.headers } },
    );
  }
  console.error('[pulseloom] unhandled rig API error', err);
  return Response.json({ error: { code: 'internal', message: 'Something went wrong on our side.' } }, { status: 500 });
}

export function rigRoute<A extends unknown[]>(fn: (...args: A) => Promise<Response>) {
  return async (...args: A): Promise<Response> => {
    try {
      return await fn(...args);
    } catch (err) {
      return rigErrorResponse(err);
    }
  };
}

/** 406 is not in the app's error vocabulary; only the rig API negotiates formats. */
export function notAcceptable(): Response {
  return Response.json(
    {
      error: {
        code: 'not_acceptable',
        message: 'Schedules come as text/csv or application/json; ask for one in Accept, or add .csv or .json to the path.',
        issues: [{ path: '(header) accept', message: 'names neither text/csv nor application/json' }],
      },
    },
    { status: 406, headers: { 'Cache-Control': 'no-store' } },
  );
}
