import os from 'node:os';
import path from 'node:path';
import { folderPhotoStore } from '@bumperline/api/services/photo-store';
// The health check tells the truth about the database, and the API recovers when it comes back.
import request from 'supertest';
import pino from 'pino';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { inject } from 'vitest';
import pg from 'pg';
import { createApp } from '@bumperline/api/app';
import { createMailer } from '@bumperline/api/services/mailer';
import { createDb } from '@bumperline/db/client';
import { freshDatabase, type TestDatabase } from '../support/database.ts';

let db: TestDatabase;
beforeAll(async () => {
  db = await freshDatabase();
});
afterAll(() => db.drop());

function appOn(url: string) {
  return createApp({
    db: createDb(url, { max: 2 }),
    mailer: createMailer({ fakePort: 1, from: 'x@y.test' }),
    logger: pino({ level: 'silent' }),
    authSecret: 'test-secret-that-is-at-least-32-characters-long',
    smsAuthToken: 'test-twilio-auth-token',
    photos: folderPhotoStore(path.join(os.tmpdir(), 'bumperline-test-photos')),
    appOrigin: 'http://127.0.0.1:3999',
  });
}

describe('GET /api/health', () => {
  it('is ok with the database up', async () => {
    const res = await request(appOn(db.appUrl)).get('/api/health').expect(200);
    expect(res.body).toEqual({ status: 'ok', db: 'ok' });
  });

  it('is 503 while the database refuses connections, and ok again once it is back', async () => {
    const app = appOn(db.appUrl);
    await request(app).get('/api/health').expect(200);
    // Stop the app role from connecting and end its sessions: the database is "down" for the API.
    const admin = new pg.Client({ connectionString: inject('adminUrl') });
    await admin.connect();
    try {
      await admin.query(`alter database ${db.database} allow_connections false`);
      await admin.query(`select pg_terminate_backend(pid) from pg_stat_activity where datname = $1 and usename = 'bumperline_app'`, [
        db.database,
      ]);
      const down = await request(app).get('/api/health').expect(503);
      expect(down.headers['content-type']).toMatch(/problem\+json/);
      expect(down.body).toMatchObject({ status: 503, db: 'down' });
      const list = await request(app).get('/api/venues');
      expect([401, 503]).toContain(list.status);
    } finally {
      await admin.query(`alter database ${db.database} allow_connections true`);
      await admin.end();
    }
    await request(app).get('/api/health').expect(200);
  });

  it('points at a server that is not there: 503, not a crash', async () => {
    const res = await request(appOn('postgres://nobody:x@127.0.0.1:1/none')).get('/api/health').expect(503);
    expect(res.body.db).toBe('down');
  });
});
