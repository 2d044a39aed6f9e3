import { bigserial, index, integer, jsonb, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { labs } from './labs';

/**
 * Append-only record of every state change, approval, export and token download.
 * Triggers in the migrations reject UPDATE and DELETE; there is no code path for either.
 */
export const auditLog = pgTable(
  'audit_log',
  {
    id: bigserial('id', { mode: 'number' }).primaryKey(),
    labId: uuid('lab_id').references(() => labs.id, { onDelete: 'restrict' }),
    at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
    actorUserId: uuid('actor_user_id'),
    actorTokenId: uuid('actor_token_id'),
    // Human-readable actor: an e-mail or "token <name>", kept even if the user is removed.
    actorLabel: text('actor_label').notNull(),
    action: text('action').notNull(),
    subjectType: text('subject_type').notNull(),
    subjectId: text('subject_id'),
    checksum: text('checksum'),
    ip: text('ip'),
    details: jsonb('details').notNull().default({}),
  },
  (t) => [index('audit_log_lab_at_idx').on(t.labId, t.at)],
);

/** Mail to send, written in the same transaction as the state change it reports. */
export const outbox = pgTable(
  'outbox',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    labId: uuid('lab_id').references(() => labs.id, { onDelete: 'cascade' }),
    to: text('to').notNull(),
    subject: text('subject').notNull(),
    text: text('text').notNull(),
    html: text('html').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    attempts: integer('attempts').notNull().default(0),
    nextAttemptAt: timestamp('next_attempt_at', { withTimezone: true }).notNull().defaultNow(),
    lastError: text('last_error'),
    sentAt: timestamp('sent_at', { withTimezone: true }),
  },
  (t) => [index('outbox_pending_idx').on(t.sentAt, t.nextAttemptAt)],
);

/** What the local fake SMTP server received (development and tests only). */
export const devMailbox = pgTable('dev_mailbox', {
  id: uuid('id').primaryKey().defaultRandom(),
  receivedAt: timestamp('received_at', { withTimezone: true }).notNull().defaultNow(),
  from: text('from').notNull(),
  to: text('to').notNull(),
  subject: text('subject').notNull(),
  text: text('text').notNull().default(''),
  html: text('html').notNull().default(''),
});
