// Fixed-window counters in PostgreSQL, so that every API instance counts the same hits.
import { createHash } from 'node:crypto';
import { eq, lte, sql } from 'drizzle-orm';
import type { Db } from '../client.ts';
import { rateLimitCounters } from '../schema/index.ts';

const hashed = (key: string) => createHash('sha256').update(key).digest('hex');

/** Counts one hit for `key`; a counter whose window has passed starts again at 1. */
export async function hitCounter(db: Db, key: string, windowMs: number): Promise<{ hits: number; resetAt: Date }> {
  const resetAt = new Date(Date.now() + windowMs);
  const [row] = await db
    .insert(rateLimitCounters)
    .values({ key: hashed(key), hits: 1, resetAt })
    .onConflictDoUpdate({
      target: rateLimitCounters.key,
      set: {
        hits: sql`case when ${rateLimitCounters.resetAt} <= now() then 1 else ${rateLimitCounters.hits} + 1 end`,
        resetAt: sql`case when ${rateLimitCounters.resetAt} <= now() then excluded.reset_at else ${rateLimitCounters.resetAt} end`,
      },
    })
    .returning({ hits: rateLimitCounters.hits, resetAt: rateLimitCounters.resetAt });
  return row!;
}

export async function unhitCounter(db: Db, key: string): Promise<void> {
  await db
    .update(rateLimitCounters)
    .set({ hits: sql`greatest(${rateLimitCounters.hits} - 1, 0)` })
    .where(eq(rateLimitCounters.key, hashed(key)));
}

export async function resetCounter(db: Db, key: string): Promise<void> {
  await db.delete(rateLimitCounters).where(eq(rateLimitCounters.key, hashed(key)));
}

/** Deletes the counters whose window has passed (a later hit would start them again at 1 anyway). */
export async function deleteExpiredCounters(db: Db): Promise<number> {
  const gone = await db
    .delete(rateLimitCounters)
    .where(lte(rateLimitCounters.resetAt, sql`now()`))
    .returning({ key: rateLimitCounters.key });
  return gone.length;
}
