import { defineConfig } from '@playwright/test';
import { demoServerCommand, demoServerEnv, repoRoot } from '../support/demo-server.ts';

// End-to-end tests drive Debian's Chromium against the real product (built web app + API) on a
// throwaway PostgreSQL cluster with the demo data. Nothing is downloaded.
const port = Number(process.env.E2E_PORT ?? 3100);

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
    // The app's service worker precaches every bundle on a fresh context; only the offline suites need it
    // (my-day.e2e.ts allows it), the others would pay for it on every test.
    serviceWorkers: 'block',
    trace: 'off',
  },
  webServer: {
    command: demoServerCommand,
    cwd: repoRoot,
    url: `http://127.0.0.1:${port}/api/health`,
    timeout: 120_000,
    reuseExistingServer: false,
    stdout: 'ignore',
    stderr: 'pipe',
    env: demoServerEnv(port),
  },
});
