// The database client and the tenant-scoped transaction every request runs in.
import pg from 'pg';
import { sql } from 'drizzle-orm';
import { drizzle, type NodePgDatabase } from 'drizzle-orm/node-postgres';
import * as schema from './schema/index.ts';

export type Db = NodePgDatabase<typeof schema> & { $client: pg.Pool };
export type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];

export function createDb(url: string, options: { max?: number } = {}): Db {
  const pool = new pg.Pool({
    connectionString: url,
    max: options.max ?? 10,
    connectionTimeoutMillis: 5_000,
    idleTimeoutMillis: 30_000,
  });
  // A dropped server connection must not crash the process; the pool replaces the client.
  pool.on('error', () => {});
  return drizzle(pool, { schema }) as Db;
}

/** Resolves once the database answers; rejects while it cannot be reached. */
export async function pingDatabase(db: Db): Promise<void> {
  await db.execute(sql`select 1`);
}

export interface Scope {
  tenantId?: string | null;
  userId?: string | null;
}

/**
 * Runs fn in a transaction whose row-level-security scope is the given tenant and user.
 * set_config(..., true) is transaction-local, so nothing is left on the pooled connection afterwards
 * (and it works behind a transaction-mode pooler).
 */
export async function withScope<T>(db: Db, scope: Scope, fn: (tx: Tx) => Promise<T>): Promise<T> {
  return db.transaction(async (tx) => {
    await tx.execute(
      sql`select set_config('app.tenant_id', ${scope.tenantId ?? ''}, true), set_config('app.user_id', ${scope.userId ?? ''}, true)`,
    );
    return fn(tx);
  });
}
