// The scale data, loaded small: what it says it loaded is what is there, its rows agree with each other the
// way the service-call workflow keeps them, its people can sign in, and the same seed loads the same rows.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sql } from 'drizzle-orm';
import { callStateGroups } from '@bumperline/contracts/calls';
import { seedScale, type ScaleResult } from '@bumperline/db/scale/scale-seed';
import { freshDatabase, type TestDatabase } from '../support/database.ts';

const options = { companies: 4, largest: { games: 150, venues: 40, years: 2 }, seed: 42, now: new Date('2026-12-01T12:00:00Z') };
let db: TestDatabase;
let result: ScaleResult;

beforeAll(async () => {
  db = await freshDatabase();
  result = await seedScale({ ...options, ownerUrl: db.ownerUrl, analyze: false });
}, 60_000);
afterAll(() => db.drop());

const rows = async <T>(query: ReturnType<typeof sql>) => (await db.owner.execute(query)).rows as T[];
const inList = (states: readonly string[]) => sql.raw(states.map((s) => `'${s}'`).join(', '));

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

  it('loads the same rows from the same seed', async () => {
    const other = await freshDatabase();
    try {
      await seedScale({ ...options, ownerUrl: other.ownerUrl, analyze: false });
      const fingerprint = async (d: TestDatabase) =>
        (await d.owner.execute(sql`select md5(string_agg(id::text || state || opened_at::text, ',' order by id)) as f from service_calls`))
          .rows[0];
      expect(await fingerprint(other)).toEqual(await fingerprint(db));
    } finally {
      await other.drop();
    }
  }, 60_000);
});
