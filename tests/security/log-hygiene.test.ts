// What a production log may hold: one short line per request, no tokens from URLs, no headers, and no
// query parameters or database values from a failed query. The log is captured and searched for each
// kind of secret the requests carried.
import { Writable } from 'node:stream';
import os from 'node:os';
import path from 'node:path';
import { sql } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '@bumperline/api/app';
import { createLogger } from '@bumperline/api/http/logger';
import { createMailer } from '@bumperline/api/services/mailer';
import { folderPhotoStore } from '@bumperline/api/services/photo-store';
import type { Db } from '@bumperline/db/client';
import { hashPassword } from '@bumperline/db/passwords';
import { freshDatabase, type TestDatabase } from '../support/database.ts';
import { createCompany, createUser } from '../support/factories.ts';
import { signIn } from '../support/app.ts';

let db: TestDatabase;
beforeAll(async () => {
  db = await freshDatabase();
});
afterAll(() => db.drop());

/** The real app over this database, logging through the given logger (as production does). */
function appLoggingTo(db: Db, logger: ReturnType<typeof createLogger>) {
  return createApp({
    db,
    mailer: createMailer({ fakePort: 1, from: 'x@y.test' }),
    logger,
    authSecret: 'test-secret-that-is-at-least-32-characters-long',
    smsAuthToken: 'test-twilio-auth-token',
    photos: folderPhotoStore(path.join(os.tmpdir(), 'bumperline-test-photos')),
    appOrigin: 'http://127.0.0.1:3999',
  });
}

function capture() {
  const lines: string[] = [];
  const sink = new Writable({
    write(chunk, _enc, cb) {
      lines.push(...String(chunk).split('\n').filter(Boolean));
      cb();
    },
  });
  return { lines, logger: createLogger({ level: 'info', destination: sink }) };
}

describe('production logs', () => {
  it('hold one short line per request, with tokens in URLs redacted and no headers', async () => {
    const { lines, logger } = capture();
    const app = appLoggingTo(db.app, logger);
    const company = await createCompany(db.owner, 'Quiet Logs', 1);
    const tag = (await db.owner.execute(sql`select tag_token from games where id = ${company.gameIds[0]!}`)).rows[0] as {
      tag_token: string;
    };
    const secrets = {
      tag: tag.tag_token,
      status: 'StatusTokenAbcdefghijklmnop',
      invitation: 'InvitationTokenQrstuvwxyz012345',
      reset: 'ResetTokenZyxwvutsrqponmlk',
      header: 'a-header-value-nobody-should-log',
      search: 'searching-for-a-person@example.test',
    };
    const requests = [
      request(app).get(`/t/${secrets.tag}`).set('X-Custom-Header', secrets.header),
      request(app).get(`/status/${secrets.status}`).set('User-Agent', secrets.header),
      request(app).get(`/api/invitations/${secrets.invitation}`),
      request(app).get(`/reset-password?token=${secrets.reset}`),
      request(app).get(`/api/venues?q=${encodeURIComponent(secrets.search)}`),
    ];
    const answers = [];
    for (const r of requests) answers.push(await r);
    // A problem detail names the path it answers, but not a token in it.
    const invitation = answers[2]!;
    expect(invitation.status).toBeGreaterThanOrEqual(400);
    expect(invitation.body.instance).toBe('/api/invitations/[redacted]');

    const all = lines.join('\n');
    expect(lines.length).toBe(requests.length);
    for (const [kind, secret] of Object.entries(secrets)) expect(all, kind).not.toContain(secret);
    for (const line of lines) {
      const entry = JSON.parse(line) as Record<string, unknown>;
      expect(line.length, line).toBeLessThan(400);
      expect(JSON.stringify(entry.req ?? {})).not.toMatch(/headers/);
      expect(entry.msg).toMatch(/^GET \S+ \d{3} \d+ ms$/);
    }
    expect(all).toContain(`GET /t/[redacted] 200`);
    expect(all).toContain(`GET /reset-password?token=[redacted]`);
  });

  it('keep a failed request’s error code and stack, but not the query’s parameters', async () => {
    const { lines, logger } = capture();
    // A database of its own whose venues table is gone: the list query fails inside the handler.
    const broken = await freshDatabase();
    try {
      await broken.owner.execute(sql`drop table venues cascade`);
      const app = appLoggingTo(broken.app, logger);
      const company = await createCompany(broken.owner, 'Broken Tables', 0).catch(() => undefined);
      expect(company).toBeUndefined(); // the factory needs venues too: the table really is gone
      const owner = await createUser(broken.owner, { email: 'broken-owner@example.test' });
      const tenantId = crypto.randomUUID();
      await broken.owner.execute(
        sql`insert into tenants (id, name, time_zone, currency) values (${tenantId}, 'Broken', 'America/Chicago', 'USD')`,
      );
      await broken.owner.execute(sql`insert into memberships (tenant_id, user_id, role) values (${tenantId}, ${owner.id}, 'owner')`);
      const agent = request.agent(app);
      expect(await signIn(agent, owner.email)).toBe(200);
      const secret = 'someone-searched-for-this@example.test';
      await agent.get(`/api/venues?q=${encodeURIComponent(secret)}`).expect(500);
      type Logged = { code?: string; stack?: string; cause?: Logged };
      const entries = lines.map((l) => JSON.parse(l) as { msg?: string; err?: Logged });
      const errorLine = entries.find((l) => l.msg === 'unhandled error');
      // undefined_table, on the database error the failed query wraps: the log still says what went wrong.
      expect(errorLine?.err?.cause?.code).toBe('42P01');
      expect(errorLine?.err?.stack).toMatch(/\bat /);
      expect(lines.join('\n')).not.toContain(secret);
      // The request's own line stays one short line; the stack is logged once, above.
      const requestLine = lines.find((l) => l.includes('GET /api/venues?q=[redacted] 500'));
      expect(requestLine).toBeDefined();
      expect(requestLine!.length).toBeLessThan(400);
    } finally {
      await broken.drop();
    }
  });

  it('never print a failed query’s parameters or the values the database quotes back', async () => {
    const { lines, logger } = capture();
    const email = 'private.person@example.test';
    const phone = '+13125550187';
    const hash = await hashPassword('not logged either');
    let failure: unknown;
    try {
      // A unique violation quotes the duplicate value; a bad cast quotes its input.
      await db.owner.execute(sql`insert into users (email, name, password_hash, phone) values (${email}, 'A', ${hash}, ${phone})`);
      await db.owner.execute(sql`insert into users (email, name, password_hash, phone) values (${email}, 'B', ${hash}, ${phone})`);
    } catch (err) {
      failure = err;
    }
    expect(failure).toBeDefined();
    logger.error({ err: failure }, 'unhandled error');
    try {
      await db.owner.execute(sql`select ${phone}::int`);
    } catch (err) {
      logger.error({ err }, 'unhandled error');
    }
    const all = lines.join('\n');
    expect(lines.length).toBe(2);
    expect(all).toContain('23505'); // the SQLSTATE stays, so the log is still useful
    for (const secret of [email, phone, hash, '5550187']) expect(all).not.toContain(secret);
  });
});
