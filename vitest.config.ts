import { defineConfig } from 'vitest/config';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('.', import.meta.url));

// Two layers: pure unit tests, and integration tests against the real PostgreSQL
// cluster that scripts/test.mjs starts (DATABASE_URL points at it).
export default defineConfig({
  resolve: { alias: { '@': root, 'server-only': `${root}tests/support/server-only.ts` } },
  test: {
    projects: [
      {
        resolve: { alias: { '@': root, 'server-only': `${root}tests/support/server-only.ts` } },
        test: {
          name: 'unit',
          environment: 'node',
          include: ['tests/unit/**/*.test.ts', 'tests/unit/**/*.test.tsx'],
          // Some engine tests take 1–2 s alone and several run side by side on a 2-core CI box;
          // the default 5 s would turn load into failures. Speed is measured by `npm run bench`.
          testTimeout: 30_000,
        },
      },
      {
        resolve: { alias: { '@': root, 'server-only': `${root}tests/support/server-only.ts` } },
        test: {
          name: 'integ',
          environment: 'node',
          include: ['tests/integ/**/*.integ.ts'],
          fileParallelism: false,
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
    ],
  },
});
