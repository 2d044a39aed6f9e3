import { readFileSync } from 'node:fs';
import { afterAll, describe, expect, it } from 'vitest';
import postgres from 'postgres';
import { runMigrations } from '@/db/migrate';

const admin = postgres(process.env.PULSELOOM_PG_ADMIN_URL!, { max: 1, onnotice: () => {} });
const name = `migrate_${process.pid}_${Date.now()}`;

afterAll(async () => {
  await admin.unsafe(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`);
  await admin.end();
});

describe('migrations', () => {
  it('apply to an empty database, twice without change, with the guards in place', async () => {
    await admin.unsafe(`CREATE DATABASE ${name}`);
    const url = process.env.PULSELOOM_PG_ADMIN_URL!.replace(/\/postgres$/, `/${name}`);
    await runMigrations(url);
    await runMigrations(url); // idempotent: a second start changes nothing

    const sql = postgres(url, { max: 1, onnotice: () => {} });
    try {
      const tables = (await sql`SELECT table_name FROM information_schema.tables WHERE table_schema = 'public'`).map((r) => r.table_name);
      for (const t of ['users', 'labs', 'memberships', 'invitations', 'rigs', 'rig_tokens', 'envelopes', 'protocols',
        'protocol_versions', 'limit_profiles', 'audit_log', 'outbox', 'dev_mailbox']) {
        expect(tables).toContain(t);
      }
      const triggers = (await sql`SELECT tgname FROM pg_trigger WHERE NOT tgisinternal`).map((r) => r.tgname);
      expect(triggers).toEqual(expect.arrayContaining(['protocol_versions_guard', 'audit_log_no_update_delete', 'audit_log_no_truncate']));
      // Each migration recorded once, although they ran twice.
      const journal = JSON.parse(readFileSync('drizzle/meta/_journal.json', 'utf8')) as { entries: unknown[] };
      const [{ n }] = await sql`SELECT count(*)::int AS n FROM drizzle.__drizzle_migrations`;
      expect(journal.entries.length).toBeGreaterThanOrEqual(4);
      expect(n).toBe(journal.entries.length);
    } finally {
      await sql.end();
    }
  });
});
