// `npm run bench`: every tests/bench/*.bench.ts in turn, each printing its own table of
// ratios against a baseline measured in the same process. Benchmarks, never timed tests.
import { readdirSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { ensureDependencies } from './lib/deps.mjs';
import { freePort, run } from './lib/proc.mjs';
import { ensurePostgresInstalled, removeCluster, startCluster } from './lib/pg.mjs';

const root = fileURLToPath(new URL('..', import.meta.url));
ensureDependencies(root);
const only = process.argv.slice(2);
const dir = join(root, 'tests', 'bench');
const benches = readdirSync(dir)
  .filter((f) => f.endsWith('.bench.ts'))
  .filter((f) => only.length === 0 || only.some((o) => f.includes(o)))
  .sort();

// Benchmarks that serve the app get their own throwaway, migrated database.
const bin = ensurePostgresInstalled();
const pgData = join(root, '.test-data', `bench-${process.pid}`);
const databaseUrl = startCluster({ bin, dataDir: pgData, port: await freePort(), database: 'pulseloom_bench', throwaway: true });
const env = { ...process.env, DATABASE_URL: databaseUrl, NEXT_TELEMETRY_DISABLED: '1' };
const tsx = join(root, 'node_modules', '.bin', 'tsx');
let failed = 0;
try {
  if (run(tsx, ['db/migrate.ts'], { cwd: root, env }) !== 0) throw new Error('migrations failed');
  for (const f of benches) {
    console.log(`\n━━ ${f} ━━`);
    if (run(tsx, [join('tests', 'bench', f)], { cwd: root, env }) !== 0) failed++;
  }
} finally {
  removeCluster(bin, pgData);
}
process.exit(failed ? 1 : 0);
