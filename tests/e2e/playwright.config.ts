import path from 'node:path';
import { defineConfig } from '@playwright/test';

// End-to-end tests drive Debian's Chromium against the real product (built web app + API) on a
// throwaway PostgreSQL cluster with the demo data. Nothing is downloaded.
const port = Number(process.env.E2E_PORT ?? 3100);
const repoRoot = path.resolve(import.meta.dirname, '../..');

export default defineConfig({
  testDir: '.',
  testMatch: '**/*.e2e.ts',
  fullyParallel: false,
  workers: 1,
  retries: 0,
  timeout: 60_000,
  reporter: [['list']],
  outputDir: '../../test-results',
  use: {
    baseURL: `http://127.0.0.1:${port}`,
    launchOptions: {
      executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
      args: [
        '--no-sandbox',
        '--disable-gpu',
        '--disable-dev-shm-usage',
        '--disable-background-networking',
        '--disable-component-update',
        '--disable-sync',
        '--no-first-run',
      ],
    },
    screenshot: 'only-on-failure',
    trace: 'off',
  },
  webServer: {
    // The tool's own binary, not npx: stopping npx would leave its node child running.
    command: 'node_modules/.bin/tsx apps/api/src/main.ts',
    cwd: repoRoot,
    url: `http://127.0.0.1:${port}/api/health`,
    timeout: 120_000,
    reuseExistingServer: false,
    stdout: 'ignore',
    stderr: 'pipe',
    env: {
      // The demo, as `npm start` runs it: fakes for mail and SMS, the demo data, the /dev pages.
      BUMPERLINE_MODE: 'demo',
      NODE_ENV: 'production',
      PORT: String(port),
      DB_CLUSTER: 'ephemeral',
      LOG_LEVEL: 'warn',
      AUTH_SECRET: 'e2e-secret-that-is-at-least-32-characters-long',
    },
  },
});
