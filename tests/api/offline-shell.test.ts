// The files that keep the app on a phone without signal, as the API serves them: the service worker and its manifest
// are always revalidated (a new release reaches phones on their next load), hashed bundles are kept for good, and a
// client-side route gets the app shell.
import { mkdtempSync, mkdirSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import pino from 'pino';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '@bumperline/api/app';
import { createMailer } from '@bumperline/api/services/mailer';
import { folderPhotoStore } from '@bumperline/api/services/photo-store';
import { buildTestApp, ORIGIN, type TestApp } from '../support/app.ts';

let t: TestApp;
let webDist: string;
let app: ReturnType<typeof createApp>;

beforeAll(async () => {
  t = await buildTestApp();
  webDist = mkdtempSync(path.join(os.tmpdir(), 'bumperline-offline-shell-'));
  mkdirSync(path.join(webDist, 'assets'));
  writeFileSync(path.join(webDist, 'index.html'), '<!doctype html><title>Bumperline</title>');
  writeFileSync(path.join(webDist, 'sw.js'), 'self.addEventListener("fetch", () => {});');
  writeFileSync(path.join(webDist, 'workbox-abc123.js'), '/* workbox */');
  writeFileSync(path.join(webDist, 'manifest.webmanifest'), '{"name":"Bumperline"}');
  writeFileSync(path.join(webDist, 'assets', 'app-abc123.js'), 'export {};');
  app = createApp({
    db: t.appDb,
    mailer: createMailer({ fakePort: 1, from: 'x@y.test' }),
    logger: pino({ level: 'silent' }),
    authSecret: 'test-secret-that-is-at-least-32-characters-long',
    smsAuthToken: 'test-twilio-auth-token',
    photos: folderPhotoStore(path.join(os.tmpdir(), 'bumperline-test-photos')),
    appOrigin: ORIGIN,
    webDist,
  });
});
afterAll(async () => {
  rmSync(webDist, { recursive: true, force: true });
  await t.close();
});

describe('the offline app shell', () => {
  it('serves the service worker and the manifest to be revalidated on every load', async () => {
    const sw = await request(app).get('/sw.js').expect(200);
    expect(sw.headers['cache-control']).toBe('no-cache');
    expect(sw.headers['content-type']).toMatch(/javascript/);
    const manifest = await request(app).get('/manifest.webmanifest').expect(200);
    expect(manifest.headers['cache-control']).toBe('no-cache');
  });

  it('keeps hashed bundles for good and other root files for an hour', async () => {
    expect((await request(app).get('/assets/app-abc123.js').expect(200)).headers['cache-control']).toMatch(/immutable/);
    expect((await request(app).get('/workbox-abc123.js').expect(200)).headers['cache-control']).toBe('public, max-age=3600');
  });

  it('answers a client-side route (a stop on My day) with the app shell, never cached stale', async () => {
    const page = await request(app).get('/my-day/stops/4b0a3f3e-1c1e-4c8e-9d4a-2f1b3c4d5e6f').expect(200);
    expect(page.text).toContain('<title>Bumperline</title>');
    expect(page.headers['cache-control']).toBe('no-cache');
  });
});
