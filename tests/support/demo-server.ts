// The real product in demo mode (built web app + API, fakes, demo data) on a throwaway PostgreSQL cluster:
// how the browser tests and the first-screen benchmark start it.
import { spawn } from 'node:child_process';
import { createServer } from 'node:net';
import path from 'node:path';

export const repoRoot = path.resolve(import.meta.dirname, '../..');

/** The tool's own binary, not npx: stopping npx would leave its node child running. */
export const demoServerCommand = 'node_modules/.bin/tsx apps/api/src/main.ts';

/** The demo, as `npm start` runs it: fakes for mail and SMS, the demo data, the /dev pages. */
export function demoServerEnv(port: number): Record<string, string> {
  return {
    BUMPERLINE_MODE: 'demo',
    NODE_ENV: 'production',
    PORT: String(port),
    DB_CLUSTER: 'ephemeral',
    LOG_LEVEL: 'warn',
    AUTH_SECRET: 'e2e-secret-that-is-at-least-32-characters-long',
  };
}

async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const probe = createServer();
    probe.once('error', reject);
    probe.listen(0, '127.0.0.1', () => {
      const { port } = probe.address() as { port: number };
      probe.close(() => resolve(port));
    });
  });
}

export interface DemoServer {
  baseUrl: string;
  stop(): Promise<void>;
}

/** Starts the product on a free port and waits until /api/health answers (the first start seeds the demo). */
export async function startDemoServer(timeoutMs = 120_000): Promise<DemoServer> {
  const port = await freePort();
  const [bin, ...args] = demoServerCommand.split(' ');
  const child = spawn(bin!, args, {
    cwd: repoRoot,
    env: { ...process.env, ...demoServerEnv(port) },
    stdio: ['ignore', 'ignore', 'inherit'],
  });
  const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()));
  const baseUrl = `http://127.0.0.1:${port}`;
  const stop = async () => {
    if (child.exitCode === null && child.signalCode === null) child.kill('SIGTERM');
    await exited;
  };
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (child.exitCode !== null) throw new Error(`the demo server exited with code ${child.exitCode} before answering`);
    const ok = await fetch(`${baseUrl}/api/health`).then(
      (r) => r.ok,
      () => false,
    );
    if (ok) return { baseUrl, stop };
    await new Promise((r) => setTimeout(r, 250));
  }
  await stop();
  throw new Error(`the demo server did not answer within ${timeoutMs / 1000} s`);
}
