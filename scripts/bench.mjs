// `npm run bench`: every tests/bench/*.bench.ts in turn, each printing its own table of
// ratios against a baseline measured in the same process. Benchmarks, never timed tests.
import { readdirSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { ensureDependencies } from './lib/deps.mjs';
import { run } from './lib/proc.mjs';

const root = fileURLToPath(new URL('..', import.meta.url));
ensureDependencies(root);
const only = process.argv.slice(2);
const dir = join(root, 'tests', 'bench');
const benches = readdirSync(dir)
  .filter((f) => f.endsWith('.bench.ts'))
  .filter((f) => only.length === 0 || only.some((o) => f.includes(o)))
  .sort();
let failed = 0;
for (const f of benches) {
  console.log(`\n━━ ${f} ━━`);
  if (run(join(root, 'node_modules', '.bin', 'tsx'), [join('tests', 'bench', f)], { cwd: root }) !== 0) failed++;
}
process.exit(failed ? 1 : 0);
