import { sql } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { db } from '@/db/client';
import * as audit from '@/db/queries/audit';
import { auditFilterChoices, iterateAuditEntries, latestAuditId, listAuditEntries, recordAudit } from '@/db/queries/audit';
import { auditFilterSchema, dateRange } from '@/lib/audit/filters';
import { makeLab } from './support/fixtures';

// Entries with chosen times: `at` defaults to now(), so the test writes it directly to
// exercise the date filter (an INSERT, which the append-only trigger allows).
async function entry(labId: string, at: string, action: string, actor: string, subjectType: string, extra: Record<string, unknown> = {}) {
  await db.execute(sql`
    INSERT INTO audit_log (lab_id, at, actor_label, action, subject_type, details)
    VALUES (${labId}, ${at}::timestamptz, ${actor}, ${action}, ${subjectType}, ${JSON.stringify(extra)}::jsonb)`);
}

async function seedLog() {
  const a = await makeLab();
  const b = await makeLab();
  const lab = a.lab.id;
  await entry(lab, '2031-04-29T23:59:59Z', 'version.submitted', 'ada@harbor.test', 'protocol_version');
  await entry(lab, '2031-04-30T00:00:00Z', 'version.approved', 'tomas@harbor.test', 'protocol_version');
  await entry(lab, '2031-04-30T12:00:00Z', 'limits.updated', 'tomas@harbor.test', 'limit_profile');
  await entry(lab, '2031-04-30T23:59:59.999Z', 'export.downloaded', 'token bench-2', 'protocol_version');
  await entry(lab, '2031-05-01T00:00:00Z', 'limits.updated', 'noor@harbor.test', 'limit_profile');
  await entry(lab, '2031-05-02T08:00:00Z', 'export.downloaded', 'ada_50%@harbor.test', 'protocol_version');
  // Another lab's entry that matches every filter below must never appear.
  await entry(b.lab.id, '2031-04-30T12:00:00Z', 'limits.updated', 'tomas@harbor.test', 'limit_profile');
  return { labId: lab, otherLabId: b.lab.id };
}

const find = async (labId: string, raw: Record<string, string>) => {
  const f = auditFilterSchema.parse(raw);
  const { rows, total } = await listAuditEntries({ labId, ...f, ...dateRange(f), limit: 100, offset: 0 });
  return { actions: rows.map((r) => `${r.action}@${r.at.toISOString()}`), total };
};

describe('audit log queries', () => {
  it('the module offers appending and reading only: no update or delete function exists', () => {
    const names = Object.keys(audit).sort();
    expect(names).toEqual(['auditFilterChoices', 'iterateAuditEntries', 'latestAuditId', 'listAuditEntries', 'recordAudit']);
    for (const n of names) expect(n).not.toMatch(/update|delete|remove|edit|purge|clear|truncate|set/i);
  });

  it('lists the lab’s entries newest first and filters by action, actor, subject type and days', async () => {
    const { labId } = await seedLog();
    const all = await find(labId, {});
    expect(all.total).toBe(6);
    expect(all.actions[0]).toBe('export.downloaded@2031-05-02T08:00:00.000Z');
    expect(all.actions.at(-1)).toBe('version.submitted@2031-04-29T23:59:59.000Z');

    expect((await find(labId, { action: 'limits.updated' })).total).toBe(2);
    expect((await find(labId, { actor: 'TOMAS@' })).actions).toEqual([
      'limits.updated@2031-04-30T12:00:00.000Z',
      'version.approved@2031-04-30T00:00:00.000Z',
    ]);
    expect((await find(labId, { actor: 'token' })).total).toBe(1);
    expect((await find(labId, { subjectType: 'limit_profile' })).total).toBe(2);

    // One whole UTC day, both ends included: midnight in, the next midnight out.
    const day = await find(labId, { from: '2031-04-30', to: '2031-04-30' });
    expect(day.actions).toEqual([
      'export.downloaded@2031-04-30T23:59:59.999Z',
      'limits.updated@2031-04-30T12:00:00.000Z',
      'version.approved@2031-04-30T00:00:00.000Z',
    ]);
    expect((await find(labId, { from: '2031-05-01' })).total).toBe(2);
    expect((await find(labId, { to: '2031-04-29' })).total).toBe(1);
    expect((await find(labId, { action: 'limits.updated', actor: 'noor', from: '2031-05-01', to: '2031-05-01' })).total).toBe(1);
  });

  it('matches % and _ in the actor box literally', async () => {
    const { labId } = await seedLog();
    expect((await find(labId, { actor: '_50%' })).total).toBe(1);
    expect((await find(labId, { actor: '%' })).total).toBe(1);
  });

  it('pages with limit and offset, and the export iterator yields every match in batches up to a snapshot', async () => {
    const { labId } = await seedLog();
    const page2 = await listAuditEntries({ labId, limit: 4, offset: 4 });
    expect(page2.total).toBe(6);
    expect(page2.rows).toHaveLength(2);

    const snapshot = await latestAuditId({ labId });
    await recordAudit(db, { labId, actor: { label: 'late@harbor.test' }, action: 'audit.exported', subjectType: 'audit_log' });
    const batches: number[] = [];
    const ids: number[] = [];
    for await (const batch of iterateAuditEntries({ labId }, { upToId: snapshot, batchSize: 4 })) {
      batches.push(batch.length);
      ids.push(...batch.map((r) => r.id));
    }
    expect(batches).toEqual([4, 2]);
    expect(ids).toEqual([...ids].sort((x, y) => y - x));
    expect(ids[0]).toBe(snapshot);

    const filtered: string[] = [];
    for await (const batch of iterateAuditEntries({ labId, action: 'export.downloaded' }, { batchSize: 1 })) filtered.push(...batch.map((r) => r.actorLabel));
    expect(filtered).toEqual(['ada_50%@harbor.test', 'token bench-2']);
    expect(await latestAuditId({ labId: (await makeLab()).lab.id })).toBeNull();
  });

  it('orders by time even when entries were appended out of order, and the export’s keyset loses nothing to microseconds', async () => {
    const { lab } = await makeLab();
    // Appended in this order; times differ by a microsecond or not at all.
    await entry(lab.id, '2031-06-01T10:00:00.000002Z', 'b', 'x', 't');
    await entry(lab.id, '2031-06-01T10:00:00.000001Z', 'a', 'x', 't');
    await entry(lab.id, '2031-06-01T10:00:00.000002Z', 'c', 'x', 't');
    await entry(lab.id, '2031-06-01T10:00:00.000003Z', 'd', 'x', 't');
    const page = await listAuditEntries({ labId: lab.id, limit: 10, offset: 0 });
    expect(page.rows.map((r) => r.action)).toEqual(['d', 'c', 'b', 'a']);
    const streamed: string[] = [];
    for await (const batch of iterateAuditEntries({ labId: lab.id }, { batchSize: 1 })) streamed.push(...batch.map((r) => r.action));
    expect(streamed).toEqual(['d', 'c', 'b', 'a']);
  });

  it('offers filter choices from the lab’s own log only', async () => {
    const { labId, otherLabId } = await seedLog();
    await entry(otherLabId, '2031-04-30T12:00:00Z', 'only.elsewhere', 'stranger@else.test', 'elsewhere');
    const c = await auditFilterChoices({ labId });
    expect(c.actions).toEqual(['export.downloaded', 'limits.updated', 'version.approved', 'version.submitted']);
    expect(c.subjectTypes).toEqual(['limit_profile', 'protocol_version']);
    expect(c.actors).not.toContain('stranger@else.test');
  });
});
