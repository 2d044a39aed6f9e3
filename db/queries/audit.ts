import { and, asc, count, desc, eq, gte, ilike, lt, type SQL } from 'drizzle-orm';
import type { PgDatabase, PgQueryResultHKT } from 'drizzle-orm/pg-core';
import { db } from '../client';
import { auditLog } from '../schema';

// Any Drizzle handle: the shared client or a transaction, so audit rows commit with the change.
type Writer = Pick<PgDatabase<PgQueryResultHKT, Record<string, unknown>>, 'insert'>;

export type AuditEntry = {
  labId: string | null;
  actor: { userId?: string; tokenId?: string; label: string };
  action: string;
  subjectType: string;
  subjectId?: string | null;
  checksum?: string | null;
  ip?: string | null;
  details?: Record<string, unknown>;
};

/** Appends one row to the audit log. There is deliberately no update or delete function. */
export async function recordAudit(writer: Writer, e: AuditEntry): Promise<void> {
  await writer.insert(auditLog).values({
    labId: e.labId,
    actorUserId: e.actor.userId ?? null,
    actorTokenId: e.actor.tokenId ?? null,
    actorLabel: e.actor.label,
    action: e.action,
    subjectType: e.subjectType,
    subjectId: e.subjectId ?? null,
    checksum: e.checksum ?? null,
    ip: e.ip ?? null,
    details: e.details ?? {},
  });
}

// Reading the log: always one lab, newest first by append order (the id), filtered by
// the audit page's search parameters (lib/audit/filters.ts).

export type AuditQuery = {
  labId: string;
  action?: string;
  /** Part of the actor label, any case. */
  actor?: string;
  subjectType?: string;
  /** Entries at or after this instant. */
  since?: Date;
  /** Entries strictly before this instant. */
  before?: Date;
};

/** `%` and `_` typed into the actor box are matched literally. */
function likeLiteral(s: string): string {
  return `%${s.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}

function auditWhere(q: AuditQuery, beforeId?: number): SQL | undefined {
  return and(
    eq(auditLog.labId, q.labId),
    q.action ? eq(auditLog.action, q.action) : undefined,
    q.actor ? ilike(auditLog.actorLabel, likeLiteral(q.actor)) : undefined,
    q.subjectType ? eq(auditLog.subjectType, q.subjectType) : undefined,
    q.since ? gte(auditLog.at, q.since) : undefined,
    q.before ? lt(auditLog.at, q.before) : undefined,
    beforeId !== undefined ? lt(auditLog.id, beforeId) : undefined,
  );
}

/** One page of entries, newest first, and the total that match. */
export async function listAuditEntries(q: AuditQuery & { limit: number; offset: number }) {
  const [rows, [total]] = await Promise.all([
    db
      .select()
      .from(auditLog)
      .where(auditWhere(q))
      .orderBy(desc(auditLog.id))
      .limit(q.limit)
      .offset(q.offset),
    db.select({ n: count() }).from(auditLog).where(auditWhere(q)),
  ]);
  return { rows, total: total?.n ?? 0 };
}

/**
 * Every matching entry, newest first, in batches (keyset on the id), so an export of a
 * long log never holds it all in memory.
 */
export async function* iterateAuditEntries(q: AuditQuery, { upToId, batchSize = 500 }: { upToId?: number | null; batchSize?: number } = {}) {
  if (upToId === null) return;
  let beforeId: number | undefined = upToId === undefined ? undefined : upToId + 1;
  for (;;) {
    const rows = await db.select().from(auditLog).where(auditWhere(q, beforeId)).orderBy(desc(auditLog.id)).limit(batchSize);
    if (rows.length === 0) return;
    yield rows;
    if (rows.length < batchSize) return;
    beforeId = rows[rows.length - 1]!.id;
  }
}

/** The id of the lab's newest entry (null for an empty log): a snapshot point for exports. */
export async function latestAuditId({ labId }: { labId: string }): Promise<number | null> {
  const [row] = await db.select({ id: auditLog.id }).from(auditLog).where(eq(auditLog.labId, labId)).orderBy(desc(auditLog.id)).limit(1);
  return row?.id ?? null;
}

/** The actions, actors and subject types present in a lab's log, for the filter choices. */
export async function auditFilterChoices({ labId }: { labId: string }) {
  const distinct = (column: typeof auditLog.action | typeof auditLog.actorLabel | typeof auditLog.subjectType) =>
    db.selectDistinct({ v: column }).from(auditLog).where(eq(auditLog.labId, labId)).orderBy(asc(column)).limit(500);
  const [actions, actors, subjectTypes] = await Promise.all([
    distinct(auditLog.action),
    distinct(auditLog.actorLabel),
    distinct(auditLog.subjectType),
  ]);
  return { actions: actions.map((r) => r.v), actors: actors.map((r) => r.v), subjectTypes: subjectTypes.map((r) => r.v) };
}
