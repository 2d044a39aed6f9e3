import type { PgDatabase, PgQueryResultHKT } from 'drizzle-orm/pg-core';
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
