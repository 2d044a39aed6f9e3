import {
  bigint,
  index,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  primaryKey,
  text,
  timestamp,
  uniqueIndex,
  uuid,
} from 'drizzle-orm/pg-core';
import { users } from './auth';
import { labs } from './labs';
import { modality, rigs } from './rigs';

export const versionStatus = pgEnum('version_status', [
  'draft',
  'in_review',
  'approved',
  'returned',
  'withdrawn',
]);

export const protocols = pgTable(
  'protocols',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    labId: uuid('lab_id')
      .notNull()
      .references(() => labs.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    purpose: text('purpose').notNull().default(''),
    modality: modality('modality').notNull(),
    target: text('target').notNull().default(''),
    createdBy: uuid('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('protocols_lab_idx').on(t.labId)],
);

/** Which rigs a protocol may run on. */
export const protocolRigs = pgTable(
  'protocol_rigs',
  {
    labId: uuid('lab_id')
      .notNull()
      .references(() => labs.id, { onDelete: 'cascade' }),
    protocolId: uuid('protocol_id')
      .notNull()
      .references(() => protocols.id, { onDelete: 'cascade' }),
    rigId: uuid('rig_id')
      .notNull()
      .references(() => rigs.id, { onDelete: 'cascade' }),
  },
  (t) => [primaryKey({ columns: [t.protocolId, t.rigId] })],
);

/**
 * One version of a protocol: the full engine spec plus its review state.
 * Approved rows are immutable; a trigger in the migrations enforces it in the database.
 * `revision` is the optimistic-concurrency counter: every state change bumps it.
 */
export const protocolVersions = pgTable(
  'protocol_versions',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    labId: uuid('lab_id')
      .notNull()
      .references(() => labs.id, { onDelete: 'cascade' }),
    protocolId: uuid('protocol_id')
      .notNull()
      .references(() => protocols.id, { onDelete: 'cascade' }),
    number: integer('number').notNull(),
    status: versionStatus('status').notNull().default('draft'),
    spec: jsonb('spec').notNull(),
    rigId: uuid('rig_id').references(() => rigs.id, { onDelete: 'restrict' }),
    // sha256:<hex> of the schedule, from the engine manifest, stored at submission.
    checksum: text('checksum'),
    // Pulses in the schedule, stored with the checksum: exports of the version then need
    // no counting pass (they check the pulses against both as they stream).
    pulseCount: bigint('pulse_count', { mode: 'number' }),
    justification: text('justification'),
    authorId: uuid('author_id').references(() => users.id, { onDelete: 'set null' }),
    submittedAt: timestamp('submitted_at', { withTimezone: true }),
    decidedBy: uuid('decided_by').references(() => users.id, { onDelete: 'set null' }),
    decidedAt: timestamp('decided_at', { withTimezone: true }),
    approvedChecksum: text('approved_checksum'),
    copiedFromId: uuid('copied_from_id'),
    revision: integer('revision').notNull().default(0),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex('protocol_versions_number_uq').on(t.protocolId, t.number),
    index('protocol_versions_lab_status_idx').on(t.labId, t.status),
  ],
);

export const reviewComments = pgTable(
  'review_comments',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    labId: uuid('lab_id')
      .notNull()
      .references(() => labs.id, { onDelete: 'cascade' }),
    versionId: uuid('version_id')
      .notNull()
      .references(() => protocolVersions.id, { onDelete: 'cascade' }),
    authorId: uuid('author_id').references(() => users.id, { onDelete: 'set null' }),
    decision: text('decision'),
    body: text('body').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('review_comments_version_idx').on(t.versionId)],
);

/** Limits a safety officer or lab admin sets per lab and modality (optionally per rig). */
export const limitProfiles = pgTable(
  'limit_profiles',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    labId: uuid('lab_id')
      .notNull()
      .references(() => labs.id, { onDelete: 'cascade' }),
    rigId: uuid('rig_id').references(() => rigs.id, { onDelete: 'cascade' }),
    modality: modality('modality').notNull(),
    name: text('name').notNull(),
    limits: jsonb('limits').notNull(),
    updatedBy: uuid('updated_by').references(() => users.id, { onDelete: 'set null' }),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('limit_profiles_lab_idx').on(t.labId)],
);

/** A user's acknowledgement of the export cautions, once per version. */
export const exportAcknowledgements = pgTable(
  'export_acknowledgements',
  {
    labId: uuid('lab_id')
      .notNull()
      .references(() => labs.id, { onDelete: 'cascade' }),
    versionId: uuid('version_id')
      .notNull()
      .references(() => protocolVersions.id, { onDelete: 'cascade' }),
    userId: uuid('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    acknowledgedAt: timestamp('acknowledged_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.versionId, t.userId] })],
);

export type VersionStatus = (typeof versionStatus.enumValues)[number];
