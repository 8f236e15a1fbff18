// Rate limits are counted in PostgreSQL, so two API instances behind a load balancer share one count.
import os from 'node:os';
import path from 'node:path';
import pino from 'pino';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sql } from 'drizzle-orm';
import { createApp } from '@bumperline/api/app';
import { createMailer } from '@bumperline/api/services/mailer';
import { SignInLimiter } from '@bumperline/api/auth/sign-in-limiter';
import { postgresCounter } from '@bumperline/api/http/rate-limit-counter';
import { runRateLimitCleanupOnce } from '@bumperline/api/jobs/rate-limit-cleanup';
import { folderPhotoStore } from '@bumperline/api/services/photo-store';
import { freshDatabase, type TestDatabase } from '../support/database.ts';
import { createCompany, TEST_PASSWORD } from '../support/factories.ts';
import { signIn } from '../support/app.ts';

let db: TestDatabase;
beforeAll(async () => {
  db = await freshDatabase();
});
afterAll(() => db.drop());

function instance() {
  return createApp({
    db: db.app,
    mailer: createMailer({ fakePort: 1, from: 'x@y.test' }),
    logger: pino({ level: 'silent' }),
    authSecret: 'test-secret-that-is-at-least-32-characters-long',
    appOrigin: 'http://127.0.0.1:3999',
    smsAuthToken: 'test-twilio-auth-token',
    photos: folderPhotoStore(path.join(os.tmpdir(), 'bumperline-test-photos')),
    signInLimiter: new SignInLimiter(postgresCounter(db.app), { perAccount: 3 }),
  });
}

describe('sign-in rate limit across API instances', () => {
  it('counts attempts made on either instance together, and stores no e-mail or address', async () => {
    const company = await createCompany(db.owner, 'Shared Count Games', 1);
    const [one, two] = [instance(), instance()];
    expect(await signIn(request.agent(one), company.ownerEmail, 'wrong password 1')).toBe(401);
    expect(await signIn(request.agent(two), company.ownerEmail, 'wrong password 2')).toBe(401);
    expect(await signIn(request.agent(one), company.ownerEmail, 'wrong password 3')).toBe(401);
    // The fourth attempt is over the limit of 3, on whichever instance it lands, even with the right password.
    expect(await signIn(request.agent(two), company.ownerEmail, TEST_PASSWORD)).toBe(401);
    const rows = await db.owner.execute(sql`select key from rate_limit_counters`);
    expect(rows.rows.length).toBeGreaterThan(0);
    for (const r of rows.rows as { key: string }[]) {
      expect(r.key).toMatch(/^[0-9a-f]{64}$/);
      expect(r.key).not.toContain(company.ownerEmail);
    }
  });
});

describe('expired counters', () => {
  it('are deleted by the clean-up job, which keeps the ones still counting', async () => {
    const counter = postgresCounter(db.app);
    await db.owner.execute(sql`delete from rate_limit_counters`);
    await counter.hit('cleanup:expired-1', 60_000);
    await counter.hit('cleanup:expired-2', 60_000);
    // Their windows have passed.
    await db.owner.execute(sql`update rate_limit_counters set reset_at = now() - interval '1 second'`);
    await counter.hit('cleanup:live', 60_000);
    const before = await db.owner.execute<{ expired: number; live: number }>(
      sql`select count(*) filter (where reset_at <= now())::int as expired, count(*) filter (where reset_at > now())::int as live from rate_limit_counters`,
    );
    expect(before.rows[0]).toEqual({ expired: 2, live: 1 });

    const deleted = await runRateLimitCleanupOnce({ db: db.app });
    expect(deleted).toBe(2);
    const after = await db.owner.execute<{ expired: number; live: number }>(
      sql`select count(*) filter (where reset_at <= now())::int as expired, count(*) filter (where reset_at > now())::int as live from rate_limit_counters`,
    );
    expect(after.rows[0]).toEqual({ expired: 0, live: 1 });
    // The live counter keeps its count.
    expect((await counter.hit('cleanup:live', 60_000)).hits).toBe(2);
  });
});
