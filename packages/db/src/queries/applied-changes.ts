// The record of changes sent with an Idempotency-Key: claimed before the change runs, answered after, in the
// request's own transaction, so a change and its record commit (or vanish) together.
import { and, eq, lt, sql } from 'drizzle-orm';
import type { Tx } from '../client.ts';
import { appliedChanges } from '../schema/index.ts';
import { currentTenant } from '../schema/rls.ts';

export interface AppliedChange {
  userId: string | null;
  method: string;
  path: string;
  status: number;
  body: unknown;
}

/** Status of a claimed key whose change is still running (never committed: the answer replaces it). */
export const CLAIMED_STATUS = 0;

/**
 * Claims `key` for this change. True when this request holds it now; false when a change with the key was
 * already applied. A concurrent request with the same key waits here on the primary key until the first
 * commits (then it sees the row) or rolls back (then it claims the key itself).
 */
export async function claimChangeKey(tx: Tx, params: { key: string; userId: string; method: string; path: string }): Promise<boolean> {
  const claimed = await tx
    .insert(appliedChanges)
    .values({ tenantId: currentTenant, ...params, status: CLAIMED_STATUS, body: null })
    .onConflictDoNothing()
    .returning({ key: appliedChanges.key });
  return claimed.length === 1;
}

export async function findAppliedChange(tx: Tx, key: string): Promise<AppliedChange | undefined> {
  const [row] = await tx
    .select({
      userId: appliedChanges.userId,
      method: appliedChanges.method,
      path: appliedChanges.path,
      status: appliedChanges.status,
      body: appliedChanges.body,
    })
    .from(appliedChanges)
    .where(and(eq(appliedChanges.tenantId, currentTenant), eq(appliedChanges.key, key)));
  return row;
}

/** Stores the answer the change got, to be replayed to a repeat. */
export async function recordChangeAnswer(tx: Tx, key: string, answer: { status: number; body: unknown }): Promise<void> {
  await tx
    .update(appliedChanges)
    .set({ status: answer.status, body: answer.body ?? null })
    .where(and(eq(appliedChanges.tenantId, currentTenant), eq(appliedChanges.key, key)));
}

/**
 * Forgets this company's keys older than `days` (a phone replays within hours, not weeks). Runs beside a new
 * claim, through the (tenant_id, created_at) index, so no job has to visit every company.
 */
export async function forgetOldChanges(tx: Tx, days: number, limit = 100): Promise<number> {
  const gone = await tx.execute(sql`
    delete from ${appliedChanges}
    where ${appliedChanges.tenantId} = ${currentTenant} and (${appliedChanges.tenantId}, ${appliedChanges.key}) in (
      select ${appliedChanges.tenantId}, ${appliedChanges.key} from ${appliedChanges}
      where ${appliedChanges.tenantId} = ${currentTenant} and ${lt(appliedChanges.createdAt, sql`now() - make_interval(days => ${days})`)}
      limit ${limit}
    )`);
  return gone.rowCount ?? 0;
}
