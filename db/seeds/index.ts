import type { PgTransaction } from 'drizzle-orm/pg-core';
import type { PostgresJsQueryResultHKT } from 'drizzle-orm/postgres-js';
import type { ExtractTablesWithRelations } from 'drizzle-orm';
import type * as schema from '../schema';
import { seedLimitProfiles } from './limits';
import { seedProtocols } from './protocols';

export type SeedTx = PgTransaction<PostgresJsQueryResultHKT, typeof schema, ExtractTablesWithRelations<typeof schema>>;

/** Ids of the foundation's demo rows, keyed by lab slug, person e-mail and rig name. */
export type SeedContext = {
  tx: SeedTx;
  labIds: Record<string, string>;
  userIds: Record<string, string>;
  rigIds: Record<string, string>;
};

export type SeedPart = (ctx: SeedContext) => Promise<void>;

/** Parts of the demo scenario, run in order inside the seed transaction. Each must be idempotent. */
export const SEED_PARTS: SeedPart[] = [seedLimitProfiles, seedProtocols];
