import { doublePrecision, index, integer, pgEnum, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { users } from './auth';
import { labs } from './labs';

export const modality = pgEnum('modality', ['optical', 'electrical']);

export const rigs = pgTable(
  'rigs',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    labId: uuid('lab_id')
      .notNull()
      .references(() => labs.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    modality: modality('modality').notNull(),
    // The rig's output sample clock: every schedule made for this rig is placed on it.
    clockHz: integer('clock_hz').notNull(),
    channels: integer('channels').notNull().default(1),
    wavelengthNm: doublePrecision('wavelength_nm'),
    fibreCoreUm: doublePrecision('fibre_core_um'),
    fibreNA: doublePrecision('fibre_na'),
    electrodeMaterial: text('electrode_material'),
    electrodeAreaMm2: doublePrecision('electrode_area_mm2'),
    notes: text('notes'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    archivedAt: timestamp('archived_at', { withTimezone: true }),
  },
  (t) => [index('rigs_lab_idx').on(t.labId)],
);

export const rigTokens = pgTable(
  'rig_tokens',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    labId: uuid('lab_id')
      .notNull()
      .references(() => labs.id, { onDelete: 'cascade' }),
    rigId: uuid('rig_id')
      .notNull()
      .references(() => rigs.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    // SHA-256 hex of the bearer secret; the secret is shown once and never stored.
    tokenHash: text('token_hash').notNull().unique(),
    createdBy: uuid('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
    lastUsedAt: timestamp('last_used_at', { withTimezone: true }),
    revokedAt: timestamp('revoked_at', { withTimezone: true }),
  },
  (t) => [index('rig_tokens_rig_idx').on(t.rigId)],
);
