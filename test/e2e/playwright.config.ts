import { defineConfig } from '@playwright/test';
import path from 'node:path';

/**
 * Journeys in Debian's chromium against the app started by `npm test`
 * (test/run.mjs sets BASE_URL). Screenshots go to test/artifacts/.
 */
export default defineConfig({
  testDir: '.',
  testMatch: '**/*.e2e.ts',
  timeout: 120_000,
  expect: { timeout: 15_000 },
  workers: 1,
  // One retry: a few journeys (flags-screens, overview) failed once in a full run on this busy 2-core machine and
  // passed on their own; a retry that passes is counted and listed as flaky in the report, not hidden.
  retries: 1,
  outputDir: path.join(__dirname, '..', 'artifacts', 'playwright'),
  use: {
    baseURL: process.env.BASE_URL ?? 'http://127.0.0.1:4100',
    viewport: { width: 1440, height: 900 },
    screenshot: 'only-on-failure',
    trace: 'retain-on-failure',
    launchOptions: {
      executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
      args: ['--disable-dev-shm-usage', '--disable-background-networking', '--disable-component-update', '--no-first-run', '--disable-sync'],
    },
  },
});
