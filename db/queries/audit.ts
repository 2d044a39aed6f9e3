import { and, asc, count, desc, eq, gte, ilike, lt, lte, max, sql, type SQL } from 'drizzle-orm';
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

// Reading the log: always one lab, newest first (by time, then by append order for
// entries of the same instant), filtered by the audit page's search parameters
// (lib/audit/filters.ts).

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

type Cursor = { at: string; id: number };

function auditWhere(q: AuditQuery, after?: Cursor, upToId?: number): SQL | undefined {
  return and(
    eq(auditLog.labId, q.labId),
    q.action ? eq(auditLog.action, q.action) : undefined,
    q.actor ? ilike(auditLog.actorLabel, likeLiteral(q.actor)) : undefined,
    q.subjectType ? eq(auditLog.subjectType, q.subjectType) : undefined,
    q.since ? gte(auditLog.at, q.since) : undefined,
    q.before ? lt(auditLog.at, q.before) : undefined,
    upToId !== undefined ? lte(auditLog.id, upToId) : undefined,
    // Keyset on (at, id), the display order. The cursor's time travels as PostgreSQL's
    // own text so no microseconds are lost to a JavaScript Date.
    after ? sql`(${auditLog.at}, ${auditLog.id}) < (${after.at}::timestamptz, ${after.id})` : undefined,
  );
}

const newestFirst = [desc(auditLog.at), desc(auditLog.id)];

/** One page of entries, newest first, and the total that match. */
export async function listAuditEntries(q: AuditQuery & { limit: number; offset: number }) {
  const [rows, [total]] = await Promise.all([
    db
      .select()
      .from(auditLog)
      .where(auditWhere(q))
      .orderBy(...newestFirst)
      .limit(q.limit)
      .offset(q.offset),
    db.select({ n: count() }).from(auditLog).where(auditWhere(q)),
  ]);
  return { rows, total: total?.n ?? 0 };
}

/**
 * Every matching entry, newest first, in batches (keyset on time and id), so an export
 * of a long log never holds it all in memory. `upToId` fixes a snapshot: the log is
 * append-only, so entries at or below it never change while the export runs.
 */
export async function* iterateAuditEntries(q: AuditQuery, { upToId, batchSize = 500 }: { upToId?: number | null; batchSize?: number } = {}) {
  if (upToId === null) return;
  let after: Cursor | undefined;
  for (;;) {
    const rows = await db
      .select({ entry: auditLog, cursorAt: sql<string>`${auditLog.at}::text` })
      .from(auditLog)
      .where(auditWhere(q, after, upToId))
      .orderBy(...newestFirst)
      .limit(batchSize);
    if (rows.length === 0) return;
    yield rows.map((r) => r.entry);
    if (rows.length < batchSize) return;
    const last = rows[rows.length - 1]!;
    after = { at: last.cursorAt, id: last.entry.id };
  }
}

/** The id of the lab's last appended entry (null for an empty log): a snapshot point for exports. */
export async function latestAuditId({ labId }: { labId: string }): Promise<number | null> {
  const [row] = await db.select({ id: max(auditLog.id) }).from(auditLog).where(eq(auditLog.labId, labId));
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
