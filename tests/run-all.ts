// `npm test`: unit and API integration suites (Vitest, on a private PostgreSQL), then the end-to-end
// suite (Playwright driving Debian's Chromium against the built product). Installs what is missing.
import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { ensureServerInstalled } from '@bumperline/db/lifecycle/cluster';
import { ensurePgbouncerInstalled } from '@bumperline/db/lifecycle/pgbouncer';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const only = process.argv.find((a) => a.startsWith('--only='))?.slice(7);
const bin = (tool: string) => path.join(root, 'node_modules', '.bin', tool);

function run(label: string, cmd: string, args: string[], cwd = root) {
  console.log(`\n=== ${label} ===`);
  const r = spawnSync(cmd, args, { cwd, stdio: 'inherit', env: process.env });
  if (r.status !== 0) {
    console.error(`\n${label} failed (exit ${r.status ?? r.signal}).`);
    process.exit(r.status ?? 1);
  }
}

function ensureChromium(): void {
  if (process.env.CHROMIUM_PATH ? existsSync(process.env.CHROMIUM_PATH) : existsSync('/usr/bin/chromium')) return;
  if (process.getuid?.() !== 0) {
    console.error('Chromium is not installed. Install the Debian package: sudo apt-get install chromium');
    process.exit(1);
  }
  console.log("Installing Debian's chromium with apt-get (about a minute)…");
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  execFileSync('apt-get', ['update', '-qq'], { stdio: 'inherit', env });
  execFileSync('apt-get', ['install', '-y', '-qq', 'chromium', 'fonts-liberation'], { stdio: 'inherit', env });
}

if (!only || only === 'static') {
  run('Type check', bin('tsc'), ['--noEmit', '-p', 'tsconfig.json']);
  run('Lint', bin('eslint'), ['--config', '.eslint.config.js', '.', '--max-warnings', '0']);
  run('Formatting', bin('prettier'), ['--check', '.', '--log-level', 'warn']);
}
ensureServerInstalled();
if (!only || only === 'vitest') {
  ensurePgbouncerInstalled(); // the scale-out suite puts PgBouncer in front of the test cluster
  run('Unit and API integration tests (Vitest)', bin('vitest'), ['run']);
}
if (!only || only === 'e2e') {
  ensureChromium();
  run('Build the web app', bin('vite'), ['build', '--logLevel', 'warn']);
  run(
    'End-to-end tests (Playwright + Chromium)',
    bin('playwright'),
    ['test', '--config', 'e2e/playwright.config.ts'],
    path.join(root, 'tests'),
  );
}
console.log('\nAll test suites passed.');
