// Query plans at the scale seed's size: the largest company (3,000 games in 800 venues, three years of
// calls) among others. Each main read goes through the real API; every statement it sends is captured
// and EXPLAINed as the API's own role inside the same company scope — row-level security applies, as in
// production (the owner role bypasses the policies, so its plans prove nothing). A plan must reach each
// company table through an index: a sequential scan reads every company's rows.
import { sql } from 'drizzle-orm';
import type pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { hashPassword } from '@bumperline/db/passwords';
import { withScope } from '@bumperline/db/client';
import { seedScale } from '@bumperline/db/scale/scale-seed';
import { buildTestApp, signedInAgent, type Agent, type TestApp } from '../support/app.ts';
import { TEST_PASSWORD } from '../support/factories.ts';
import { recordStatements, type SentStatement, type StatementLog } from '../support/statement-log.ts';

interface PlanNode {
  'Node Type': string;
  'Relation Name'?: string;
  'Index Name'?: string;
  'Actual Rows'?: number;
  'Actual Loops'?: number;
  Plans?: PlanNode[];
}

let t: TestApp;
let statements: StatementLog;
let largest: { tenantId: string; people: Record<'owner' | 'dispatcher' | 'technician', { id: string; email: string }> };
const agents: Partial<Record<'owner' | 'dispatcher' | 'technician', Agent>> = {};
let sample: { callId: string; gameId: string; venueId: string };
/** The bench's heaviest rows at the largest company: its 400-part board, the board with the most readings, the job with the most. */
let bench: { modelId: string; boardId: string; instanceId: string; gameId: string; jobId: string; openJobId: string; templateId: string };
/** Stock rows at the largest company (see beforeAll). */
let stock: { partId: string; warehouseId: string; vanId: string; workOrderId: string } | undefined;
let carePlanId: string;
let companyTables: Set<string>;
/** 4 pages of 8 kB. */
const FEW_PAGES = 4;

beforeAll(async () => {
  t = await buildTestApp();
  // The full scale: with fewer companies the largest holds most of every table, and a scan of it is the right plan.
  await seedScale({ ownerUrl: t.db.ownerUrl, companies: 200, largest: { venues: 800, games: 3000, years: 3 } });
  const [top] = (
    await t.db.owner.execute<{ tenant_id: string }>(sql`select tenant_id from games group by tenant_id order by count(*) desc limit 1`)
  ).rows;
  const people = (
    await t.db.owner.execute<{ id: string; email: string; role: string }>(
      sql`select distinct on (m.role) u.id, u.email, m.role from memberships m join users u on u.id = m.user_id
          where m.tenant_id = ${top!.tenant_id} and m.role in ('owner', 'dispatcher', 'technician') order by m.role, u.email`,
    )
  ).rows;
  largest = { tenantId: top!.tenant_id, people: Object.fromEntries(people.map((p) => [p.role, { id: p.id, email: p.email }])) as never };
  const hash = await hashPassword(TEST_PASSWORD);
  for (const p of people) {
    await t.db.owner.execute(
      sql`update users set password_hash = ${hash}, email_verified_at = coalesce(email_verified_at, now()) where id = ${p.id}`,
    );
  }
  for (const role of ['owner', 'dispatcher', 'technician'] as const) agents[role] = await signedInAgent(t, largest.people[role].email);
  const [row] = (
    await t.db.owner.execute<{ call_id: string; game_id: string; venue_id: string }>(
      sql`select id as call_id, game_id, venue_id from service_calls where tenant_id = ${largest.tenantId} and venue_id is not null
          order by opened_at desc limit 1`,
    )
  ).rows;
  sample = { callId: row!.call_id, gameId: row!.game_id, venueId: row!.venue_id };
  const one = async <T>(query: ReturnType<typeof sql>) => (await t.db.owner.execute(query)).rows[0] as T;
  const board = await one<{ id: string; model_id: string; parts: number }>(
    sql`select b.id, b.model_id, count(*)::int as parts from model_boards b
        join board_parts p on p.tenant_id = b.tenant_id and p.board_id = b.id and p.removed_at is null
        where b.tenant_id = ${largest.tenantId} group by b.id, b.model_id order by parts desc, b.id limit 1`,
  );
  expect(board.parts).toBe(400);
  const instance = await one<{ id: string; game_id: string }>(
    sql`select i.id, i.game_id from board_instances i where i.tenant_id = ${largest.tenantId} and i.game_id is not null
        order by (select count(*) from part_readings r where r.tenant_id = i.tenant_id and r.board_instance_id = i.id) desc, i.id limit 1`,
  );
  const job = await one<{ id: string }>(
    sql`select bench_job_id as id from part_readings where tenant_id = ${largest.tenantId} and bench_job_id is not null
        group by bench_job_id order by count(*) desc, bench_job_id limit 1`,
  );
  const openJob = await one<{ id: string }>(
    sql`select id from bench_jobs where tenant_id = ${largest.tenantId} and state = 'in_progress' order by opened_at desc limit 1`,
  );
  const template = await one<{ id: string }>(
    sql`select id from bench_templates where tenant_id = ${largest.tenantId} order by name, id limit 1`,
  );
  // Stock at the largest company: the part that moved most, the shop's shelves, the test technician's van, and a
  // work order with parts used.
  const movedMost = await one<{ id: string } | undefined>(
    sql`select catalogue_part_id as id from stock_movements where tenant_id = ${largest.tenantId}
        group by catalogue_part_id order by count(*) desc, catalogue_part_id limit 1`,
  );
  const warehouse = await one<{ id: string } | undefined>(
    sql`select id from stock_locations where tenant_id = ${largest.tenantId} and kind = 'warehouse' order by name, id limit 1`,
  );
  const van = await one<{ id: string } | undefined>(
    sql`select id from stock_locations where tenant_id = ${largest.tenantId} and technician_id = ${largest.people.technician.id}`,
  );
  const usedOn = await one<{ id: string } | undefined>(
    sql`select work_order_id as id from parts_used where tenant_id = ${largest.tenantId} and work_order_id is not null
        order by used_at desc limit 1`,
  );
  // Without the scale seed's stock, the stock reads below fail on their own (their ids are not found); the rest run.
  stock =
    movedMost && warehouse && usedOn
      ? { partId: movedMost.id, warehouseId: warehouse.id, vanId: van?.id ?? warehouse.id, workOrderId: usedOn.id }
      : undefined;
  // The largest company's care plan covering the most games.
  const plan = await one<{ id: string }>(
    sql`select p.id from care_plans p join games g on g.tenant_id = p.tenant_id and g.model_id = p.model_id
        where p.tenant_id = ${largest.tenantId} and p.retired_at is null group by p.id order by count(*) desc, p.id limit 1`,
  );
  carePlanId = plan.id;
  bench = {
    modelId: board.model_id,
    boardId: board.id,
    instanceId: instance.id,
    gameId: instance.game_id,
    jobId: job.id,
    openJobId: openJob.id,
    templateId: template.id,
  };
  // Company tables bigger than a few pages: one of a few pages (a handful of invitations across every
  // company) is read faster whole than through an index, and the planner rightly does so.
  companyTables = new Set(
    (
      await t.db.owner.execute<{ table_name: string }>(
        sql`select c.relname as table_name from pg_class c
            where c.relkind = 'r' and c.relnamespace = 'public'::regnamespace and c.relpages > ${FEW_PAGES}
              and exists (select 1 from pg_attribute a where a.attrelid = c.oid and a.attname = 'tenant_id' and not a.attisdropped)`,
      )
    ).rows.map((r) => r.table_name),
  );
  expect([...companyTables]).toEqual(
    expect.arrayContaining([
      ...['service_calls', 'call_events', 'call_photos', 'games', 'venues', 'outbox'],
      ...['model_boards', 'board_parts', 'board_instances', 'cabinet_profiles', 'part_readings'],
      ...['bench_templates', 'bench_jobs', 'bench_job_parts_used', 'bench_job_photos'],
    ]),
  );

  statements = recordStatements();
}, 600_000);

afterAll(async () => {
  statements?.stop();
  await t?.close();
});

/** The statements a request sent that read company data (not the transaction's own bookkeeping). */
async function readsOf(agent: Agent, url: string): Promise<SentStatement[]> {
  statements.take();
  await agent.get(url).expect(200);
  return statements.take().filter((c) => /^\s*(select|with)\b/i.test(c.text) && !/set_config|session_actor/.test(c.text));
}

/** The plan as indented lines of node, table and index: enough to see what went wrong. */
function outline(plan: PlanNode, depth = 0): string {
  const line = `${'  '.repeat(depth)}${plan['Node Type']}${plan['Relation Name'] ? ` on ${plan['Relation Name']}` : ''}${plan['Index Name'] ? ` using ${plan['Index Name']}` : ''}`;
  return [line, ...(plan.Plans ?? []).map((p) => outline(p, depth + 1))].join('\n');
}

/** Rows a node returned in all (EXPLAIN ANALYZE gives rows per loop). */
function rowsOut(n: PlanNode): number {
  return (n['Actual Rows'] ?? Infinity) * (n['Actual Loops'] ?? 1);
}

function nodes(plan: PlanNode): PlanNode[] {
  return [plan, ...(plan.Plans ?? []).flatMap(nodes)];
}

/** The plan; with `analyze`, run for real, with the rows each node returned. */
async function planOf(userId: string, read: SentStatement, analyze = false): Promise<PlanNode> {
  return withScope(t.db.app, { tenantId: largest.tenantId, userId }, async (tx) => {
    const client = (tx as unknown as { session: { client: pg.PoolClient } }).session.client;
    const r = await client.query(`explain (format json${analyze ? ', analyze' : ''}) ${read.text}`, read.values);
    return (r.rows[0]['QUERY PLAN'] as { Plan: PlanNode }[])[0]!.Plan;
  });
}

describe('query plans at scale, as the app role under row-level security', () => {
  const reads: [role: 'owner' | 'dispatcher' | 'technician', path: string][] = [
    ['dispatcher', '/api/calls?state=open'],
    ['dispatcher', '/api/calls?state=open&sort=openedAt&order=desc'],
    ['dispatcher', '/api/calls?state=open&limit=200'],
    ['dispatcher', '/api/calls?state=all&q=flipper'],
    ['dispatcher', '/api/calls?state=all&sort=openedAt&order=desc'],
    ['dispatcher', '/api/calls?state=all&sort=targetAt&order=asc'],
    ['dispatcher', '/api/calls?state=assigned'],
    ['dispatcher', '/api/calls?state=all&venueId=:venue'],
    ['dispatcher', '/api/calls?state=all&gameId=:game'],
    ['dispatcher', '/api/calls/:call'],
    ['dispatcher', '/api/calls/:call/technicians'],
    ['technician', '/api/calls?state=open'],
    ['owner', '/api/games'],
    ['owner', '/api/games?status=down'],
    ['owner', '/api/games?venueId=:venue'],
    ['owner', '/api/games/summary'],
    ['owner', '/api/games/:game'],
    ['owner', '/api/games/:game/downtime'],
    ['owner', '/api/venues'],
    ['owner', '/api/venues/:venue'],
    ['dispatcher', '/api/technicians'],
    ['owner', '/api/team'],
    ['technician', '/api/parts-lists'],
    ['technician', '/api/models/:model/boards'],
    ['technician', '/api/boards/:board'],
    ['technician', '/api/boards/:board/parts.csv'],
    ['technician', '/api/games/:game/boards'],
    ['technician', '/api/games/:benchGame/boards'],
    ['technician', '/api/games/:benchGame/cabinet-profile'],
    ['technician', '/api/board-instances/:instance'],
    ['technician', '/api/recap-due'],
    ['technician', '/api/recap-due?status=overdue'],
    ['technician', '/api/bench-jobs'],
    ['technician', '/api/bench-jobs?state=in_progress&limit=100'],
    ['technician', '/api/bench-jobs?state=finished&limit=10'],
    ['technician', '/api/bench-jobs?boardInstanceId=:instance'],
    ['technician', '/api/bench-jobs?state=in_progress&boardInstanceId=:instance&limit=10'],
    ['technician', '/api/bench-jobs/:job'],
    ['technician', '/api/bench-jobs/:openJob'],
    ['technician', '/api/bench-templates'],
    ['technician', '/api/bench-templates/:template'],
    ['owner', '/api/parts'],
    ['owner', '/api/parts?q=fuse'],
    ['owner', '/api/parts?kind=fuse&order=desc'],
    ['owner', '/api/parts?sort=description'],
    ['technician', '/api/parts?locationId=:van&inStockAt=:van'],
    ['owner', '/api/parts/:part'],
    ['owner', '/api/stock/locations'],
    ['owner', '/api/stock/locations/:warehouse/levels'],
    ['owner', '/api/stock/locations/:warehouse/levels?low=true'],
    ['owner', '/api/stock/movements?locationId=:warehouse'],
    ['owner', '/api/stock/movements?cataloguePartId=:part'],
    ['technician', '/api/stock/my-van'],
    ['owner', '/api/stock/reorder'],
    ['technician', '/api/work-orders/:workOrder/parts-used'],
    ['technician', '/api/boards/:board/catalogue-fits'],
    ['dispatcher', '/api/route-days'],
    ['technician', '/api/my-day'],
    ['dispatcher', '/api/care-plans'],
    ['dispatcher', '/api/care-plans?q=clean'],
    ['dispatcher', '/api/care-plans/:carePlan'],
    ['dispatcher', '/api/work-orders'],
    ['dispatcher', '/api/work-orders?due=overdue'],
    ['dispatcher', '/api/work-orders?due=due_soon'],
    ['technician', '/api/work-orders?technicianId=me'],
    ['dispatcher', '/api/work-orders?venueId=:venue'],
    ['dispatcher', '/api/work-orders?gameId=:game'],
    ['dispatcher', '/api/work-orders?carePlanId=:carePlan'],
    ['dispatcher', '/api/work-orders?state=done&order=desc'],
    ['technician', '/api/work-orders/:workOrder'],
    ['technician', '/api/games/:game/meters'],
    ['technician', '/api/games/:game/meter-readings/latest'],
    ['owner', '/api/games/:game/keep-cost'],
  ];
  const resolve = (path: string) =>
    path
      .replace(':call', sample.callId)
      .replace(':benchGame', bench.gameId)
      .replace(':game', sample.gameId)
      .replace(':venue', sample.venueId)
      .replace(':model', bench.modelId)
      .replace(':board', bench.boardId)
      .replace(':instance', bench.instanceId)
      .replace(':openJob', bench.openJobId)
      .replace(':job', bench.jobId)
      .replace(':template', bench.templateId)
      .replace(':part', stock?.partId ?? 'no-stock-at-scale')
      .replace(':warehouse', stock?.warehouseId ?? 'no-stock-at-scale')
      .replace(/:van/g, stock?.vanId ?? 'no-stock-at-scale')
      .replace(':workOrder', stock?.workOrderId ?? 'no-stock-at-scale')
      .replace(':carePlan', carePlanId);

  it.each(reads)('%s GET %s reads company tables only through indexes', async (role, path) => {
    const found = await readsOf(agents[role]!, resolve(path));
    expect(found.length).toBeGreaterThan(0);
    for (const read of found) {
      const plan = await planOf(largest.people[role].id, read);
      const seqScans = nodes(plan).filter((n) => n['Node Type'] === 'Seq Scan' && companyTables.has(n['Relation Name'] ?? ''));
      expect(
        seqScans.map((n) => n['Relation Name']),
        `${read.text}\n${outline(plan)}`,
      ).toEqual([]);
    }
  });

  it('the recap list judges the whole fleet from two reads beside the company’s date, however many boards it has', async () => {
    const found = await readsOf(agents.technician!, '/api/recap-due');
    const [{ boards }] = (
      await t.db.owner.execute<{ boards: number }>(
        sql`select count(*)::int as boards from board_instances where tenant_id = ${largest.tenantId}`,
      )
    ).rows as [{ boards: number }];
    expect(boards).toBeGreaterThan(3000);
    // The company's date (its time zone), the boards with their games, venues and cabinet days, the electrolytics.
    expect(
      found.map((r) => r.text.slice(0, 120)),
      'one statement per board, or per table, would show here',
    ).toHaveLength(3);
  });

  it('the office’s route days read each kind of work through its (company, technician, day) partial index, once for every technician', async () => {
    const found = await readsOf(agents.dispatcher!, '/api/route-days');
    const indexes = new Set<string>();
    for (const read of found) {
      for (const n of nodes(await planOf(largest.people.dispatcher.id, read))) if (n['Index Name']) indexes.add(n['Index Name']);
    }
    expect([...indexes]).toEqual(
      expect.arrayContaining(['service_calls_tenant_tech_open_idx', 'work_orders_tenant_tech_day_idx', 'bench_jobs_tenant_tech_day_idx']),
    );
    // The company's clock, the technicians with their days, then one statement per kind of work.
    expect(found.map((r) => r.text.slice(0, 80))).toHaveLength(5);
  });

  it('the open-calls list walks the partial index of open calls in target order, and stops at the page', async () => {
    const [list] = await readsOf(agents.dispatcher!, '/api/calls?state=open&limit=50');
    const plan = await planOf(largest.people.dispatcher.id, list!, true);
    const pageScan = nodes(plan).find((n) => n['Index Name'] === 'service_calls_tenant_open_target_idx');
    expect(pageScan, outline(plan)).toBeDefined();
    // The index gives the list's order, so the scan stops after one page (limit + 1 rows) of the
    // company's open calls, and nothing sorts more than that page.
    expect(rowsOut(pageScan!), outline(plan)).toBe(51);
    const sorted = nodes(plan).filter((n) => n['Node Type'] === 'Sort');
    expect(
      sorted.every((n) => (n['Actual Rows'] ?? Infinity) <= 51),
      outline(plan),
    ).toBe(true);
    const [{ open }] = (
      await t.db.owner.execute<{ open: number }>(
        sql`select count(*)::int as open from service_calls where tenant_id = ${largest.tenantId} and state <> all(array['closed', 'cancelled'])`,
      )
    ).rows as [{ open: number }];
    expect(open).toBeGreaterThan(51);
  });
});
