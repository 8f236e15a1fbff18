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
