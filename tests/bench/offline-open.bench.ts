/**
 * My day opened on a phone without signal: load it once online (the service worker installs, the phone saves its copy),
 * go offline, then reload N times and time each from navigation start to the first stop on screen — all of it served
 * by the service worker and IndexedDB, nothing by the network. Prints the median; never asserted.
 * Needs the built web app (`npx vite build`).
 *   npx tsx tests/bench/offline-open.bench.ts        (OFFLINE_RUNS=<n>, default 15)
 */
import { existsSync } from 'node:fs';
import path from 'node:path';
import { chromium } from '@playwright/test';
import { repoRoot, startDemoServer } from '../support/demo-server.ts';
import { demo, DEMO_PASSWORD } from '../e2e/fixtures.ts';

const RUNS = Number(process.env.OFFLINE_RUNS ?? 15);
const median = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)] ?? NaN;

if (!existsSync(path.join(repoRoot, 'dist/web/index.html'))) {
  console.log('offline-open: skipped — build the web app first (npx vite build).');
} else {
  const server = await startDemoServer();
  const browser = await chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    headless: true,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
      '--no-first-run',
    ],
  });
  try {
    const ctx = await browser.newContext({ viewport: { width: 390, height: 844 } });
    const page = await ctx.newPage();
    await page.goto(`${server.baseUrl}/sign-in`);
    await page.getByLabel('E-mail').fill(demo.technician);
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    const firstStop = page.getByRole('list', { name: 'Stops in driving order' }).locator(':scope > li').first();
    await firstStop.waitFor({ timeout: 30_000 });
    await page.waitForLoadState('networkidle');
    // The service worker has taken control and the copy is written.
    await page.evaluate(() => navigator.serviceWorker.ready);
    await page.reload();
    await firstStop.waitFor();
    await page.waitForTimeout(1_000);

    await ctx.setOffline(true);
    const times: number[] = [];
    let fromNetwork = 0;
    page.on('requestfailed', () => fromNetwork++);
    for (let i = 0; i < RUNS; i++) {
      await page.reload();
      await firstStop.waitFor({ timeout: 10_000 });
      times.push(await page.evaluate(() => performance.now()));
    }
    console.log(`offline-open: My day from the phone's copy, offline, ${RUNS} reloads (390 × 844, Chromium)`);
    console.log(
      `  navigation start → first stop visible: median ${median(times).toFixed(0)} ms (min ${Math.min(...times).toFixed(0)}, max ${Math.max(...times).toFixed(0)})`,
    );
    console.log(`  requests that tried the network and failed: ${fromNetwork} (the /api/account/me preload and refetches, expected)`);
    await ctx.close();
  } finally {
    await browser.close();
    await server.stop();
  }
}
