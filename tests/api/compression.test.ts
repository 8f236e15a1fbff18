// Compressed answers: the app's files at zlib's default level (the smallest bundles, made once per file
// and cacheable), API answers at the fastest level (made per request, where the CPU is the cost).
import { mkdtempSync, mkdirSync, rmSync, writeFileSync } from 'node:fs';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { constants, gunzipSync, gzipSync } from 'node:zlib';
import pino from 'pino';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '@bumperline/api/app';
import { createMailer } from '@bumperline/api/services/mailer';
import { folderPhotoStore } from '@bumperline/api/services/photo-store';
import { signInCookie } from '../bench/support/sign-in.ts';
import { buildTestApp, ORIGIN, type TestApp } from '../support/app.ts';
import { createCompany, TEST_PASSWORD } from '../support/factories.ts';

let t: TestApp;
let server: http.Server;
let base: string;
let cookie: string;
let webDist: string;
const bundle = Array.from({ length: 400 }, (_, i) => `export function screen${i}(props) { return render(props, ${i}); }\n`).join('');

beforeAll(async () => {
  t = await buildTestApp();
  const company = await createCompany(t.db.owner, 'Squeezed Answers', 15);
  webDist = mkdtempSync(path.join(os.tmpdir(), 'bumperline-compression-'));
  mkdirSync(path.join(webDist, 'assets'));
  writeFileSync(path.join(webDist, 'index.html'), '<!doctype html><title>Bumperline</title>');
  writeFileSync(path.join(webDist, 'assets', 'app-abc123.js'), bundle);
  const app = createApp({
    db: t.appDb,
    mailer: createMailer({ fakePort: 1, from: 'x@y.test' }),
    logger: pino({ level: 'silent' }),
    authSecret: 'test-secret-that-is-at-least-32-characters-long',
    smsAuthToken: 'test-twilio-auth-token',
    photos: folderPhotoStore(path.join(os.tmpdir(), 'bumperline-test-photos')),
    appOrigin: ORIGIN,
    webDist,
  });
  server = app.listen(0, '127.0.0.1');
  await new Promise((resolve) => server.once('listening', resolve));
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  cookie = await signInCookie(base, company.ownerEmail, TEST_PASSWORD);
});
afterAll(async () => {
  await new Promise((resolve) => server.close(resolve));
  rmSync(webDist, { recursive: true, force: true });
  await t.close();
});

/** The answer's bytes as sent (node:http does not decompress). */
function getRaw(url: string, headers: Record<string, string>): Promise<{ status: number; encoding?: string; body: Buffer }> {
  return new Promise((resolve, reject) => {
    http
      .get(url, { headers }, (res) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => resolve({ status: res.statusCode!, encoding: res.headers['content-encoding'], body: Buffer.concat(chunks) }));
      })
      .on('error', reject);
  });
}

describe('compressed answers', () => {
  it('an API list comes gzipped at the fastest level, and decompresses to the same JSON', async () => {
    const res = await getRaw(`${base}/api/venues?sort=name&order=asc&limit=50`, { cookie, 'accept-encoding': 'gzip' });
    expect(res.status).toBe(200);
    expect(res.encoding).toBe('gzip');
    const json = gunzipSync(res.body);
    expect((JSON.parse(json.toString('utf8')) as { items: unknown[] }).items).toHaveLength(15);
    expect(res.body.equals(gzipSync(json, { level: constants.Z_BEST_SPEED }))).toBe(true);
  });

  it('the app’s files come gzipped at the default level', async () => {
    const res = await getRaw(`${base}/assets/app-abc123.js`, { 'accept-encoding': 'gzip' });
    expect(res.status).toBe(200);
    expect(res.encoding).toBe('gzip');
    expect(gunzipSync(res.body).toString('utf8')).toBe(bundle);
    expect(res.body.equals(gzipSync(Buffer.from(bundle)))).toBe(true);
    expect(res.body.equals(gzipSync(Buffer.from(bundle), { level: constants.Z_BEST_SPEED }))).toBe(false);
  });

  it('a small API answer and a client that does not ask get plain bytes', async () => {
    const health = await getRaw(`${base}/api/health`, { 'accept-encoding': 'gzip' });
    expect(health.encoding).toBeUndefined();
    expect(JSON.parse(health.body.toString('utf8'))).toMatchObject({ status: 'ok' });
    const plain = await getRaw(`${base}/api/venues?sort=name&order=asc&limit=50`, { cookie });
    expect(plain.encoding).toBeUndefined();
    expect((JSON.parse(plain.body.toString('utf8')) as { items: unknown[] }).items).toHaveLength(15);
  });
});
