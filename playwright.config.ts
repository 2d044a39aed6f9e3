import { defineConfig } from '@playwright/test';

// Started by scripts/test.mjs, which provides the database, the fake SMTP server and the port.
const port = Number(process.env.PULSELOOM_TEST_PORT ?? 3100);
const baseURL = `http://localhost:${port}`;

export default defineConfig({
  testDir: 'tests/e2e',
  testMatch: '**/*.e2e.ts',
  outputDir: process.env.PULSELOOM_PW_OUT ?? 'test-results',
  fullyParallel: false,
  workers: 1,
  retries: 0,
  timeout: 60_000,
  expect: { timeout: 10_000 },
  reporter: [['list'], ['json']],
  use: {
    baseURL,
    trace: 'off',
    launchOptions: {
      // Debian's Chromium: Playwright cannot download its own browsers on this machine.
      executablePath: '/usr/bin/chromium',
      args: [
        '--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run',
        '--disable-background-networking', '--disable-component-update', '--disable-sync',
      ],
    },
  },
  webServer: {
    command: `node_modules/.bin/next start -H 127.0.0.1 -p ${port}`,
    url: `${baseURL}/api/health`,
    timeout: 60_000,
    reuseExistingServer: false,
    stdout: 'ignore',
    stderr: 'pipe',
  },
});
