// When a game was down: calls open and close its downtime intervals (uptime, MTBF and MTTR read them).
import { and, desc, eq, isNull, sql } from 'drizzle-orm';
import type { Tx } from '../client.ts';
import { downtimeIntervals } from '../schema/index.ts';
import { currentTenant } from '../schema/rls.ts';

export async function openDowntime(tx: Tx, gameId: string, callId: string, at: Date) {
  const [open] = await tx
    .select({ id: downtimeIntervals.id })
    .from(downtimeIntervals)
    .where(and(eq(downtimeIntervals.tenantId, currentTenant), eq(downtimeIntervals.gameId, gameId), isNull(downtimeIntervals.endedAt)));
  if (open) return; // already down: one interval covers overlapping calls
  await tx.insert(downtimeIntervals).values({ tenantId: sql`${currentTenant}`, gameId, callId, startedAt: at });
}

export async function closeDowntime(tx: Tx, gameId: string, at: Date) {
  await tx
    .update(downtimeIntervals)
    .set({ endedAt: at })
    .where(and(eq(downtimeIntervals.tenantId, currentTenant), eq(downtimeIntervals.gameId, gameId), isNull(downtimeIntervals.endedAt)));
}

export async function listDowntime(tx: Tx, gameId: string) {
  return tx
    .select({
      id: downtimeIntervals.id,
      callId: downtimeIntervals.callId,
      startedAt: downtimeIntervals.startedAt,
      endedAt: downtimeIntervals.endedAt,
    })
    .from(downtimeIntervals)
    .where(and(eq(downtimeIntervals.tenantId, currentTenant), eq(downtimeIntervals.gameId, gameId)))
    .orderBy(desc(downtimeIntervals.startedAt));
}
