// Several API instances start at once against one new database (a deploy behind a load balancer): each
// provisions and migrates at start-up, and all of them must come up with the schema applied once.
import { randomBytes } from 'node:crypto';
import pg from 'pg';
import { afterAll, describe, expect, inject, it } from 'vitest';
import { dropDatabase, provisionDatabase } from '@bumperline/db/lifecycle/provision';

const adminUrl = inject('adminUrl');
const database = `bl_start_${randomBytes(5).toString('hex')}`;
afterAll(() => dropDatabase(adminUrl, database));

describe('instances starting together', () => {
  it('three provisions of one new database at the same moment all succeed, and apply each migration once', async () => {
    const results = await Promise.allSettled([1, 2, 3].map(() => provisionDatabase(adminUrl, database)));
    expect(results.map((r) => (r.status === 'rejected' ? String(r.reason) : 'ok'))).toEqual(['ok', 'ok', 'ok']);

    const ok = results[0] as PromiseFulfilledResult<Awaited<ReturnType<typeof provisionDatabase>>>;
    const client = new pg.Client({ connectionString: ok.value.ownerUrl });
    await client.connect();
    try {
      const applied = await client.query<{ n: number; distinct_hashes: number }>(
        'select count(*)::int as n, count(distinct hash)::int as distinct_hashes from drizzle.__drizzle_migrations',
      );
      expect(applied.rows[0]!.n).toBeGreaterThan(5);
      expect(applied.rows[0]!.n).toBe(applied.rows[0]!.distinct_hashes);
      const tables = await client.query(`select 1 from pg_tables where schemaname = 'public' and tablename = 'service_calls'`);
      expect(tables.rowCount).toBe(1);
    } finally {
      await client.end();
    }
  });
});
