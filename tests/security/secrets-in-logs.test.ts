import os from 'node:os';
import path from 'node:path';
import { folderPhotoStore } from '@bumperline/api/services/photo-store';
// Passwords and session cookies never reach the logs, whatever happens to the request.
import { Writable } from 'node:stream';
import pino from 'pino';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '@bumperline/api/app';
import { createMailer } from '@bumperline/api/services/mailer';
import { freshDatabase, type TestDatabase } from '../support/database.ts';
import { createCompany, TEST_PASSWORD } from '../support/factories.ts';
import { JSON_HEADERS, signIn } from '../support/app.ts';

let db: TestDatabase;
beforeAll(async () => {
  db = await freshDatabase();
});
afterAll(() => db.drop());

describe('logs', () => {
  it('hold no password and no session cookie, on success or failure', async () => {
    const lines: string[] = [];
    const sink = new Writable({
      write(chunk, _enc, cb) {
        lines.push(String(chunk));
        cb();
      },
    });
    const app = createApp({
      db: db.app,
      mailer: createMailer({ fakePort: 1, from: 'x@y.test' }),
      logger: pino({ level: 'trace' }, sink),
      authSecret: 'test-secret-that-is-at-least-32-characters-long',
      smsAuthToken: 'test-twilio-auth-token',
      photos: folderPhotoStore(path.join(os.tmpdir(), 'bumperline-test-photos')),
      appOrigin: 'http://127.0.0.1:3999',
    });
    const company = await createCompany(db.owner, 'Logcheck Games', 1);
    const agent = request.agent(app);
    expect(await signIn(agent, company.ownerEmail, 'a-wrong-password-123')).toBe(401);
    expect(await signIn(agent, company.ownerEmail, TEST_PASSWORD)).toBe(200);
    await agent.get('/api/venues').expect(200);
    await agent
      .post('/api/account/sign-up')
      .set(JSON_HEADERS)
      .send({ companyName: 'X', name: 'Y', email: 'bad', password: 'hunter2-hunter2' })
      .expect(400);
    const all = lines.join('\n');
    expect(lines.length).toBeGreaterThan(3);
    expect(all).not.toContain(TEST_PASSWORD);
    expect(all).not.toContain('a-wrong-password-123');
    expect(all).not.toContain('hunter2-hunter2');
    expect(all).not.toMatch(/authjs\.session-token=/);
  });
});
