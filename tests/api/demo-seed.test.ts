// The demo scenario seeds once: a second run changes nothing, and each company sees only its own.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sql } from 'drizzle-orm';
import { seedDemo } from '@bumperline/db/demo/seed';
import { demoCompany, secondCompany } from '@bumperline/db/demo/scenario';
import { withScope } from '@bumperline/db/client';
import { checkPartsList } from '@bumperline/domain/components/parts-list-entry';
import { freshDatabase, type TestDatabase } from '../support/database.ts';

let db: TestDatabase;
beforeAll(async () => {
  db = await freshDatabase();
});
afterAll(() => db.drop());

const count = async (table: string) =>
  ((await db.owner.execute(sql`select count(*)::int as n from ${sql.identifier(table)}`)).rows[0] as { n: number }).n;

describe('demo scenario', () => {
  it('seeds about 40 venues and 150 games with history, once', async () => {
    expect(await seedDemo(db.owner)).toBe(true);
    const first = {
      venues: await count('venues'),
      games: await count('games'),
      calls: await count('service_calls'),
      users: await count('users'),
    };
    expect(first.venues).toBe(43); // 40 for the demo company, 3 for the second
    expect(first.games).toBe(155);
    expect(first.calls).toBeGreaterThan(150);
    expect(await seedDemo(db.owner)).toBe(false);
    expect({
      venues: await count('venues'),
      games: await count('games'),
      calls: await count('service_calls'),
      users: await count('users'),
    }).toEqual(first);
  });

  it('keeps the two companies apart under row-level security', async () => {
    const seen = await withScope(db.app, { tenantId: secondCompany.id }, (tx) =>
      tx.execute(sql`select count(*)::int as n, count(*) filter (where tenant_id = ${demoCompany.id})::int as leaked from venues`),
    );
    expect(seen.rows[0]).toEqual({ n: 3, leaked: 0 });
  });

  it('carries parts lists for several models, each of which passes the parts-list check', async () => {
    interface Row extends Record<string, unknown> {
      title: string;
      name: string;
      designator: string;
      kind: string;
      value: string;
      tolerance: string;
      rating: string;
      ratedTemperatureC: number | null;
      ratedLifeHours: number | null;
      notes: string;
    }
    const rows = (
      await db.owner.execute<Row>(sql`
        select m.title, b.name, p.designator, p.kind, p.value, p.tolerance, p.rating,
               p.rated_temperature_c as "ratedTemperatureC", p.rated_life_hours as "ratedLifeHours", p.notes
        from board_parts p
        join model_boards b on b.tenant_id = p.tenant_id and b.id = p.board_id
        join game_models m on m.tenant_id = b.tenant_id and m.id = b.model_id
        where p.tenant_id = ${demoCompany.id} and p.removed_at is null
        order by m.title, b.name, p.position`)
    ).rows;
    const lists = new Map<string, typeof rows>();
    for (const r of rows) {
      const key = `${r.title} · ${r.name}`;
      lists.set(key, [...(lists.get(key) ?? []), r]);
    }
    const powerSupplies = [...lists].filter(([key, parts]) => key.endsWith('· Power supply') && parts.length >= 40 && parts.length <= 80);
    expect(powerSupplies.length).toBeGreaterThanOrEqual(3);
    expect([...lists.keys()].some((key) => !key.endsWith('· Power supply'))).toBe(true);
    for (const [key, parts] of lists) expect({ key, problems: checkPartsList(parts) }).toEqual({ key, problems: [] });
  });

  it('every open downtime interval belongs to a game that is down', async () => {
    const r = await db.owner.execute(sql`
      select count(*)::int as n from downtime_intervals d join games g on g.tenant_id = d.tenant_id and g.id = d.game_id
      where d.ended_at is null and g.status <> 'down'`);
    expect(r.rows[0]).toEqual({ n: 0 });
  });

  it('carries care plans and a year of their work: done, skipped and open, overdue and due soon', async () => {
    const plans = await count('care_plans');
    expect(plans).toBeGreaterThanOrEqual(5);
    expect(plans).toBeLessThanOrEqual(8);
    const byState = Object.fromEntries(
      (
        await db.owner.execute<{ state: string; n: number }>(sql`
          select state, count(*)::int as n from work_orders where tenant_id = ${demoCompany.id} group by state`)
      ).rows.map((r) => [r.state, r.n]),
    );
    expect(byState.done).toBeGreaterThan(100);
    expect(byState.skipped).toBeGreaterThan(0);
    expect(byState.open).toBeGreaterThan(10);
    const [open] = (
      await db.owner.execute<{ overdue: number; due_soon: number; unplanned: number }>(sql`
        select count(*) filter (where due_at < now())::int as overdue, count(*) filter (where due_at >= now())::int as due_soon,
               count(*) filter (where planned_on is null)::int as unplanned
        from work_orders where tenant_id = ${demoCompany.id} and state = 'open'`)
    ).rows;
    expect(open!.overdue).toBeGreaterThan(0);
    expect(open!.due_soon).toBeGreaterThan(0);
    // A done work order has its labour and the meters it read; a skipped one its reason.
    const [incomplete] = (
      await db.owner.execute<{ n: number }>(sql`
        select count(*)::int as n from work_orders where tenant_id = ${demoCompany.id} and (
          (state = 'done' and (labour_minutes is null or closed_at is null or plays_at_done is null))
          or (state = 'skipped' and (skip_reason is null or closed_at is null))
          or (state = 'open' and closed_at is not null))`)
    ).rows;
    expect(incomplete).toEqual({ n: 0 });
  });

  it('plans four to eight stops today for each technician, and each technician with open work has a van', async () => {
    const stops = (
      await db.owner.execute<{ technician_id: string; stops: number }>(sql`
        with today as (select (now() at time zone 'America/Chicago')::date as d),
        venues as (
          select w.technician_id, g.venue_id from work_orders w join games g on g.tenant_id = w.tenant_id and g.id = w.game_id
          where w.tenant_id = ${demoCompany.id} and w.state = 'open' and w.planned_on = (select d from today)
          union
          select c.technician_id, c.venue_id from service_calls c
          where c.tenant_id = ${demoCompany.id} and c.state in ('assigned', 'on_the_way', 'on_site', 'waiting_parts')
            and c.technician_id is not null and coalesce(c.planned_on, (select d from today)) = (select d from today)
        )
        select t.user_id as technician_id, count(distinct v.venue_id)::int as stops
        from technician_profiles t left join venues v on v.technician_id = t.user_id
        where t.tenant_id = ${demoCompany.id} group by t.user_id`)
    ).rows;
    expect(stops).toHaveLength(3);
    for (const s of stops) expect(s.stops, s.technician_id).toBeGreaterThanOrEqual(4);
    for (const s of stops) expect(s.stops, s.technician_id).toBeLessThanOrEqual(8);
    const withoutVan = await db.owner.execute(sql`
      select distinct w.technician_id from work_orders w
      where w.tenant_id = ${demoCompany.id} and w.state = 'open' and w.technician_id is not null
        and not exists (select 1 from stock_locations l where l.tenant_id = w.tenant_id and l.technician_id = w.technician_id and l.kind = 'van')`);
    expect(withoutVan.rows).toEqual([]);
    expect(await count('route_days')).toBeGreaterThan(0);
  });

  it('reads every demo game’s meters about weekly, rolling over only where the meter has a rollover point', async () => {
    const [meters] = (
      await db.owner.execute<{ games_without: number; meters: number }>(sql`
        select (select count(*)::int from games g where g.tenant_id = ${demoCompany.id}
                  and not exists (select 1 from game_meters m where m.tenant_id = g.tenant_id and m.game_id = g.id)) as games_without,
               (select count(*)::int from game_meters where tenant_id = ${demoCompany.id}) as meters`)
    ).rows;
    expect(meters!.games_without).toBe(0);
    expect(meters!.meters).toBeGreaterThan(300);
    expect(await count('meter_readings')).toBeGreaterThan(5000);
    // Each reading is above the one before it on the same meter, unless it is marked as the meter rolling over.
    const [order] = (
      await db.owner.execute<{ bad: number; rollovers: number }>(sql`
        select count(*) filter (where (reading < previous) <> rolled_over)::int as bad,
               count(*) filter (where rolled_over)::int as rollovers
        from (select reading, rolled_over, lag(reading) over (partition by game_id, meter order by read_at, id) as previous
              from meter_readings where tenant_id = ${demoCompany.id}) r where previous is not null`)
    ).rows;
    expect(order).toEqual({ bad: 0, rollovers: expect.any(Number) });
    expect(order!.rollovers).toBeGreaterThan(0);
    const [withWorkOrder] = (
      await db.owner.execute<{ n: number }>(sql`
        select count(*)::int as n from meter_readings where tenant_id = ${demoCompany.id} and source = 'work_order' and work_order_id is not null`)
    ).rows;
    expect(withWorkOrder!.n).toBeGreaterThan(50);
  });

  it('stocks a catalogue on the shop shelves and the vans, never below zero, with some parts to reorder', async () => {
    const parts = await count('catalogue_parts');
    expect(parts).toBeGreaterThanOrEqual(40);
    expect(parts).toBeLessThanOrEqual(80);
    expect(await count('part_fits')).toBeGreaterThan(50);
    const [locations] = (
      await db.owner.execute<{ warehouses: number; vans: number }>(sql`
        select count(*) filter (where kind = 'warehouse')::int as warehouses, count(*) filter (where kind = 'van')::int as vans
        from stock_locations where tenant_id = ${demoCompany.id}`)
    ).rows;
    expect(locations).toEqual({ warehouses: 1, vans: 3 });
    const [levels] = (
      await db.owner.execute<{ n: number; negative: number; to_order: number }>(sql`
        select count(*)::int as n, count(*) filter (where quantity < 0)::int as negative,
               count(*) filter (where quantity <= reorder_point)::int as to_order
        from stock_levels where tenant_id = ${demoCompany.id}`)
    ).rows;
    expect(levels!.n).toBeGreaterThan(100);
    expect(levels!.negative).toBe(0);
    expect(levels!.to_order).toBeGreaterThan(0);
    const reasons = (
      await db.owner.execute<{ reason: string }>(
        sql`select distinct reason from stock_movements where tenant_id = ${demoCompany.id} order by reason`,
      )
    ).rows.map((r) => r.reason);
    expect(reasons).toEqual(['counted', 'received', 'transfer', 'used']);
  });

  it('takes every part used off a van with its own movement, and keeps each job’s cost equal to its parts and labour', async () => {
    const [used] = (
      await db.owner.execute<{ n: number; on_calls: number; mismatched: number }>(sql`
        select count(*)::int as n, count(*) filter (where u.service_call_id is not null)::int as on_calls,
               count(*) filter (where m.reason <> 'used' or m.quantity <> u.quantity or m.from_location_id <> u.location_id
                                  or m.unit_cost_cents <> u.unit_cost_cents)::int as mismatched
        from parts_used u join stock_movements m on m.tenant_id = u.tenant_id and m.id = u.movement_id
        where u.tenant_id = ${demoCompany.id}`)
    ).rows;
    expect(used!.n).toBeGreaterThan(50);
    expect(used!.on_calls).toBeGreaterThan(0);
    expect(used!.mismatched).toBe(0);
    const [costs] = (
      await db.owner.execute<{ n: number; wrong: number; with_parts: number }>(sql`
        select count(*)::int as n, count(*) filter (where k.parts_cents > 0)::int as with_parts,
               count(*) filter (where k.parts_cents <> coalesce(p.cents, 0)
                                   or k.labour_cents <> round(k.labour_minutes * k.labour_rate_cents / 60.0)
                                   or k.labour_rate_cents <> s.labour_rate_cents)::int as wrong
        from keep_cost_entries k
        join tenant_settings s on s.tenant_id = k.tenant_id
        left join lateral (select sum(round(u.quantity * u.unit_cost_cents)) as cents from parts_used u
                           where u.tenant_id = k.tenant_id and (u.work_order_id = k.source_id or u.service_call_id = k.source_id)) p on true
        where k.tenant_id = ${demoCompany.id}`)
    ).rows;
    expect(costs!.n).toBeGreaterThan(100);
    expect(costs!.with_parts).toBeGreaterThan(20);
    expect(costs!.wrong).toBe(0);
  });

  it('gives each installation its own random game-tag tokens, so none can be worked out from the source', async () => {
    const other = await freshDatabase();
    try {
      await seedDemo(other.owner);
      const tokens = async (d: TestDatabase) =>
        new Map(
          (
            (await d.owner.execute(sql`select tenant_id || '/' || serial as id, tag_token from games`)).rows as {
              id: string;
              tag_token: string;
            }[]
          ).map((r) => [r.id, r.tag_token]),
        );
      const here = await tokens(db);
      const there = await tokens(other);
      expect(here.size).toBe(155);
      // The same demo games (same company and serial) on two installations share no token.
      expect([...there.keys()].sort()).toEqual([...here.keys()].sort());
      const shared = [...here].filter(([id, token]) => there.get(id) === token);
      expect(there.size).toBe(155);
      expect(shared).toEqual([]);
      for (const token of here.values()) expect(token).toMatch(/^[A-Za-z0-9_-]{24}$/);
    } finally {
      await other.drop();
    }
  });
});
