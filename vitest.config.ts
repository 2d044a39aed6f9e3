import { defineConfig } from 'vitest/config';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('.', import.meta.url));

// Two layers: pure unit tests, and integration tests against the real PostgreSQL
// cluster that scripts/test.mjs starts (DATABASE_URL points at it).
export default defineConfig({
  resolve: { alias: { '@': root } },
  test: {
    projects: [
      {
        resolve: { alias: { '@': root } },
        test: {
          name: 'unit',
          environment: 'node',
          include: ['tests/unit/**/*.test.ts', 'tests/unit/**/*.test.tsx'],
        },
      },
      {
        resolve: { alias: { '@': root } },
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
