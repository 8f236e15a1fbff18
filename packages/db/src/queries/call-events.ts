// A call's timeline: every state change, assignment, note, joined report and message, with who and when.
import { and, asc, eq, sql } from 'drizzle-orm';
import type { Tx } from '../client.ts';
import { callEvents, users } from '../schema/index.ts';
import { currentTenant } from '../schema/rls.ts';

export async function insertEvent(tx: Tx, e: Omit<typeof callEvents.$inferInsert, 'tenantId'>) {
  await tx.insert(callEvents).values({ ...e, tenantId: sql`${currentTenant}` });
}

export async function listEvents(tx: Tx, callId: string) {
  return tx
    .select({
      id: callEvents.id,
      at: callEvents.at,
      kind: callEvents.kind,
      actorName: users.name,
      actorLabel: callEvents.actorLabel,
      fromState: callEvents.fromState,
      toState: callEvents.toState,
      detail: callEvents.detail,
    })
    .from(callEvents)
    .leftJoin(users, eq(users.id, callEvents.actorUserId))
    .where(and(eq(callEvents.tenantId, currentTenant), eq(callEvents.callId, callId)))
    .orderBy(asc(callEvents.at), asc(callEvents.id));
}
