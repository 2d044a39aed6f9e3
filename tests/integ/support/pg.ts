import { expect } from 'vitest';

/** Drizzle wraps PostgreSQL's error; this asserts on the database's own message. */
export async function expectDbRefusal(p: Promise<unknown>, pattern: RegExp): Promise<void> {
  const err = await p.then(
    () => null,
    (e: unknown) => e as { message: string; cause?: { message: string } },
  );
  expect(err, 'the database should have refused').not.toBeNull();
  expect(err!.cause?.message ?? err!.message).toMatch(pattern);
}
