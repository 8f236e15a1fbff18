// How scheduled jobs find due work: one query across companies (a SECURITY DEFINER function) returns the
// companies with outbox rows to claim or calls to warn about, and no others; it answers with company ids
// only, to the app role only, and reads a partial index rather than every company's history.
import { randomBytes } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sql } from 'drizzle-orm';
import { callStateGroups, callStates, type CallState } from '@bumperline/contracts/calls';
import { longestWarningLeadMinutes } from '@bumperline/contracts/settings';
import {
  listCompaniesWithCallsToWarn,
  listCompaniesWithCarePlansToCheck,
  listCompaniesWithDueMessages,
} from '@bumperline/db/queries/due-work';
import { carePlans, outbox, serviceCalls, tenantSettings } from '@bumperline/db/schema/index';
import { freshDatabase, type TestDatabase } from '../support/database.ts';
import { createCompany, type CompanyFixture } from '../support/factories.ts';

let db: TestDatabase;
const NOW = new Date('2026-12-03T12:00:00Z');
const at = (minutesFromNow: number) => new Date(NOW.getTime() + minutesFromNow * 60_000);
const STUCK_BEFORE = at(-2);
const sorted = (ids: string[]) => [...ids].sort();

beforeAll(async () => {
  db = await freshDatabase();
});
afterAll(() => db.drop());

async function companyWithMessage(name: string, m: Partial<typeof outbox.$inferInsert>): Promise<CompanyFixture> {
  const company = await createCompany(db.owner, name, 1);
  await db.owner.insert(outbox).values({ tenantId: company.tenantId, channel: 'sms', toAddress: '+13125550401', body: name, ...m });
  return company;
}

async function companyWithCall(
  name: string,
  call: { state?: CallState; targetAt: Date; warnedAt?: Date },
  warnBeforeMinutes?: number,
): Promise<CompanyFixture> {
  const company = await createCompany(db.owner, name, 1);
  if (warnBeforeMinutes !== undefined) await db.owner.insert(tenantSettings).values({ tenantId: company.tenantId, warnBeforeMinutes });
  await db.owner.insert(serviceCalls).values({
    tenantId: company.tenantId,
    gameId: company.gameIds[0]!,
    problem: 'dead',
    severity: 'down',
    source: 'staff',
    statusToken: randomBytes(16).toString('base64url'),
    state: call.state ?? 'reported',
    targetAt: call.targetAt,
    warnedAt: call.warnedAt ?? null,
  });
  return company;
}

describe('companies with outbox rows to claim', () => {
  it('are those with a pending row that is due or a row stuck in sending, and no others', async () => {
    const due = await companyWithMessage('Due Now', { nextAttemptAt: at(-1) });
    const stuck = await companyWithMessage('Stuck Sending', { status: 'sending', claimedAt: at(-10), nextAttemptAt: at(-10) });
    await companyWithMessage('Retry Later', { nextAttemptAt: at(60), attempts: 3 });
    await companyWithMessage('Being Sent', { status: 'sending', claimedAt: at(-0.1), nextAttemptAt: at(-0.1) });
    await companyWithMessage('Provider Asked Later', { status: 'sending', claimedAt: at(-10), nextAttemptAt: at(1) });
    for (const status of ['sent', 'failed', 'blocked'] as const)
      await companyWithMessage(`All ${status}`, { status, nextAttemptAt: at(-60) });
    await createCompany(db.owner, 'Nothing Queued', 1);

    expect(sorted(await listCompaniesWithDueMessages(db.app, { now: NOW, stuckBefore: STUCK_BEFORE }))).toEqual(
      sorted([due.tenantId, stuck.tenantId]),
    );
  });
});

describe('companies with calls to warn about', () => {
  const lead = { now: NOW, longestLeadMinutes: longestWarningLeadMinutes };

  it('are those with an unwarned call awaiting arrival within the company’s own lead, and no others', async () => {
    const byState = new Map<CallState, string>();
    for (const state of callStates) byState.set(state, (await companyWithCall(`In ${state}`, { state, targetAt: at(10) }, 30)).tenantId);
    const longLead = await companyWithCall('Hour Of Notice', { targetAt: at(45) }, 60);
    await companyWithCall('Half Hour Of Notice', { targetAt: at(45) }, 30);
    await companyWithCall('Already Warned', { targetAt: at(-5), warnedAt: at(-35) }, 30);
    const late = await companyWithCall('Past Its Target', { targetAt: at(-600) }, 30);
    // No settings row yet: within the longest lead the job reads the defaults and decides; beyond it, never.
    const unset = await companyWithCall('No Settings Yet', { targetAt: at(longestWarningLeadMinutes - 60) });
    await companyWithCall('No Settings, Far Off', { targetAt: at(longestWarningLeadMinutes + 60) });

    const awaiting = callStateGroups.awaitingArrival.map((s) => byState.get(s)!);
    expect(sorted(await listCompaniesWithCallsToWarn(db.app, lead))).toEqual(
      sorted([...awaiting, longLead.tenantId, late.tenantId, unset.tenantId]),
    );
  });
});

describe('what the app role reaches through them', () => {
  const lookups = [
    {
      name: 'outbox_due_tenant_ids',
      signature: 'outbox_due_tenant_ids(timestamptz, timestamptz)',
      call: sql`outbox_due_tenant_ids(${NOW}, ${STUCK_BEFORE})`,
    },
    {
      name: 'warning_due_tenant_ids',
      signature: 'warning_due_tenant_ids(timestamptz, interval)',
      call: sql`warning_due_tenant_ids(${NOW}, interval '1 day')`,
    },
  ];

  it.each(lookups)('$name answers with company ids only, while the rows behind them stay hidden', async ({ call }) => {
    const r = await db.app.execute(sql`select * from ${call}`);
    expect(r.rows.length).toBeGreaterThan(0);
    expect(r.fields.map((f) => f.name)).toEqual(['tenant_id']);
    // Outside a company's scope the app role itself sees none of the rows the function read.
    const seen = await db.app.execute<{ n: number }>(
      sql`select (select count(*) from outbox)::int + (select count(*) from service_calls)::int + (select count(*) from tenants)::int as n`,
    );
    expect(seen.rows[0]!.n).toBe(0);
  });

  it.each(lookups)('$name runs as its owner with a fixed search path, and only the app role may call it', async ({ signature }) => {
    const r = await db.owner.execute<{ definer: boolean; config: string[]; app: boolean; everyone: boolean }>(sql`
      select p.prosecdef as definer, p.proconfig as config,
        has_function_privilege('bumperline_app', p.oid, 'execute') as app,
        has_function_privilege('public', p.oid, 'execute') as everyone
      from pg_proc p where p.oid = to_regprocedure(${signature})`);
    expect(r.rows).toEqual([{ definer: true, config: ['search_path=public, pg_temp'], app: true, everyone: false }]);
  });

  it('the old every-company list is gone', async () => {
    const r = await db.owner.execute<{ fn: string | null }>(sql`select to_regprocedure('list_tenant_ids()')::text as fn`);
    expect(r.rows[0]!.fn).toBeNull();
  });
});

describe('companies with care plans to check', () => {
  async function companyWithPlan(name: string, plan: { nextCheckAt: Date; retiredAt?: Date }): Promise<CompanyFixture> {
    const company = await createCompany(db.owner, name, 1);
    await db.owner.insert(carePlans).values({
      tenantId: company.tenantId,
      name: `${name} monthly`,
      scope: 'model',
      modelId: company.modelId,
      tasks: ['Clean the playfield'],
      onSiteMinutes: 30,
      playsEvery: 1000,
      nextCheckAt: plan.nextCheckAt,
      retiredAt: plan.retiredAt ?? null,
    });
    return company;
  }

  it('are those with an active plan past its next check, and no others', async () => {
    const due = await companyWithPlan('Plan Due', { nextCheckAt: at(-5) });
    const justDue = await companyWithPlan('Plan Due Now', { nextCheckAt: NOW });
    await companyWithPlan('Plan Later', { nextCheckAt: at(30) });
    await companyWithPlan('Plan Retired', { nextCheckAt: at(-60), retiredAt: at(-30) });
    await createCompany(db.owner, 'No Plans', 1);
    // No other test of this file has made a care plan by now: exactly these two.
    expect(sorted(await listCompaniesWithCarePlansToCheck(db.app, { now: NOW }))).toEqual(sorted([due.tenantId, justDue.tenantId]));
  });
});

describe('the plan', () => {
  interface PlanNode {
    'Node Type': string;
    'Relation Name'?: string;
    'Index Name'?: string;
    'Parent Relationship'?: string;
    'Actual Loops'?: number;
    Plans?: PlanNode[];
  }
  interface Scan {
    /** "Index Scan service_calls using …", "Seq Scan tenant_settings". */
    scan: string;
    /** Run once per row found above it (a correlated subquery), not once per query. */
    perRowFound: boolean;
    /** With ANALYZE: how many times it ran. */
    loops?: number;
  }
  /** Every node of a plan that reads a table or an index. */
  const scans = (node: PlanNode, perRowFound = false): Scan[] => {
    const inSubPlan = perRowFound || node['Parent Relationship'] === 'SubPlan';
    const own = node['Relation Name']
      ? [
          {
            scan: `${node['Node Type']} ${node['Relation Name']}${node['Index Name'] ? ` using ${node['Index Name']}` : ''}`,
            perRowFound: inSubPlan,
            ...(node['Actual Loops'] !== undefined ? { loops: node['Actual Loops'] } : {}),
          },
        ]
      : [];
    return [...own, ...(node.Plans ?? []).flatMap((child) => scans(child, inSubPlan))];
  };

  /**
   * The function's own body, with its parameters as $1, $2, planned generically (the worst case), explained
   * (with `analyze`, also run) for these arguments: what it reads.
   */
  async function scansOf(name: string, args: string[], values: string[], analyze = false, generic = true): Promise<Scan[]> {
    const fn = await db.owner.execute<{ src: string; types: string }>(
      sql`select prosrc as src, oidvectortypes(proargtypes) as types from pg_proc where proname = ${name}`,
    );
    const src = args.reduce((s, arg, i) => s.replace(new RegExp(`\\b${arg}\\b`, 'g'), `$${i + 1}`), fn.rows[0]!.src);
    return db.owner.transaction(async (tx) => {
      await tx.execute(generic ? sql`set local plan_cache_mode = force_generic_plan` : sql`set local plan_cache_mode = force_custom_plan`);
      await tx.execute(sql.raw(`prepare due_work_plan(${fn.rows[0]!.types}) as ${src}`));
      const explained = await tx.execute<{ 'QUERY PLAN': [{ Plan: PlanNode }] }>(
        sql.raw(`explain (${analyze ? 'analyze, ' : ''}format json) execute due_work_plan(${values.join(', ')})`),
      );
      await tx.execute(sql`deallocate due_work_plan`);
      return scans(explained.rows[0]!['QUERY PLAN'][0].Plan);
    });
  }

  beforeAll(async () => {
    // History in 200 companies (with their settings) that no job must read: sent messages, finished and warned calls.
    await db.owner.execute(sql`
      insert into tenants (id, name, time_zone, currency)
      select gen_random_uuid(), 'History ' || i, 'America/Chicago', 'USD' from generate_series(1, 200) i`);
    await db.owner.execute(sql`insert into tenant_settings (tenant_id) select id from tenants where name like 'History %'`);
    await db.owner.execute(sql`
      insert into game_models (tenant_id, maker, title, kind) select id, 'Histworks', 'Old Flipper', 'pinball' from tenants`);
    await db.owner.execute(sql`
      insert into games (tenant_id, model_id, serial, tag_token)
      select tenant_id, id, 'H-1', md5(random()::text) from game_models`);
    await db.owner.execute(sql`
      insert into service_calls (tenant_id, game_id, problem, severity, source, state, status_token, target_at, warned_at)
      select g.tenant_id, g.id, 'dead', 'down', 'staff', case when i % 3 = 0 then 'cancelled' else 'closed' end,
        md5(random()::text), now() - i * interval '1 hour', case when i % 2 = 0 then now() - i * interval '1 hour' end
      from games g, generate_series(1, 50) i`);
    await db.owner.execute(sql`
      insert into outbox (tenant_id, channel, to_address, body, status, attempts, next_attempt_at, sent_at)
      select t.id, 'sms', '+13125550402', 'Old news', 'sent', 1, now() - i * interval '1 hour', now() - i * interval '1 hour'
      from tenants t, generate_series(1, 50) i`);
    await db.owner.execute(sql`analyze`);
  });

  it('finds due messages through the partial index, never by scanning the outbox', async () => {
    const found = await scansOf('outbox_due_tenant_ids', ['p_now', 'p_stuck_before'], ['now()', "now() - interval '2 minutes'"]);
    expect(found).toEqual([
      { scan: expect.stringMatching(/^(Index|Index Only) Scan outbox using outbox_claimable_idx$/), perRowFound: false },
    ]);
  });

  it('finds care plans to check through the partial next-check index, never by scanning every plan', async () => {
    await db.owner.execute(sql`
      insert into care_plans (tenant_id, name, scope, model_id, tasks, on_site_minutes, plays_every, next_check_at)
      select m.tenant_id, 'Old plan ' || i, 'model', m.id, '["Clean"]'::jsonb, 30, 1000, now() + i * interval '1 day'
      from game_models m, generate_series(1, 20) i`);
    await db.owner.execute(sql`analyze care_plans`);
    // Planned for the moment it is called with: a generic plan guesses a third of all plans past any moment, while
    // the statistics know that almost every plan's next check lies ahead.
    const found = await scansOf('care_plan_due_tenant_ids', ['p_now'], ['now()'], false, false);
    expect(found).toEqual([
      { scan: expect.stringMatching(/^(Index|Index Only) Scan care_plans using care_plans_next_check_idx$/), perRowFound: false },
    ]);
  });

  it('finds calls to warn about through the partial index, reading a company’s settings only for a call it found', async () => {
    const found = await scansOf('warning_due_tenant_ids', ['p_now', 'p_longest_lead'], ['now()', "interval '1 day'"]);
    expect(found.filter((f) => !f.perRowFound)).toEqual([
      {
        scan: expect.stringMatching(/^(Index|Index Only) Scan service_calls using service_calls_unwarned_target_idx$/),
        perRowFound: false,
      },
    ]);
    expect(found.filter((f) => f.perRowFound).map((f) => f.scan)).toEqual([expect.stringMatching(/ tenant_settings/)]);
    // At a moment with nothing due, the settings are never read at all.
    const idle = await scansOf('warning_due_tenant_ids', ['p_now', 'p_longest_lead'], ["'2020-01-01'", "interval '1 day'"], true);
    expect(idle.filter((f) => f.perRowFound)).toEqual([expect.objectContaining({ loops: 0 })]);
  });
});
