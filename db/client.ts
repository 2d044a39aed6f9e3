import { drizzle, type PostgresJsDatabase } from 'drizzle-orm/postgres-js';
import postgres from 'postgres';
import * as schema from './schema';

export type Db = PostgresJsDatabase<typeof schema>;

// One client per process, kept across hot reloads in development.
const globalForDb = globalThis as unknown as { pulseloomSql?: postgres.Sql; pulseloomDb?: Db };

function connectionString(): string {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error('DATABASE_URL is not set: start Pulseloom with `npm start`.');
  return url;
}

export function getSql(): postgres.Sql {
  if (!globalForDb.pulseloomSql) {
    globalForDb.pulseloomSql = postgres(connectionString(), {
      max: Number(process.env.PULSELOOM_DB_POOL ?? 10),
      onnotice: () => {},
    });
  }
  return globalForDb.pulseloomSql;
}

export function getDb(): Db {
  if (!globalForDb.pulseloomDb) {
    globalForDb.pulseloomDb = drizzle(getSql(), { schema, casing: 'snake_case' });
  }
  return globalForDb.pulseloomDb;
}

/** The shared Drizzle client. A Proxy so importing it never connects (builds stay offline). */
export const db: Db = new Proxy({} as Db, {
  get(_target, prop) {
    const real = getDb() as unknown as Record<string | symbol, unknown>;
    const value = real[prop];
    return typeof value === 'function' ? (value as (...a: unknown[]) => unknown).bind(real) : value;
  },
});

export { schema };
