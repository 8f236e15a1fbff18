// The scale data, loaded small: what it says it loaded is what is there, its rows agree with each other the
// way the service-call workflow and the bench keep them, its people can sign in, and the same seed loads the same rows.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sql } from 'drizzle-orm';
import { callStateGroups } from '@bumperline/contracts/calls';
import type { BenchJobDraft, BenchStep } from '@bumperline/contracts/bench-vocabulary';
import { evaluateBenchJob, judgeReading } from '@bumperline/domain/components/bench-judgement';
import { checkPartsList, readPartEntry, type PartEntryInput } from '@bumperline/domain/components/parts-list-entry';
import { seedScale, type ScaleResult } from '@bumperline/db/scale/scale-seed';
import { freshDatabase, type TestDatabase } from '../support/database.ts';

const options = { companies: 4, largest: { games: 150, venues: 40, years: 2 }, seed: 42, now: new Date('2026-12-01T12:00:00Z') };
let db: TestDatabase;
let result: ScaleResult;

beforeAll(async () => {
  db = await freshDatabase();
  result = await seedScale({ ...options, ownerUrl: db.ownerUrl, analyze: false });
}, 120_000);
afterAll(() => db.drop());

const rows = async <T>(query: ReturnType<typeof sql>) => (await db.owner.execute(query)).rows as T[];
const inList = (states: readonly string[]) => sql.raw(states.map((s) => `'${s}'`).join(', '));
function groupBy<T>(items: readonly T[], key: (item: T) => string): Map<string, T[]> {
  const groups = new Map<string, T[]>();
  for (const item of items) {
    const group = groups.get(key(item));
    if (group) group.push(item);
    else groups.set(key(item), [item]);
  }
  return groups;
}

describe('scale seed', () => {
  it('loads the rows it reports, the largest company first', async () => {
    for (const [table, n] of Object.entries(result.rows)) {
      const [row] = await rows<{ n: number }>(sql`select count(*)::int as n from ${sql.identifier(table)}`);
      expect({ table, n: row!.n }).toEqual({ table, n });
    }
    expect(result.rows.tenants).toBe(4);
    const [top] = await rows<{ tenant_id: string; n: number }>(
      sql`select tenant_id, count(*)::int as n from games group by tenant_id order by n desc limit 1`,
    );
    expect(top).toEqual({ tenant_id: result.largestTenantId, n: 150 });
    expect(result.rows.service_calls).toBeGreaterThan(1500);
  });

  it('writes calls whose times and states agree', async () => {
    const bad = await rows<{ id: string }>(sql`
      select id from service_calls where target_at <= opened_at
        or (state in ('closed', 'cancelled')) <> (closed_at is not null)
        or (fixed_at is not null) <> (state in ('fixed', 'closed'))
        or (state <> 'reported' and state <> 'cancelled' and technician_id is null)`);
    expect(bad).toEqual([]);
    const openStates = await rows<{ state: string }>(
      sql`select distinct state from service_calls where tenant_id = ${result.largestTenantId} and state in (${inList(callStateGroups.open)})`,
    );
    expect(openStates.length).toBeGreaterThanOrEqual(3);
    // Every call's timeline starts with its opening and ends in the state the call is in.
    const timelines = await rows<{ id: string }>(sql`
      select c.id from service_calls c
      join lateral (select kind, to_state from call_events e where e.tenant_id = c.tenant_id and e.call_id = c.id and e.to_state is not null
                    order by at desc limit 1) last on true
      where last.to_state <> c.state
         or not exists (select 1 from call_events e where e.tenant_id = c.tenant_id and e.call_id = c.id and e.kind = 'opened')`);
    expect(timelines).toEqual([]);
  });

  it('keeps each game’s status and downtime in step with its open call', async () => {
    const mismatched = await rows<{ id: string }>(sql`
      select g.id from games g
      left join service_calls c on c.tenant_id = g.tenant_id and c.game_id = g.id and c.state in (${inList(callStateGroups.unfixed)})
      where g.status <> case when c.id is null then 'running' when c.state = 'at_shop' then 'in_shop'
                             when c.severity = 'down' then 'down' else 'attention' end`);
    expect(mismatched).toEqual([]);
    const openDowntime = await rows<{ id: string }>(sql`
      select d.id from downtime_intervals d join games g on g.tenant_id = d.tenant_id and g.id = d.game_id
      where d.ended_at is null and g.status not in ('down', 'in_shop')`);
    expect(openDowntime).toEqual([]);
  });

  it('gives every person a confirmed address and a password, and sends most messages', async () => {
    const [people] = await rows<{ unconfirmed: number; without_password: number }>(
      sql`select count(*) filter (where email_verified_at is null)::int as unconfirmed,
                 count(*) filter (where password_hash is null)::int as without_password from users`,
    );
    expect(people).toEqual({ unconfirmed: 0, without_password: 0 });
    const byStatus = Object.fromEntries(
      (await rows<{ status: string; n: number }>(sql`select status, count(*)::int as n from outbox group by status`)).map((r) => [
        r.status,
        r.n,
      ]),
    );
    expect(byStatus.sent).toBeGreaterThan(0.9 * result.rows.outbox!);
  });

  it('gives every model 1–3 boards with parts lists, and fits a power supply in most games', async () => {
    const perModel = await rows<{ boards: number; power_supplies: number }>(sql`
      select count(b.id)::int as boards, count(b.id) filter (where b.name = 'Power supply')::int as power_supplies
      from game_models m left join model_boards b on b.tenant_id = m.tenant_id and b.model_id = m.id group by m.tenant_id, m.id`);
    expect(perModel.length).toBeGreaterThan(0);
    for (const m of perModel) {
      expect(m.boards).toBeGreaterThanOrEqual(1);
      expect(m.boards).toBeLessThanOrEqual(3);
      expect(m.power_supplies).toBe(1);
    }
    const [largest] = await rows<{ big_boards: number }>(sql`
      select count(*)::int as big_boards from model_boards b where b.tenant_id = ${result.largestTenantId}
        and (select count(*) from board_parts p where p.tenant_id = b.tenant_id and p.board_id = b.id and p.removed_at is null) = 400`);
    expect(largest!.big_boards).toBeGreaterThanOrEqual(1);
    const [fitted] = await rows<{ games: number; with_power_supply: number }>(sql`
      select count(*)::int as games,
             count(*) filter (where exists (select 1 from board_instances i join model_boards b on b.tenant_id = i.tenant_id and b.id = i.board_id
                                            where i.tenant_id = g.tenant_id and i.game_id = g.id and b.name = 'Power supply'))::int as with_power_supply
      from games g where g.retired_at is null`);
    expect(fitted!.with_power_supply).toBeGreaterThan(0.8 * fitted!.games);
    // A board fitted in a game is one of its model's boards.
    const misfits = await rows<{ id: string }>(sql`
      select i.id from board_instances i join games g on g.tenant_id = i.tenant_id and g.id = i.game_id
      join model_boards b on b.tenant_id = i.tenant_id and b.id = i.board_id where b.model_id <> g.model_id`);
    expect(misfits).toEqual([]);
  });

  it('writes parts lists the domain reads without a problem', async () => {
    const parts = await rows<PartEntryInput & { board_id: string }>(sql`
      select board_id, designator, kind, value, tolerance, rating, rated_temperature_c as "ratedTemperatureC",
             rated_life_hours as "ratedLifeHours", notes
      from board_parts where removed_at is null order by board_id, position`);
    const byBoard = groupBy(parts, (p) => p.board_id);
    expect(byBoard.size).toBe(result.rows.model_boards);
    for (const [boardId, list] of byBoard) expect({ boardId, problems: checkPartsList(list) }).toEqual({ boardId, problems: [] });
  });

  it('stores each reading with the verdict the domain gives it, and dates boards sensibly', async () => {
    const readings = await rows<PartEntryInput & { measured_text: string; in_circuit: boolean; verdict: string; min: number }>(sql`
      select p.designator, p.kind, p.value, p.tolerance, p.rating, p.rated_temperature_c as "ratedTemperatureC",
             p.rated_life_hours as "ratedLifeHours", r.measured_text, r.in_circuit, r.verdict, r.min
      from part_readings r join board_parts p on p.tenant_id = r.tenant_id and p.id = r.part_id where r.measured is not null`);
    expect(readings.length).toBeGreaterThan(1000);
    const verdicts = new Set<string>();
    for (const r of readings) {
      const judged = judgeReading(readPartEntry(r), r.measured_text, r.in_circuit);
      expect(judged.ok && { verdict: judged.value.verdict, min: judged.value.min }).toEqual({ verdict: r.verdict, min: r.min });
      verdicts.add(r.verdict);
    }
    // Most parts pass; a few have drifted out.
    expect([...verdicts].sort()).toEqual(expect.arrayContaining(['high', 'pass']));
    const badDates = await rows<{ id: string }>(sql`
      select id from board_instances where last_recap_on > ${options.now.toISOString().slice(0, 10)}::date or last_recap_on < made_on
        or (made_on is not null and date_code_flag is not null)`);
    expect(badDates).toEqual([]);
  });

  it('writes bench jobs the way finishing them would: a draft with no problem, its readings and parts used', async () => {
    const jobs = await rows<{
      id: string;
      board_id: string;
      state: string;
      steps: BenchStep[];
      draft: BenchJobDraft;
      readings: number;
      used: number;
    }>(sql`
      select j.id, i.board_id, j.state, j.steps, j.draft,
             (select count(*)::int from part_readings r where r.tenant_id = j.tenant_id and r.bench_job_id = j.id) as readings,
             (select count(*)::int from bench_job_parts_used u where u.tenant_id = j.tenant_id and u.job_id = j.id) as used
      from bench_jobs j join board_instances i on i.tenant_id = j.tenant_id and i.id = j.board_instance_id`);
    const states = groupBy(jobs, (j) => j.state);
    expect(states.get('finished')!.length).toBeGreaterThan(states.get('in_progress')!.length);
    const parts = await rows<PartEntryInput & { id: string; board_id: string }>(sql`
      select id, board_id, designator, kind, value, tolerance, rating, rated_temperature_c as "ratedTemperatureC",
             rated_life_hours as "ratedLifeHours" from board_parts where removed_at is null`);
    const partsOf = groupBy(parts, (p) => p.board_id);
    for (const job of states.get('finished')!) {
      const specs = partsOf.get(job.board_id)!.map((p) => ({ ...readPartEntry(p), id: p.id }));
      const evaluation = evaluateBenchJob({ steps: job.steps, draft: job.draft, parts: specs });
      expect({ job: job.id, problems: evaluation.problems }).toEqual({ job: job.id, problems: [] });
      expect(job.readings).toBe(evaluation.readings.length + evaluation.diodeSets.length);
      expect(job.used).toBe(job.draft.partsUsed.length);
    }
    for (const job of states.get('in_progress')!) expect(job.readings).toBe(0);
  });

  it('writes care plans with years of work orders, most open work planned for a technician who has the skills and a van', async () => {
    const [largest] = await rows<{ plans: number; models: number; done: number; skipped: number; open: number; planned: number }>(sql`
      select (select count(*)::int from care_plans where tenant_id = ${result.largestTenantId}) as plans,
             (select count(*)::int from game_models where tenant_id = ${result.largestTenantId}) as models,
             count(*) filter (where state = 'done')::int as done, count(*) filter (where state = 'skipped')::int as skipped,
             count(*) filter (where state = 'open')::int as open,
             count(*) filter (where state = 'open' and planned_on is not null)::int as planned
      from work_orders where tenant_id = ${result.largestTenantId}`);
    // The largest company keeps a plan (or two) on every model.
    expect(largest!.plans).toBeGreaterThanOrEqual(largest!.models);
    expect(largest!.done).toBeGreaterThan(20 * largest!.open);
    expect(largest!.skipped).toBeGreaterThan(0);
    expect(largest!.open).toBeGreaterThan(0);
    expect(largest!.planned).toBeGreaterThan(0.5 * largest!.open);
    const bad = await rows<{ id: string }>(sql`
      select w.id from work_orders w where
        (w.state = 'done' and (w.labour_minutes is null or w.closed_at is null or w.plays_at_done is null))
        or (w.state = 'open' and (w.closed_at is not null or (w.planned_on is not null and w.technician_id is null)))
        or (w.technician_id is not null and w.state = 'open' and (
              not exists (select 1 from stock_locations l where l.tenant_id = w.tenant_id and l.technician_id = w.technician_id and l.kind = 'van')
              or not exists (select 1 from technician_profiles t where t.tenant_id = w.tenant_id and t.user_id = w.technician_id
                             and t.skills @> w.skills)))`);
    expect(bad).toEqual([]);
    // At most one open work order per plan and game (the unique index would have refused the load otherwise).
    const [readings] = await rows<{ n: number; by_work_order: number }>(sql`
      select count(*)::int as n, count(*) filter (where source = 'work_order' and work_order_id is not null)::int as by_work_order
      from meter_readings where tenant_id = ${result.largestTenantId}`);
    expect(readings!.n).toBeGreaterThan(150 * 40);
    expect(readings!.by_work_order).toBeGreaterThan(0);
  });

  it('keeps stock at or above zero, takes each part used off a van, and keeps each job’s cost equal to its parts and labour', async () => {
    const [stock] = await rows<{ parts: number; negative: number; to_order: number; vans_missing: number }>(sql`
      select (select count(*)::int from catalogue_parts where tenant_id = ${result.largestTenantId}) as parts,
             (select count(*)::int from stock_levels where quantity < 0) as negative,
             (select count(*)::int from stock_levels where quantity <= reorder_point) as to_order,
             (select count(*)::int from technician_profiles t where not exists (
                select 1 from stock_locations l where l.tenant_id = t.tenant_id and l.technician_id = t.user_id and l.kind = 'van')) as vans_missing`);
    expect(stock!.parts).toBeGreaterThan(100);
    expect(stock).toMatchObject({ negative: 0, vans_missing: 0 });
    expect(stock!.to_order).toBeGreaterThan(0);
    expect(result.rows.part_fits).toBeGreaterThan(0);
    const mismatched = await rows<{ id: string }>(sql`
      select u.id from parts_used u join stock_movements m on m.tenant_id = u.tenant_id and m.id = u.movement_id
      where m.reason <> 'used' or m.quantity <> u.quantity or m.from_location_id <> u.location_id or m.unit_cost_cents <> u.unit_cost_cents`);
    expect(result.rows.parts_used).toBeGreaterThan(0);
    expect(mismatched).toEqual([]);
    const wrong = await rows<{ id: string }>(sql`
      select k.id from keep_cost_entries k
      join tenant_settings s on s.tenant_id = k.tenant_id
      left join lateral (select sum(round(u.quantity * u.unit_cost_cents)) as cents from parts_used u
                         where u.tenant_id = k.tenant_id and (u.work_order_id = k.source_id or u.service_call_id = k.source_id)) p on true
      where k.parts_cents <> coalesce(p.cents, 0) or k.labour_cents <> round(k.labour_minutes * k.labour_rate_cents / 60.0)
         or k.labour_rate_cents <> s.labour_rate_cents`);
    expect(result.rows.keep_cost_entries).toBeGreaterThan(0);
    expect(wrong).toEqual([]);
  });

  it('loads the same rows from the same seed', async () => {
    const other = await freshDatabase();
    try {
      await seedScale({ ...options, ownerUrl: other.ownerUrl, analyze: false });
      const fingerprint = async (d: TestDatabase) => [
        (await d.owner.execute(sql`select md5(string_agg(id::text || state || opened_at::text, ',' order by id)) as f from service_calls`))
          .rows[0],
        (await d.owner.execute(sql`select md5(string_agg(id::text || measured_text || verdict, ',' order by id)) as f from part_readings`))
          .rows[0],
        (await d.owner.execute(sql`select md5(string_agg(id::text || state || due_at::text, ',' order by id)) as f from work_orders`))
          .rows[0],
        (await d.owner.execute(sql`select md5(string_agg(id::text || quantity::text, ',' order by id)) as f from stock_movements`)).rows[0],
      ];
      expect(await fingerprint(other)).toEqual(await fingerprint(db));
    } finally {
      await other.drop();
    }
  }, 120_000);
});
