// The two ways to start Bumperline. A production start refuses to run without its real settings, and
// with them never mounts a fake or seeds demo data. The demo's developer pages answer this machine only.
import { spawn } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { createServer } from 'node:net';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import os from 'node:os';
import type { Express } from 'express';
import { sql } from 'drizzle-orm';
import pg from 'pg';
import pino from 'pino';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { inject } from 'vitest';
import { dropDatabase, urlsFor } from '@bumperline/db/lifecycle/provision';
import { createApp } from '@bumperline/api/app';
import { createMailer } from '@bumperline/api/services/mailer';
import { folderPhotoStore } from '@bumperline/api/services/photo-store';
import { buildTestApp, ORIGIN, type TestApp } from '../support/app.ts';
import { createCompany } from '../support/factories.ts';

const repoRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const tsx = path.join(repoRoot, 'node_modules/.bin/tsx');

/** Starts the real entry point with exactly these variables (nothing inherited but PATH and HOME). */
function startMain(vars: Record<string, string>) {
  const child = spawn(tsx, ['apps/api/src/main.ts'], {
    cwd: repoRoot,
    env: { PATH: process.env.PATH!, HOME: process.env.HOME ?? '/tmp', LOG_LEVEL: 'warn', ...vars },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  child.stdout.on('data', (d) => (output += String(d)));
  child.stderr.on('data', (d) => (output += String(d)));
  const exited = new Promise<number | null>((resolve) => child.on('exit', (code) => resolve(code)));
  return { child, exited, output: () => output };
}

async function freePort(): Promise<number> {
  const server = createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const port = (server.address() as { port: number }).port;
  await new Promise((resolve) => server.close(resolve));
  return port;
}

async function waitForHealth(url: string, exited: Promise<unknown>): Promise<void> {
  let done = false;
  void exited.then(() => (done = true));
  for (let i = 0; i < 300 && !done; i++) {
    const ok = await fetch(url)
      .then((r) => r.ok)
      .catch(() => false);
    if (ok) return;
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error('the server did not become healthy');
}

describe('a production start', () => {
  it('refuses to run without its settings, naming each one', async () => {
    const run = startMain({});
    expect(await run.exited).toBe(1);
    for (const name of [
      'DATABASE_URL',
      'APP_ORIGIN',
      'AUTH_SECRET',
      'SMTP_URL',
      'TWILIO_ACCOUNT_SID',
      'TWILIO_AUTH_TOKEN',
      'TWILIO_FROM',
    ]) {
      expect(run.output()).toContain(name);
    }
  });

  it('refuses while even one setting is missing', async () => {
    const run = startMain({
      DATABASE_URL: 'postgres://nobody@127.0.0.1:1/none',
      APP_ORIGIN: 'https://ops.example.com',
      AUTH_SECRET: randomBytes(32).toString('hex'),
      TWILIO_ACCOUNT_SID: 'AC123',
      TWILIO_AUTH_TOKEN: 'token',
      TWILIO_FROM: '+13125550100',
    });
    expect(await run.exited).toBe(1);
    expect(run.output()).toMatch(/SMTP_URL: the mail server/);
    expect(run.output()).not.toMatch(/AUTH_SECRET:/);
  });

  it('with its settings serves no developer page and seeds no demo data', async () => {
    const adminUrl = inject('adminUrl');
    const database = `bl_prod_${randomBytes(4).toString('hex')}`;
    const port = await freePort();
    const run = startMain({
      DATABASE_URL: adminUrl,
      DATABASE_NAME: database,
      PORT: String(port),
      APP_ORIGIN: `http://127.0.0.1:${port}`,
      AUTH_SECRET: randomBytes(32).toString('hex'),
      SMTP_URL: 'smtp://127.0.0.1:1',
      TWILIO_ACCOUNT_SID: 'AC' + randomBytes(16).toString('hex'),
      TWILIO_AUTH_TOKEN: randomBytes(16).toString('hex'),
      TWILIO_FROM: '+13125550100',
    });
    try {
      await waitForHealth(`http://127.0.0.1:${port}/api/health`, run.exited);
      for (const page of ['/dev/outbox', '/dev/outbox.json', '/dev/phone', '/dev/phone.json']) {
        const res = await fetch(`http://127.0.0.1:${port}${page}`);
        expect(res.status, page).toBe(404);
        expect(await res.text(), page).not.toMatch(/Captured e-mail|"messages"/);
      }
      const reply = await fetch(`http://127.0.0.1:${port}/dev/phone/reply`, { method: 'POST', body: 'from=%2B13125550142&body=YES' });
      expect(reply.status).toBe(404);
      expect(run.output()).not.toMatch(/DEMO MODE/);
      const client = new pg.Client({ connectionString: urlsFor(adminUrl, database).ownerUrl });
      await client.connect();
      const { rows } = await client.query(
        'select (select count(*)::int from tenants) as tenants, (select count(*)::int from users) as users',
      );
      await client.end();
      expect(rows[0]).toEqual({ tenants: 0, users: 0 });
    } finally {
      run.child.kill('SIGTERM');
      await run.exited;
      await dropDatabase(adminUrl, database);
    }
  });
});

describe('the demo’s developer pages', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await buildTestApp({ sms: true });
  });
  afterAll(() => t.close());

  it('answer a browser on this machine', async () => {
    await request(t.app).get('/dev/outbox.json').expect(200);
    await request(t.app).get('/dev/phone.json').expect(200);
  });

  it('do not exist for a request that came through a proxy', async () => {
    await request(t.app).get('/dev/outbox.json').set('X-Forwarded-For', '203.0.113.9').expect(404);
    await request(t.app).get('/dev/phone').set('X-Forwarded-For', '203.0.113.9').expect(404);
    await request(t.app)
      .post('/dev/phone/reply')
      .set('X-Forwarded-For', '203.0.113.9')
      .type('form')
      .send({ from: '+13125550142', body: 'YES' })
      .expect(404);
  });
});

describe('the trust-proxy setting', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await buildTestApp();
  });
  afterAll(() => t.close());

  /** What the report page's per-address limit has left after one report attempt from `address`. */
  async function remainingFor(app: Express, token: string, address: string): Promise<string> {
    const res = await request(app).post(`/t/${token}`).set('X-Forwarded-For', address).field('problem', 'nonsense');
    // RateLimit (draft-8) lists each policy; the per-address one comes first, the per-tag one after it.
    return String(res.headers['ratelimit'] ?? '').split(',')[0]!;
  }

  it('decides whether addresses behind a proxy are counted apart', async () => {
    const company = await createCompany(t.db.owner, 'Proxy Pinball', 1);
    const { tag_token: token } = (await t.db.owner.execute(sql`select tag_token from games where id = ${company.gameIds[0]!}`)).rows[0] as {
      tag_token: string;
    };
    const build = (trustProxy: boolean | string) =>
      createApp({
        db: t.db.app,
        mailer: createMailer({ fakePort: t.mail.port, from: 'x@y.test' }),
        logger: pino({ level: 'silent' }),
        authSecret: 'test-secret-that-is-at-least-32-characters-long',
        smsAuthToken: 'unused-here',
        photos: folderPhotoStore(path.join(os.tmpdir(), 'bumperline-test-photos')),
        appOrigin: ORIGIN,
        trustProxy,
      });
    const trusting = build('loopback');
    const first = await remainingFor(trusting, token, '203.0.113.10');
    // Believed: a second client is a fresh count.
    expect(await remainingFor(trusting, token, '203.0.113.11')).toBe(first);
    // Not believed: every client looks like the proxy itself, one shared count.
    const distrusting = build(false);
    const a = await remainingFor(distrusting, token, '203.0.113.12');
    const b = await remainingFor(distrusting, token, '203.0.113.13');
    expect(a).not.toBe('');
    expect(b).not.toBe(a);
  });
});
