import { and, asc, eq, isNull, lte, sql } from 'drizzle-orm';
import type { PgDatabase, PgQueryResultHKT } from 'drizzle-orm/pg-core';
import { db } from '@/db/client';
import { outbox } from '@/db/schema';
import type { Rendered } from './templates';

type Writer = Pick<PgDatabase<PgQueryResultHKT, Record<string, unknown>>, 'insert'>;
export type Sender = (msg: { to: string; subject: string; text: string; html: string }) => Promise<void>;

/** Queues a message in the caller's transaction: it is sent only if the state change commits. */
export async function enqueueMail(writer: Writer, labId: string | null, to: string, msg: Rendered): Promise<void> {
  await writer.insert(outbox).values({ labId, to, subject: msg.subject, text: msg.text, html: msg.html });
}

const MAX_ATTEMPTS = 8;

/**
 * Sends due messages once each. Failures are recorded and retried with exponential backoff;
 * they never touch the state change that queued them. Safe to run concurrently: rows are
 * claimed with SKIP LOCKED.
 */
export async function deliverOutbox(send: Sender, limit = 20): Promise<{ sent: number; failed: number }> {
  let sent = 0;
  let failed = 0;
  for (let i = 0; i < limit; i++) {
    const done = await db.transaction(async (tx) => {
      const [row] = await tx
        .select()
        .from(outbox)
        .where(and(isNull(outbox.sentAt), lte(outbox.nextAttemptAt, new Date()), sql`${outbox.attempts} < ${MAX_ATTEMPTS}`))
        .orderBy(asc(outbox.createdAt))
        .limit(1)
        .for('update', { skipLocked: true });
      if (!row) return false;
      try {
        await send({ to: row.to, subject: row.subject, text: row.text, html: row.html });
        await tx.update(outbox).set({ sentAt: new Date(), attempts: row.attempts + 1, lastError: null }).where(eq(outbox.id, row.id));
        sent++;
      } catch (err) {
        const attempts = row.attempts + 1;
        const backoffS = Math.min(3600, 5 * 2 ** attempts);
        await tx
          .update(outbox)
          .set({ attempts, lastError: String((err as Error).message).slice(0, 500), nextAttemptAt: new Date(Date.now() + backoffS * 1000) })
          .where(eq(outbox.id, row.id));
        failed++;
      }
      return true;
    });
    if (!done) break;
  }
  return { sent, failed };
}
