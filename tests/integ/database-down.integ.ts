import { describe, expect, it } from 'vitest';
import net from 'node:net';
import postgres from 'postgres';
import { drizzle } from 'drizzle-orm/postgres-js';
import { sql } from 'drizzle-orm';
import { isDatabaseUnavailable } from '@/lib/db-errors';

async function closedPort(): Promise<number> {
  return new Promise((resolve) => {
    const s = net.createServer();
    s.listen(0, '127.0.0.1', () => {
      const { port } = s.address() as net.AddressInfo;
      s.close(() => resolve(port));
    });
  });
}

describe('database down', () => {
  it('is recognised from the real driver error, so the shell shows the "database is not answering" page', async () => {
    const client = postgres(`postgres://postgres@127.0.0.1:${await closedPort()}/none`, { max: 1, connect_timeout: 2 });
    const err = await drizzle(client).execute(sql`select 1`).then(() => null, (e: unknown) => e);
    await client.end();
    expect(err).not.toBeNull();
    expect(isDatabaseUnavailable(err)).toBe(true);
  });

  it('does not mistake a bad query for an outage', async () => {
    const client = postgres(process.env.DATABASE_URL!, { max: 1 });
    const err = await drizzle(client).execute(sql`select * from no_such_table`).then(() => null, (e: unknown) => e);
    await client.end();
    expect(isDatabaseUnavailable(err)).toBe(false);
  });
});
