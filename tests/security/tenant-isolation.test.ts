// Row-level security proves itself in the database, not in the API code: these tests talk SQL
// directly as the API's role.
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sql } from 'drizzle-orm';
import { withScope } from '@bumperline/db/client';
import { freshDatabase, type TestDatabase } from '../support/database.ts';
import { seedTwoCompanies, type TwoCompanies } from '../support/factories.ts';

/** The database's own message for a failed statement (drizzle wraps it as the cause). */
async function refusal(run: () => Promise<unknown>): Promise<string> {
  try {
    await run();
    return 'accepted';
  } catch (err) {
    const cause = (err as { cause?: { message?: string } }).cause;
    return cause?.message ?? String(err);
  }
}

let db: TestDatabase;
let two: TwoCompanies;
let tenantOwnedTables: string[];

beforeAll(async () => {
  db = await freshDatabase();
  two = await seedTwoCompanies(db.owner);
  const r = await db.owner.execute<{ table_name: string }>(sql`
    select table_name from information_schema.columns
    where table_schema = 'public' and column_name = 'tenant_id' order by table_name`);
  tenantOwnedTables = [...r.rows.map((x) => x.table_name), 'tenants'];
});
afterAll(() => db.drop());

describe('row-level security', () => {
  it('is enabled and forced on every tenant-owned table', async () => {
    expect(tenantOwnedTables.length).toBeGreaterThanOrEqual(7);
    const r = await db.owner.execute<{ relname: string; relrowsecurity: boolean; relforcerowsecurity: boolean }>(sql`
      select relname, relrowsecurity, relforcerowsecurity from pg_class
      where relnamespace = 'public'::regnamespace and relkind = 'r'`);
    for (const table of tenantOwnedTables) {
      const row = r.rows.find((x) => x.relname === table);
      expect(row, table).toBeDefined();
      expect(row?.relrowsecurity, `${table} RLS enabled`).toBe(true);
      expect(row?.relforcerowsecurity, `${table} RLS forced`).toBe(true);
    }
  });

  it('the API role owns nothing and cannot bypass row security', async () => {
    const role = await db.app.execute<{ rolbypassrls: boolean; rolsuper: boolean }>(
      sql`select rolbypassrls, rolsuper from pg_roles where rolname = current_user`,
    );
    expect(role.rows[0]).toEqual({ rolbypassrls: false, rolsuper: false });
    const owned = await db.app.execute(sql`select tablename from pg_tables where tableowner = current_user`);
    expect(owned.rows).toEqual([]);
  });

  it('with no tenant set, every tenant-owned table reads empty', async () => {
    for (const table of tenantOwnedTables) {
      const r = await db.app.execute(sql`select count(*)::int as n from ${sql.identifier(table)}`);
      expect(r.rows[0], table).toEqual({ n: 0 });
    }
    // …while the owner sees that rows are really there.
    const owned = await db.owner.execute(sql`select count(*)::int as n from venues`);
    expect((owned.rows[0] as { n: number }).n).toBeGreaterThan(0);
  });

  it('with no tenant set, writes are rejected', async () => {
    const insert = await refusal(() =>
      db.app.execute(sql`insert into venues (tenant_id, name, address_line, city, latitude, longitude)
        values (${two.a.tenantId}, 'Sneaky', '1 Nowhere', 'X', 0, 0)`),
    );
    expect(insert).toMatch(/row-level security/);
    const upd = await db.app.execute(sql`update venues set name = 'hijacked'`);
    expect(upd.rowCount).toBe(0);
    const del = await db.app.execute(sql`delete from games`);
    expect(del.rowCount).toBe(0);
  });

  it("with tenant A set, a raw SELECT * or an UPDATE with no WHERE never reaches B's rows", async () => {
    await withScope(db.app, { tenantId: two.a.tenantId }, async (tx) => {
      for (const table of tenantOwnedTables) {
        const col = table === 'tenants' ? 'id' : 'tenant_id';
        const r = await tx.execute(sql`select distinct ${sql.identifier(col)}::text as t from ${sql.identifier(table)}`);
        for (const row of r.rows as { t: string }[]) expect(row.t, table).toBe(two.a.tenantId);
      }
      const upd = await tx.execute(sql`update venues set notes = 'touched by A'`);
      expect(upd.rowCount).toBe(two.a.venueIds.length);
    });
    const bNotes = await db.owner.execute(
      sql`select count(*)::int as n from venues where tenant_id = ${two.b.tenantId} and notes = 'touched by A'`,
    );
    expect(bNotes.rows[0]).toEqual({ n: 0 });

    const planted = await refusal(() =>
      withScope(db.app, { tenantId: two.a.tenantId }, (tx) =>
        tx.execute(sql`insert into venues (tenant_id, name, address_line, city, latitude, longitude)
          values (${two.b.tenantId}, 'Planted', '1 Elsewhere', 'X', 0, 0)`),
      ),
    );
    expect(planted).toMatch(/row-level security/);
    const moved = await refusal(() =>
      withScope(db.app, { tenantId: two.a.tenantId }, (tx) => tx.execute(sql`update games set tenant_id = ${two.b.tenantId}`)),
    );
    expect(moved).toMatch(/row-level security/);
    const bGames = await db.owner.execute(sql`select count(*)::int as n from games where tenant_id = ${two.b.tenantId}`);
    expect(bGames.rows[0]).toEqual({ n: two.b.gameIds.length });
  });

  it('after a transaction for A, the same pooled connection has no tenant left over', async () => {
    const single = (await import('@bumperline/db/client')).createDb(db.appUrl, { max: 1 });
    try {
      await withScope(single, { tenantId: two.a.tenantId, userId: randomUUID() }, async (tx) => {
        const r = await tx.execute(sql`select count(*)::int as n from venues`);
        expect((r.rows[0] as { n: number }).n).toBe(two.a.venueIds.length);
      });
      const after = await single.execute(
        sql`select current_setting('app.tenant_id', true) as t, (select count(*)::int from venues) as n, pg_backend_pid() as pid`,
      );
      expect(after.rows[0]).toMatchObject({ t: '', n: 0 });
    } finally {
      await single.$client.end();
    }
  });
});
