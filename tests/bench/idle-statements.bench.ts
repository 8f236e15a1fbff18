/**
 * Idle cost of the scheduled jobs: statements the API sends to PostgreSQL in a minute with no traffic, for a
 * small and a large number of companies. Printed only, never asserted.
 *   npx tsx tests/bench/idle-statements.bench.ts
 *
 * One simulated minute is each job at its real cadence (apps/api/src/jobs/scheduler.ts): the outbox worker six
 * times, the target warnings once, a tenth of the rate-limit cleanup; each run through runExclusive, as the
 * scheduler does, so its lock transaction counts too. Every query the app role's pool sends is counted,
 * BEGIN and COMMIT included. The companies hold history the jobs must skip: sent messages, one waiting
 * for a retry hours away, warned and closed calls, open calls due in days.
 */
import { randomBytes, randomUUID } from 'node:crypto';
import { createDb, type Db } from '@bumperline/db/client';
import { startCluster } from '@bumperline/db/lifecycle/cluster';
import { provisionDatabase, urlsFor } from '@bumperline/db/lifecycle/provision';
import { gameModels, games, outbox, serviceCalls, tenantSettings, tenants } from '@bumperline/db/schema/index';
import { JOB_LOCKS, runExclusive } from '@bumperline/api/jobs/scheduler';
import { runOutboxOnce } from '@bumperline/api/jobs/outbox-worker';
import { runTargetWarningsOnce } from '@bumperline/api/jobs/target-warnings';
import { runRateLimitCleanupOnce } from '@bumperline/api/jobs/rate-limit-cleanup';

/**
 * The same simulated minute measured on the code before jobs found due work with one query (commit 92c4229,
 * every job visiting every company through list_tenant_ids()).
 */
const BEFORE: Record<number, number> = { 20: 608.4, 200: 5828.4 };

const SIZES = [20, 200] as const;
const HOUR = 3_600_000;
const DAY = 24 * HOUR;

/** Counts every query sent through the pool's connections. */
function countStatements(db: Db): { read(): number } {
  let count = 0;
  db.$client.on('connect', (client) => {
    const query = client.query.bind(client) as (...args: unknown[]) => unknown;
    (client as unknown as { query: (...args: unknown[]) => unknown }).query = (...args: unknown[]) => {
      count++;
      return query(...args);
    };
  });
  return { read: () => count };
}

/** Companies `from`…`to`-1 with a quiet history: nothing in it is due. */
async function addCompanies(owner: Db, from: number, to: number, now: Date): Promise<void> {
  for (let i = from; i < to; i++) {
    const tenantId = randomUUID();
    await owner.insert(tenants).values({ id: tenantId, name: `Idle Amusements ${i + 1}`, timeZone: 'America/Chicago', currency: 'USD' });
    if (i % 2 === 0) await owner.insert(tenantSettings).values({ tenantId, warnBeforeMinutes: 30 + (i % 4) * 15 });
    const [model] = await owner
      .insert(gameModels)
      .values({ tenantId, maker: 'Idleworks', title: 'Quiet Flipper', kind: 'pinball' })
      .returning({ id: gameModels.id });
    const gameRows = await owner
      .insert(games)
      .values(
        Array.from({ length: 5 }, (_, g) => ({
          tenantId,
          modelId: model!.id,
          serial: `IDLE-${g}`,
          tagToken: randomBytes(16).toString('base64url'),
        })),
      )
      .returning({ id: games.id });
    const call = (g: number, state: 'closed' | 'reported' | 'assigned', targetAt: Date, warnedAt: Date | null) => ({
      tenantId,
      gameId: gameRows[g]!.id,
      problem: 'dead' as const,
      severity: 'down' as const,
      source: 'staff' as const,
      state,
      statusToken: randomBytes(16).toString('base64url'),
      targetAt,
      warnedAt,
    });
    await owner.insert(serviceCalls).values([
      call(0, 'closed', new Date(now.getTime() - 30 * DAY), new Date(now.getTime() - 30 * DAY)),
      call(1, 'closed', new Date(now.getTime() - 20 * DAY), null),
      call(2, 'reported', new Date(now.getTime() - HOUR), new Date(now.getTime() - 2 * HOUR)), // late, already warned
      call(3, 'reported', new Date(now.getTime() + 3 * DAY), null),
      call(4, 'assigned', new Date(now.getTime() + 2 * DAY), null),
    ]);
    await owner.insert(outbox).values([
      ...Array.from({ length: 10 }, (_, m) => ({
        tenantId,
        channel: 'sms' as const,
        toAddress: '+13125550100',
        body: `Sent message ${m}`,
        status: 'sent' as const,
        attempts: 1,
        sentAt: new Date(now.getTime() - m * HOUR),
      })),
      {
        tenantId,
        channel: 'sms' as const,
        toAddress: '+13125550101',
        body: 'Waiting to retry',
        attempts: 5,
        nextAttemptAt: new Date(now.getTime() + 4 * HOUR),
      },
      { tenantId, channel: 'email' as const, toAddress: 'gone@example.test', body: 'Given up', status: 'failed' as const, attempts: 8 },
    ]);
  }
}

const refuse = async (): Promise<never> => {
  throw new Error('an idle minute sends nothing');
};

/** Statements per simulated minute, by job. */
async function idleMinute(db: Db, counter: { read(): number }): Promise<Record<string, number>> {
  const deps = { db, sms: { send: refuse }, mailer: { send: refuse } };
  const measure = async (runs: number, fn: () => Promise<unknown>) => {
    const before = counter.read();
    for (let i = 0; i < runs; i++) await fn();
    return counter.read() - before;
  };
  const outboxJob = await measure(6, () => runExclusive(db, JOB_LOCKS.outbox, () => runOutboxOnce(deps)));
  const warnings = await measure(1, () =>
    runExclusive(db, JOB_LOCKS.targetWarnings, () => runTargetWarningsOnce({ db, appOrigin: 'http://127.0.0.1' })),
  );
  const cleanup = (await measure(1, () => runExclusive(db, JOB_LOCKS.rateLimitCleanup, () => runRateLimitCleanupOnce({ db })))) / 10;
  return { outbox: outboxJob, warnings, cleanup, total: outboxJob + warnings + cleanup };
}

const cluster = await startCluster({ mode: 'ephemeral', log: () => {} });
try {
  const database = 'bumperline_idle_bench';
  await provisionDatabase(cluster.adminUrl, database);
  const urls = urlsFor(cluster.adminUrl, database);
  const owner = createDb(urls.ownerUrl, { max: 2 });
  const app = createDb(urls.appUrl, { max: 4 });
  const counter = countStatements(app);
  const now = new Date();
  const rows: Array<Record<string, string | number>> = [];
  let companies = 0;
  for (const size of SIZES) {
    await addCompanies(owner, companies, size, now);
    companies = size;
    await idleMinute(app, counter); // warm: settings rows made on first read, plans cached
    const minute = await idleMinute(app, counter);
    rows.push({
      companies: size,
      'outbox worker (6 runs)': minute.outbox!,
      'target warnings (1 run)': minute.warnings!,
      'rate-limit cleanup (1/10 run)': minute.cleanup!,
      'statements / idle minute': minute.total!,
      'before (list_tenant_ids)': BEFORE[size] || 'not measured',
    });
  }
  console.log('\nIdle statements per minute (no traffic):');
  console.table(rows);
  await app.$client.end();
  await owner.$client.end();
} finally {
  cluster.stop();
}
