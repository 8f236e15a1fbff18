// Row-level security proves itself in the database, not in the API code: these tests talk SQL
// directly as the API's role. Both companies have rows in every tenant-owned table (the first test
// insists), so every check below reads, and tries to reach, real rows of the other company.
import { randomUUID } from 'node:crypto';
import { mkdtemp, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sql } from 'drizzle-orm';
import { createDb, withScope } from '@bumperline/db/client';
import { folderPhotoStore } from '@bumperline/api/services/photo-store';
import { freshDatabase, type TestDatabase } from '../support/database.ts';
import { createFullCompany, type FullCompany } from '../support/full-company.ts';

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

/** How many rows a write touched, or the database's message when it refused the statement. */
async function attempt(run: () => Promise<{ rowCount: number | null }>): Promise<number | string | null> {
  try {
    return (await run()).rowCount;
  } catch (err) {
    const cause = (err as { cause?: { message?: string } }).cause;
    return cause?.message ?? String(err);
  }
}

/** The tables with a tenant_id today: the catalog query below must find at least these. */
const KNOWN_COMPANY_TABLES = [
  'audit_log',
  'call_events',
  'call_photos',
  'downtime_intervals',
  'game_models',
  'games',
  'invitations',
  'memberships',
  'outbox',
  'service_calls',
  'technician_profiles',
  'tenant_settings',
  'venue_contacts',
  'venues',
];

let db: TestDatabase;
let photoDir: string;
let two: { a: FullCompany; b: FullCompany };
/** Every table with a tenant_id column, found in the catalog. */
let companyTables: string[];
/** The company tables plus `tenants` itself (whose own id is the tenant). */
let tenantOwnedTables: string[];

const tenantColumn = (table: string) => (table === 'tenants' ? 'id' : 'tenant_id');

/** Rows of one company in a table, counted as the owner role (which sees every company). */
async function rowsOf(table: string, tenantId: string): Promise<number> {
  const r = await db.owner.execute<{ n: number }>(
    sql`select count(*)::int as n from ${sql.identifier(table)} where ${sql.identifier(tenantColumn(table))} = ${tenantId}`,
  );
  return r.rows[0]!.n;
}

/** Whether the API's role has the UPDATE privilege on a table at all. */
async function mayUpdate(table: string): Promise<boolean> {
  const r = await db.app.execute<{ ok: boolean }>(sql`select has_table_privilege(current_user, ${table}, 'UPDATE') as ok`);
  return r.rows[0]!.ok;
}

beforeAll(async () => {
  db = await freshDatabase();
  photoDir = await mkdtemp(path.join(os.tmpdir(), 'bumperline-isolation-photos-'));
  const photos = folderPhotoStore(photoDir);
  two = { a: await createFullCompany(db, 'Alpha Amusements', photos), b: await createFullCompany(db, 'Beta Games', photos) };
  const r = await db.owner.execute<{ table_name: string }>(sql`
    select c.table_name from information_schema.columns c
    join information_schema.tables t on t.table_schema = c.table_schema and t.table_name = c.table_name
    where c.table_schema = 'public' and c.column_name = 'tenant_id' and t.table_type = 'BASE TABLE'
    order by c.table_name`);
  companyTables = r.rows.map((x) => x.table_name);
  tenantOwnedTables = [...companyTables, 'tenants'];
});
afterAll(async () => {
  await db.drop();
  await rm(photoDir, { recursive: true, force: true });
});

describe('test data', () => {
  it('every tenant-owned table has rows in both companies, so no check below passes on an empty table', async () => {
    expect(companyTables).toEqual(expect.arrayContaining(KNOWN_COMPANY_TABLES));
    const empty: string[] = [];
    for (const table of tenantOwnedTables) {
      for (const [label, company] of [
        ['Alpha', two.a],
        ['Beta', two.b],
      ] as const) {
        if ((await rowsOf(table, company.tenantId)) === 0) empty.push(`${table}: no rows for ${label}`);
      }
    }
    // A new tenant table fails here until tests/support/full-company.ts fills it.
    expect(empty).toEqual([]);
  });
});

describe('row-level security', () => {
  it('is enabled and forced on every tenant-owned table', async () => {
    const r = await db.owner.execute<{ relname: string; relrowsecurity: boolean; relforcerowsecurity: boolean }>(sql`
      select relname, relrowsecurity, relforcerowsecurity from pg_class
      where relnamespace = 'public'::regnamespace and relkind = 'r'`);
    const states = Object.fromEntries(
      tenantOwnedTables.map((table) => {
        const row = r.rows.find((x) => x.relname === table);
        return [table, { enabled: row?.relrowsecurity, forced: row?.relforcerowsecurity }];
      }),
    );
    expect(states).toEqual(Object.fromEntries(tenantOwnedTables.map((table) => [table, { enabled: true, forced: true }])));
  });

  it('the API role owns nothing, cannot bypass row security, and cannot rewrite the audit log', async () => {
    expect(await mayUpdate('audit_log')).toBe(false);
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
  });

  it('with no tenant set, writes are rejected', async () => {
    const insert = await refusal(() =>
      db.app.execute(sql`insert into venues (tenant_id, name, address_line, city, latitude, longitude)
        values (${two.a.tenantId}, 'Sneaky', '1 Nowhere', 'X', 0, 0)`),
    );
    expect(insert).toMatch(/row-level security/);
    const del = await db.app.execute(sql`delete from games`);
    expect(del.rowCount).toBe(0);
    // An UPDATE with no WHERE touches nothing anywhere (or is refused where the API may not update at all).
    const touched: Record<string, unknown> = {};
    const expected: Record<string, unknown> = {};
    for (const table of tenantOwnedTables) {
      const col = sql.identifier(tenantColumn(table));
      touched[table] = await attempt(() => db.app.execute(sql`update ${sql.identifier(table)} set ${col} = ${col}`));
      expected[table] = (await mayUpdate(table)) ? 0 : expect.stringMatching(/permission denied/);
    }
    expect(touched).toEqual(expected);
  });

  it("with tenant A set, a raw SELECT * or an UPDATE with no WHERE never reaches B's rows", async () => {
    const seen: Record<string, unknown> = {};
    const touched: Record<string, unknown> = {};
    const expectedTouched: Record<string, unknown> = {};
    for (const table of tenantOwnedTables) {
      const col = sql.identifier(tenantColumn(table));
      const r = await withScope(db.app, { tenantId: two.a.tenantId }, (tx) =>
        tx.execute<{ t: string }>(sql`select distinct ${col}::text as t from ${sql.identifier(table)}`),
      );
      seen[table] = r.rows.map((row) => row.t);
      // Exactly A's rows: as many as the owner role counts for A (B has rows in every table too).
      touched[table] = await attempt(() =>
        withScope(db.app, { tenantId: two.a.tenantId }, (tx) => tx.execute(sql`update ${sql.identifier(table)} set ${col} = ${col}`)),
      );
      expectedTouched[table] = (await mayUpdate(table)) ? await rowsOf(table, two.a.tenantId) : expect.stringMatching(/permission denied/);
    }
    expect(seen).toEqual(Object.fromEntries(tenantOwnedTables.map((table) => [table, [two.a.tenantId]])));
    expect(touched).toEqual(expectedTouched);

    await withScope(db.app, { tenantId: two.a.tenantId }, async (tx) => {
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
    const single = createDb(db.appUrl, { max: 1 });
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
