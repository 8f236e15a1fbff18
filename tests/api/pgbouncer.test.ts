// Scale-out: two API instances on one database, both connected through PgBouncer in transaction pool mode
// (Debian's pgbouncer, started here like the cluster) with fewer server connections than the instances'
// pools, so the instances share server connections and get one per transaction. Tenant isolation, sessions
// and the once-only scheduled jobs must hold as they do with direct connections: nothing may rely on
// session state (the tenant scope is transaction-local, job locks are transaction-level advisory locks,
// node-postgres sends unnamed statements only).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { and, eq, inArray, sql } from 'drizzle-orm';
import pino from 'pino';
import request from 'supertest';
import { createDb, withScope } from '@bumperline/db/client';
import { startPgbouncer, type Pooler } from '@bumperline/db/lifecycle/pgbouncer';
import { enqueueMessage } from '@bumperline/db/queries/outbox';
import { callEvents, outbox, serviceCalls, tenantSettings } from '@bumperline/db/schema/index';
import { JOB_LOCKS, runExclusive, startJobs } from '@bumperline/api/jobs/scheduler';
import { runOutboxOnce } from '@bumperline/api/jobs/outbox-worker';
import { runTargetWarningsOnce } from '@bumperline/api/jobs/target-warnings';
import { createMailer } from '@bumperline/api/services/mailer';
import { createSmsSender } from '@bumperline/api/services/sms';
import { buildTestApp, ORIGIN, signedInAgent, SMS_ACCOUNT_SID, SMS_AUTH_TOKEN, SMS_FROM, type TestApp } from '../support/app.ts';
import { freshDatabase, type TestDatabase } from '../support/database.ts';
import { createCompany, type CompanyFixture } from '../support/factories.ts';
import { openServiceCall } from '../support/call-factories.ts';

/**
 * Server connections PgBouncer keeps for the app role: fewer than the two instances' pools (4 each), so they
 * share; more than the scheduled jobs (3), each of which holds one for its lock while its work needs another.
 */
const POOL_SIZE = 5;

let database: TestDatabase;
let pooler: Pooler;
let one: TestApp;
let two: TestApp;
let a: CompanyFixture;
let b: CompanyFixture;

beforeAll(async () => {
  database = await freshDatabase();
  pooler = await startPgbouncer({ serverUrl: database.appUrl, logins: [database.appUrl], poolSize: POOL_SIZE });
  const connectTo = pooler.through(database.appUrl);
  one = await buildTestApp({ sms: true, database, connectTo });
  two = await buildTestApp({ database, connectTo });
  a = await createCompany(database.owner, 'Alpha Amusements', 3);
  b = await createCompany(database.owner, 'Beta Games', 2);
});

afterAll(async () => {
  await two?.close();
  await one?.close();
  await pooler?.stop();
  await database?.drop();
});

/** The signed-in person's cookie, as a browser would send it to whichever instance the balancer picks. */
async function cookieOf(t: TestApp, email: string): Promise<string> {
  const agent = await signedInAgent(t, email);
  return (await agent.get('/auth/session')).request.cookies;
}

describe('the pooler', () => {
  it('hands server connections out per transaction, and the instances use it', async () => {
    const r = await one.appDb.execute<{ port: number }>(sql`select inet_server_port() as port`);
    expect(r.rows[0]!.port).toBe(Number(new URL(database.appUrl).port)); // the server behind it
    expect(new URL(pooler.through(database.appUrl)).port).not.toBe(new URL(database.appUrl).port);
    // Two statements outside a transaction may run on different server connections; inside one they may not.
    const pids = await one.appDb.transaction(async (tx) => {
      const first = await tx.execute<{ pid: number }>(sql`select pg_backend_pid() as pid`);
      const second = await tx.execute<{ pid: number }>(sql`select pg_backend_pid() as pid`);
      return [first.rows[0]!.pid, second.rows[0]!.pid];
    });
    expect(pids[0]).toBe(pids[1]);
  });
});

describe('tenant isolation across two instances', () => {
  it('interleaved requests of two companies through both instances each see only their own company', async () => {
    const cookies = new Map([
      [a.tenantId, await cookieOf(one, a.ownerEmail)],
      [b.tenantId, await cookieOf(two, b.ownerEmail)],
    ]);
    const paths = ['/api/games', '/api/venues', '/api/account/me'] as const;
    const asked = Array.from({ length: 48 }, (_, i) => ({
      company: i % 2 ? a : b,
      instance: (i >> 1) % 2 ? one : two,
      path: paths[i % 3]!,
    }));
    const answers = await Promise.all(
      asked.map(({ company, instance, path }) => request(instance.app).get(path).set('Cookie', cookies.get(company.tenantId)!)),
    );
    answers.forEach((res, i) => {
      const { company, path } = asked[i]!;
      expect(res.status).toBe(200);
      if (path === '/api/games') expect(res.body.items.map((g: { id: string }) => g.id).sort()).toEqual([...company.gameIds].sort());
      if (path === '/api/venues') expect(res.body.items.map((v: { id: string }) => v.id).sort()).toEqual([...company.venueIds].sort());
      if (path === '/api/account/me') expect(res.body.company.id).toBe(company.tenantId);
    });
    // Another company's row by id: not found, from either instance.
    for (const instance of [one, two]) {
      await request(instance.app).get(`/api/games/${b.gameIds[0]}`).set('Cookie', cookies.get(a.tenantId)!).expect(404);
    }
  });

  it('no server connection keeps a company scope after its transaction', async () => {
    // As many clients at once as the pooler has server connections, so every one of them is asked.
    const probe = createDb(pooler.through(database.appUrl), { max: POOL_SIZE });
    try {
      const seen = await Promise.all(
        Array.from({ length: POOL_SIZE * 2 }, () =>
          probe.execute<{ tenant: string | null; games: number }>(
            sql`select current_setting('app.tenant_id', true) as tenant, (select count(*)::int from games) as games, pg_sleep(0.05)`,
          ),
        ),
      );
      for (const r of seen) {
        expect(r.rows[0]!.tenant ?? '').toBe('');
        expect(r.rows[0]!.games).toBe(0);
      }
    } finally {
      await probe.$client.end();
    }
  });
});

describe('sessions across two instances', () => {
  it('a session made through one instance works on the other, and signing out on either ends it on both', async () => {
    const cookie = await cookieOf(one, a.ownerEmail);
    const me = await request(two.app).get('/api/account/me').set('Cookie', cookie).expect(200);
    expect(me.body.user.id).toBe(a.ownerId);

    const csrf = await request(two.app).get('/auth/csrf').set('Cookie', cookie).expect(200);
    await request(two.app)
      .post('/auth/signout')
      .set('Cookie', cookie)
      .type('form')
      .set('X-Auth-Return-Redirect', '1')
      .send({ csrfToken: csrf.body.csrfToken })
      .expect(200);
    await request(one.app).get('/api/account/me').set('Cookie', cookie).expect(401);
    await request(two.app).get('/api/account/me').set('Cookie', cookie).expect(401);
  });
});

describe('once-only scheduled jobs across two instances', () => {
  const A_DISPATCH = '+13125550501';
  const B_DISPATCH = '+13125550502';
  const minutes = (n: number) => n * 60_000;

  /** What each instance's jobs are given: its own pool through the pooler, the same providers. */
  const jobDeps = (t: TestApp) => ({
    db: t.appDb,
    sms: createSmsSender({ accountSid: SMS_ACCOUNT_SID, authToken: SMS_AUTH_TOKEN, from: SMS_FROM, fakeUrl: one.sms!.fake.url }),
    mailer: createMailer({ fakePort: one.mail.port, from: 'Bumperline test <test@bumperline.example>' }),
    logger: pino({ level: 'silent' }),
    appOrigin: ORIGIN,
  });

  /** Queues `n` texts in each company (inside its own scope, as a change would). */
  async function queueTexts(label: string, n: number): Promise<void> {
    for (const company of [a, b]) {
      await withScope(database.app, { tenantId: company.tenantId }, async (tx) => {
        for (let i = 0; i < n; i++)
          await enqueueMessage(tx, { channel: 'sms', to: `+1312555${6000 + i}`, body: `${label} ${company.tenantId} #${i}` });
      });
    }
  }

  /** Calls whose response target is 20 minutes away: inside the default 30 minutes' warning. */
  async function callsNearTarget(): Promise<string[]> {
    const opened = new Date(Date.now() - minutes(220));
    return [
      await openServiceCall(database, a, { now: opened }),
      await openServiceCall(database, a, { now: opened }),
      await openServiceCall(database, b, { now: opened }),
    ];
  }

  /** Every text the provider received, counted by recipient and wording: each outbox row must appear once. */
  async function expectEachTextSentOnce(): Promise<void> {
    const rows = await database.owner
      .select()
      .from(outbox)
      .where(inArray(outbox.tenantId, [a.tenantId, b.tenantId]));
    expect(rows.filter((r) => r.status !== 'sent')).toEqual([]);
    const key = (to: string, body: string) => `${to}\n${body}`;
    const count = (keys: string[]) => keys.reduce((m, k) => m.set(k, (m.get(k) ?? 0) + 1), new Map<string, number>());
    const queued = count(rows.filter((r) => r.channel === 'sms').map((r) => key(r.toAddress, r.body)));
    const received = count(one.sms!.fake.messages().map((m) => key(m.to, m.body)));
    expect(received).toEqual(queued);
  }

  /** Each call was warned about once: one 'warned' event, and one warning per recipient. */
  async function expectEachCallWarnedOnce(callIds: string[]): Promise<void> {
    for (const id of callIds) {
      const [call] = await database.owner.select().from(serviceCalls).where(eq(serviceCalls.id, id));
      expect(call!.warnedAt).not.toBeNull();
      const warned = await database.owner
        .select()
        .from(callEvents)
        .where(and(eq(callEvents.callId, id), eq(callEvents.kind, 'warned')));
      expect(warned).toHaveLength(1);
      const texts = await database.owner.select().from(outbox).where(eq(outbox.callId, id));
      const warnings = texts.filter((m) => m.body.includes('response target')).map((m) => m.toAddress);
      expect(warnings).toEqual([call!.tenantId === a.tenantId ? A_DISPATCH : B_DISPATCH]);
    }
  }

  beforeAll(async () => {
    await database.owner.insert(tenantSettings).values([
      { tenantId: a.tenantId, dispatchPhone: A_DISPATCH },
      { tenantId: b.tenantId, dispatchPhone: B_DISPATCH },
    ]);
  });

  it('a job lock taken through one instance makes the other skip that job', async () => {
    let release!: () => void;
    const held = new Promise<void>((resolve) => (release = resolve));
    let entered!: () => void;
    const inside = new Promise<void>((resolve) => (entered = resolve));
    const first = runExclusive(one.appDb, JOB_LOCKS.outbox, async () => {
      entered();
      await held;
      return 'ran';
    });
    await inside;
    expect(await runExclusive(two.appDb, JOB_LOCKS.outbox, async () => 'also ran')).toEqual({ ran: false });
    release();
    expect(await first).toEqual({ ran: true, result: 'ran' });
    expect(await runExclusive(two.appDb, JOB_LOCKS.outbox, async () => 'ran next')).toEqual({ ran: true, result: 'ran next' });
  });

  it('both instances running the jobs on their schedules send each text once and warn about each call once', async () => {
    await one.sms!.fake.idle();
    one.sms!.fake.clear();
    await queueTexts('Scheduled', 15);
    const calls = await callsNearTarget();
    const schedules = { outbox: '* * * * * *', targetWarnings: '* * * * * *', rateLimitCleanup: '0 0 1 1 *' };
    const jobs = [startJobs({ ...jobDeps(one), schedules }), startJobs({ ...jobDeps(two), schedules })];
    try {
      const done = async () => {
        const warned = await database.owner.select().from(serviceCalls).where(inArray(serviceCalls.id, calls));
        const open = await database.owner
          .select()
          .from(outbox)
          .where(inArray(outbox.status, ['pending', 'sending']));
        return warned.every((c) => c.warnedAt) && open.length === 0;
      };
      const deadline = Date.now() + 20_000;
      while (!(await done()) && Date.now() < deadline) await new Promise((r) => setTimeout(r, 200));
    } finally {
      for (const j of jobs) j.stop();
    }
    await new Promise((r) => setTimeout(r, 1_500)); // a tick already under way finishes
    await one.sms!.fake.idle();
    await expectEachTextSentOnce();
    await expectEachCallWarnedOnce(calls);
  });

  it('the two instances running each job at the same moment, without the lock, still send and warn once', async () => {
    await queueTexts('Concurrent', 15);
    const calls = await callsNearTarget();
    const now = new Date();
    await Promise.all([runTargetWarningsOnce(jobDeps(one), now), runTargetWarningsOnce(jobDeps(two), now)]);
    const later = new Date(); // after the warnings were queued
    await Promise.all([runOutboxOnce(jobDeps(one), later), runOutboxOnce(jobDeps(two), later)]);
    await one.sms!.fake.idle();
    await expectEachTextSentOnce();
    await expectEachCallWarnedOnce(calls);
  });
});
