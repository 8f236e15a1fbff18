// PostgreSQL advisory locks, for work that one API instance at a time may do (the scheduled jobs).
import { sql } from 'drizzle-orm';
import type { Tx } from '../client.ts';

/**
 * Takes the lock `key` for the rest of the transaction if no one holds it; false when someone does.
 * Transaction-scoped, because session locks are lost behind a transaction-mode pooler.
 */
export async function tryAdvisoryXactLock(tx: Tx, key: number): Promise<boolean> {
  const got = await tx.execute<{ locked: boolean }>(sql`select pg_try_advisory_xact_lock(${key}::bigint) as locked`);
  return got.rows[0]?.locked ?? false;
}
