// The outbox worker: retries with backoff and sends once, gives up after enough attempts, blocks opted-out
// numbers, recovers rows a dead process left mid-send without sending them twice, and never sends a
// row twice when several workers (or API instances) run at once.
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { and, eq, sql } from 'drizzle-orm';
import pino from 'pino';
import { withScope } from '@bumperline/db/client';
import { enqueueMessage } from '@bumperline/db/queries/outbox';
import { outbox, smsOptOuts } from '@bumperline/db/schema/index';
import { MAX_ATTEMPTS, retryDelayMs, runOutboxOnce, type OutboxDeps } from '@bumperline/api/jobs/outbox-worker';
import { JOB_LOCKS, runExclusive, startJobs } from '@bumperline/api/jobs/scheduler';
import { createMailer } from '@bumperline/api/services/mailer';
import { buildTestApp, ORIGIN, type TestApp, type TestSms } from '../support/app.ts';
import { createCompany, type CompanyFixture } from '../support/factories.ts';
import { outboxRows } from '../support/call-factories.ts';

let t: TestApp;
let sms: TestSms;
let a: CompanyFixture;
let b: CompanyFixture;
let deps: OutboxDeps;

beforeAll(async () => {
  t = await buildTestApp({ sms: true });
  sms = t.sms!;
  a = await createCompany(t.db.owner, 'Alpha Amusements', 1);
  b = await createCompany(t.db.owner, 'Beta Games', 1);
  deps = {
    db: t.db.app,
    sms: sms.sender,
    mailer: createMailer({ fakePort: t.mail.port, from: 'Bumperline test <test@bumperline.example>' }),
  };
});
afterAll(() => t.close());
beforeEach(async () => {
  await sms.fake.idle();
  sms.fake.failNext(0);
  // Each test starts with an empty outbox, so counts are its own.
  await t.db.owner.delete(outbox);
});

const minutes = (n: number) => n * 60_000;

/** Queues a message for `company` through the same query the services use, inside its scope. */
async function enqueue(company: CompanyFixture, m: { to: string; body: string; channel?: 'sms' | 'email'; subject?: string }) {
  await withScope(t.db.app, { tenantId: company.tenantId }, (tx) => enqueueMessage(tx, { channel: m.channel ?? 'sms', ...m }));
  const rows = await outboxRows(t.db.owner, company.tenantId);
  return rows.at(-1)!;
}

async function row(id: string) {
  const [r] = await t.db.owner.select().from(outbox).where(eq(outbox.id, id));
  return r!;
}

describe('retries', () => {
  it('a provider outage is retried after 1, then 2 minutes, and the text goes out exactly once', async () => {
    const msg = await enqueue(a, { to: '+13125550201', body: 'Retry until it works' });
    sms.fake.failNext(2);
    const t0 = new Date();

    expect(await runOutboxOnce(deps, t0)).toMatchObject({ retried: 1, sent: 0 });
    let r = await row(msg.id);
    expect(r).toMatchObject({ status: 'pending', attempts: 1 });
    expect(r.lastError).toContain('20500');
    expect(r.nextAttemptAt.getTime()).toBe(t0.getTime() + minutes(1));

    // Not due yet: nothing happens.
    expect(await runOutboxOnce(deps, new Date(t0.getTime() + minutes(1) - 1000))).toMatchObject({ retried: 0, sent: 0 });
    expect((await row(msg.id)).attempts).toBe(1);

    const t1 = new Date(t0.getTime() + minutes(1));
    expect(await runOutboxOnce(deps, t1)).toMatchObject({ retried: 1 });
    r = await row(msg.id);
    expect(r).toMatchObject({ status: 'pending', attempts: 2 });
    expect(r.nextAttemptAt.getTime()).toBe(t1.getTime() + minutes(2));

    expect(await runOutboxOnce(deps, new Date(t1.getTime() + minutes(2)))).toMatchObject({ sent: 1 });
    r = await row(msg.id);
    expect(r).toMatchObject({ status: 'sent', attempts: 3, lastError: null });
    expect(sms.fake.messagesTo('+13125550201').map((m) => m.body)).toEqual(['Retry until it works']);
    expect(r.providerId).toBe(sms.fake.messagesTo('+13125550201')[0]!.sid);

    // Sent rows are never picked up again.
    await runOutboxOnce(deps, new Date(t1.getTime() + minutes(60)));
    expect(sms.fake.messagesTo('+13125550201')).toHaveLength(1);
  });

  it('backs off exponentially up to an hour', () => {
    expect([1, 2, 3, 4, 5, 6, 7, 8, 9].map((n) => retryDelayMs(n) / minutes(1))).toEqual([1, 2, 4, 8, 16, 32, 60, 60, 60]);
  });

  it(`gives up as failed after ${MAX_ATTEMPTS} attempts`, async () => {
    const msg = await enqueue(a, { to: '+13125550202', body: 'The provider is down all day' });
    sms.fake.failNext(1000);
    let now = new Date();
    for (let i = 1; i <= MAX_ATTEMPTS; i++) {
      await runOutboxOnce(deps, now);
      now = new Date(now.getTime() + minutes(61));
    }
    const r = await row(msg.id);
    expect(r).toMatchObject({ status: 'failed', attempts: MAX_ATTEMPTS });
    expect(r.lastError).toMatch(/^gave up after 8 attempts/);
    await runOutboxOnce(deps, new Date(now.getTime() + minutes(120)));
    expect((await row(msg.id)).attempts).toBe(MAX_ATTEMPTS);
    expect(sms.fake.messagesTo('+13125550202')).toEqual([]);
  });

  it('a message the provider refuses for good (malformed number) fails at once, without retrying', async () => {
    const msg = await enqueue(a, { to: '555-NOPE', body: 'Never valid' });
    expect(await runOutboxOnce(deps)).toMatchObject({ failed: 1 });
    expect(await row(msg.id)).toMatchObject({ status: 'failed', attempts: 1 });
    expect((await row(msg.id)).lastError).toContain('21211');
  });
});

describe('opted-out numbers', () => {
  it('a number in sms_opt_outs is blocked before sending: nothing reaches the provider', async () => {
    await t.db.owner.insert(smsOptOuts).values({ phone: '+13125550203' });
    const msg = await enqueue(b, { to: '+13125550203', body: 'You should not see this' });
    expect(await runOutboxOnce(deps)).toMatchObject({ blocked: 1, sent: 0 });
    expect(await row(msg.id)).toMatchObject({ status: 'blocked', providerId: null });
    expect(sms.fake.messagesTo('+13125550203')).toEqual([]);
  });
});

describe('e-mail', () => {
  it('goes out through the mailer', async () => {
    const msg = await enqueue(a, { channel: 'email', to: 'venue@example.test', subject: 'Service call opened', body: 'We are on it.' });
    expect(await runOutboxOnce(deps)).toMatchObject({ sent: 1 });
    expect(await row(msg.id)).toMatchObject({ status: 'sent' });
    expect(t.mail.lastTo('venue@example.test')).toMatchObject({
      subject: 'Service call opened',
      text: expect.stringContaining('We are on it.'),
    });
  });
});

describe('a process that died mid-send', () => {
  async function leaveSending(id: string, claimedAt: Date) {
    await t.db.owner.update(outbox).set({ status: 'sending', claimedAt, attempts: 1 }).where(eq(outbox.id, id));
  }

  it('sent before it died: found in the provider’s list, marked sent, not sent again', async () => {
    const msg = await enqueue(a, { to: '+13125550204', body: 'Sent just before the crash' });
    const claimedAt = new Date(Date.now() - minutes(10));
    await leaveSending(msg.id, claimedAt);
    const { providerId } = await sms.sender.send('+13125550204', 'Sent just before the crash'); // what the dead process did

    // Within the timeout it is left alone (its worker may still be working).
    expect(await runOutboxOnce({ ...deps, stuckAfterMs: minutes(15) })).toMatchObject({ recovered: 0, sent: 0 });
    expect((await row(msg.id)).status).toBe('sending');

    expect(await runOutboxOnce(deps)).toMatchObject({ recovered: 1, sent: 0 });
    expect(await row(msg.id)).toMatchObject({ status: 'sent', providerId });
    expect(sms.fake.messagesTo('+13125550204')).toHaveLength(1);
  });

  it('died before sending: nothing at the provider, so it is sent now, once', async () => {
    const msg = await enqueue(a, { to: '+13125550205', body: 'Never left' });
    await leaveSending(msg.id, new Date(Date.now() - minutes(10)));
    expect(await runOutboxOnce(deps)).toMatchObject({ sent: 1, recovered: 0 });
    expect(await row(msg.id)).toMatchObject({ status: 'sent', attempts: 2 });
    expect(sms.fake.messagesTo('+13125550205')).toHaveLength(1);
  });

  it('an identical text that another row already owns does not count as this one', async () => {
    const first = await enqueue(a, { to: '+13125550206', body: 'Same words twice' });
    await runOutboxOnce(deps);
    expect((await row(first.id)).status).toBe('sent');
    const second = await enqueue(a, { to: '+13125550206', body: 'Same words twice' });
    await leaveSending(second.id, new Date(Date.now() - minutes(10)));
    expect(await runOutboxOnce(deps)).toMatchObject({ sent: 1, recovered: 0 });
    expect(sms.fake.messagesTo('+13125550206')).toHaveLength(2);
    expect((await row(second.id)).providerId).not.toBe((await row(first.id)).providerId);
  });

  it('when the provider cannot be asked, the row waits (still unsent) and is checked again later', async () => {
    const msg = await enqueue(a, { to: '+13125550207', body: 'Check first' });
    const claimedAt = new Date(Date.now() - minutes(10));
    await leaveSending(msg.id, claimedAt);
    const blind = { ...deps, sms: { ...deps.sms, sentSince: () => Promise.reject(new Error('connect ECONNREFUSED')) } };
    await runOutboxOnce(blind);
    const r = await row(msg.id);
    expect(r).toMatchObject({ status: 'sending', attempts: 1 });
    expect(r.claimedAt!.getTime()).toBe(claimedAt.getTime());
    expect(sms.fake.messagesTo('+13125550207')).toEqual([]);
    await runOutboxOnce(deps, new Date(Date.now() + minutes(2)));
    expect(sms.fake.messagesTo('+13125550207')).toHaveLength(1);
  });
});

describe('several workers at once', () => {
  it('two concurrent runs send each message exactly once, for every company', async () => {
    const bodies: string[] = [];
    for (let i = 0; i < 12; i++) {
      const body = `Concurrent ${i}`;
      bodies.push(body);
      await enqueue(i % 2 ? a : b, { to: '+13125550210', body });
    }
    // One row per company per claim, so the two workers interleave claim by claim.
    const small = { ...deps, batchSize: 1 };
    let sentTotal = 0;
    for (let round = 0; round < 12 && sentTotal < 12; round++) {
      const [one, two] = await Promise.all([runOutboxOnce(small), runOutboxOnce(small)]);
      sentTotal += one.sent + two.sent;
    }
    expect(sentTotal).toBe(12);
    await sms.fake.idle();
    const sent = sms.fake.messagesTo('+13125550210').map((m) => m.body);
    expect([...sent].sort()).toEqual([...bodies].sort());
    const rows = [...(await outboxRows(t.db.owner, a.tenantId)), ...(await outboxRows(t.db.owner, b.tenantId))];
    expect(rows.every((r) => r.status === 'sent' && r.attempts === 1)).toBe(true);
  });

  it('the job lock lets one instance run a job while the other skips it', async () => {
    let running = 0;
    let most = 0;
    const work = async () => {
      running++;
      most = Math.max(most, running);
      await new Promise((resolve) => setTimeout(resolve, 150));
      running--;
      return 'done';
    };
    const results = await Promise.all([runExclusive(t.db.app, JOB_LOCKS.outbox, work), runExclusive(t.db.app, JOB_LOCKS.outbox, work)]);
    expect(results.filter((r) => r.ran)).toHaveLength(1);
    expect(most).toBe(1);
    // Another job's lock is independent, and the lock is free again once the run ends.
    expect((await runExclusive(t.db.app, JOB_LOCKS.targetWarnings, work)).ran).toBe(true);
    expect(await runExclusive(t.db.app, JOB_LOCKS.outbox, work)).toEqual({ ran: true, result: 'done' });
  });

  it('the locked outbox step, run by two instances at once, sends each message once', async () => {
    for (let i = 0; i < 6; i++) await enqueue(a, { to: '+13125550211', body: `Locked ${i}` });
    const step = () => runExclusive(t.db.app, JOB_LOCKS.outbox, () => runOutboxOnce(deps));
    const results = await Promise.all([step(), step()]);
    const sentCount = results.reduce((n, r) => n + (r.ran ? r.result.sent : 0), 0);
    // Either one instance sent all six, or (if the first finished before the second started) both ran.
    expect(sentCount).toBe(6);
    await sms.fake.idle();
    expect(sms.fake.messagesTo('+13125550211')).toHaveLength(6);
  });
});

describe('the schedule', () => {
  it('runs the outbox on its cron schedule until stopped', async () => {
    const jobs = startJobs({
      ...deps,
      logger: pino({ level: 'silent' }),
      appOrigin: ORIGIN,
      schedules: { outbox: '* * * * * *', targetWarnings: '0 0 1 1 *' },
    });
    try {
      const msg = await enqueue(a, { to: '+13125550212', body: 'On schedule' });
      const deadline = Date.now() + 5_000;
      while ((await row(msg.id)).status !== 'sent' && Date.now() < deadline) await new Promise((r) => setTimeout(r, 100));
      expect((await row(msg.id)).status).toBe('sent');
    } finally {
      jobs.stop();
    }
    await new Promise((r) => setTimeout(r, 300)); // a tick already under way finishes
    const later = await enqueue(a, { to: '+13125550213', body: 'After stop' });
    await new Promise((r) => setTimeout(r, 2_000));
    expect((await row(later.id)).status).toBe('pending');
    expect(sms.fake.messagesTo('+13125550213')).toEqual([]);
  });
});

describe('companies', () => {
  it('each company’s rows are claimed inside that company’s scope: a scope sees only its own outbox', async () => {
    await enqueue(a, { to: '+13125550214', body: 'Alpha only' });
    await enqueue(b, { to: '+13125550215', body: 'Beta only' });
    const seenByA = await withScope(t.db.app, { tenantId: a.tenantId }, (tx) => tx.select({ to: outbox.toAddress }).from(outbox));
    expect(seenByA.map((r) => r.to)).toEqual(['+13125550214']);
    await runOutboxOnce(deps);
    const [alpha] = await t.db.owner
      .select()
      .from(outbox)
      .where(and(eq(outbox.tenantId, a.tenantId), eq(outbox.toAddress, '+13125550214')));
    const [beta] = await t.db.owner
      .select()
      .from(outbox)
      .where(and(eq(outbox.tenantId, b.tenantId), eq(outbox.toAddress, '+13125550215')));
    expect([alpha!.status, beta!.status]).toEqual(['sent', 'sent']);
    const total = await t.db.owner.execute(sql`select count(*)::int as n from outbox`);
    expect(total.rows).toEqual([{ n: 2 }]);
  });
});
