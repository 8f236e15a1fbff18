// Response-target warnings: an open call nobody has reached yet whose target is near (within the company's
// warn_before_minutes) is texted once to the dispatch phone and to every owner and dispatcher with a
// mobile number. The texts go through the outbox; the call is marked warned and its timeline says so.
import { and, eq, inArray, isNotNull, isNull, lte, sql } from 'drizzle-orm';
import type { Logger } from 'pino';
import { withScope, type Db, type Tx } from '@bumperline/db/client';
import { enqueueMessage, getCall, getSettings, insertEvent } from '@bumperline/db/queries/calls';
import { memberships, serviceCalls, users } from '@bumperline/db/schema/index';
import { tenantMatches } from '@bumperline/db/schema/rls';
import { dispatcherWarningSms } from '../services/call-messages.ts';
import { appLink } from '../services/links.ts';

export interface TargetWarningDeps {
  db: Db;
  appOrigin: string;
  logger?: Logger;
}

/** Calls still waiting for a technician to arrive: once someone is on site the target is met or missed. */
const WAITING_STATES = ['reported', 'assigned', 'on_the_way'] as const;

/** Runs once over every company; returns how many calls were warned about. */
export async function runTargetWarningsOnce(deps: TargetWarningDeps, now: Date = new Date()): Promise<number> {
  let warned = 0;
  const tenants = await deps.db.execute<{ tenant_id: string }>(sql`select tenant_id from list_tenant_ids()`);
  for (const { tenant_id: tenantId } of tenants.rows) {
    warned += await withScope(deps.db, { tenantId }, (tx) => warnCompany(tx, deps.appOrigin, now));
  }
  if (warned) deps.logger?.info({ warned }, 'response-target warnings queued');
  return warned;
}

async function warnCompany(tx: Tx, appOrigin: string, now: Date): Promise<number> {
  const settings = await getSettings(tx);
  const horizon = new Date(now.getTime() + settings.warnBeforeMinutes * 60_000);
  // SKIP LOCKED: a call another run is warning about right now is left to it (one warning per call).
  const due = await tx
    .select({ id: serviceCalls.id, targetAt: serviceCalls.targetAt })
    .from(serviceCalls)
    .where(
      and(
        tenantMatches(serviceCalls.tenantId),
        inArray(serviceCalls.state, [...WAITING_STATES]),
        isNull(serviceCalls.warnedAt),
        lte(serviceCalls.targetAt, horizon),
      ),
    )
    .orderBy(serviceCalls.targetAt)
    .for('update', { skipLocked: true });
  if (due.length === 0) return 0;

  const recipients = await warningRecipients(tx, settings.dispatchPhone);
  for (const { id, targetAt } of due) {
    const call = (await getCall(tx, id))!;
    const minutesLeft = Math.round((targetAt.getTime() - now.getTime()) / 60_000);
    const text = dispatcherWarningSms({ ...call, targetAt }, minutesLeft, appLink(appOrigin, `/calls/${id}`));
    for (const to of recipients) await enqueueMessage(tx, { channel: 'sms', to, body: text, callId: id });
    // Bookkeeping only: the version stays, so a dispatcher editing the call meanwhile is not turned away.
    await tx
      .update(serviceCalls)
      .set({ warnedAt: now })
      .where(and(tenantMatches(serviceCalls.tenantId), eq(serviceCalls.id, id)));
    await insertEvent(tx, {
      callId: id,
      kind: 'warned',
      at: now,
      actorLabel: 'system',
      detail: { minutesLeft, recipients: recipients.length },
    });
  }
  return due.length;
}

/** The company's dispatch phone and the mobiles of its owners and dispatchers, each once. */
async function warningRecipients(tx: Tx, dispatchPhone: string): Promise<string[]> {
  const staff = await tx
    .select({ phone: users.phone })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(tenantMatches(memberships.tenantId), inArray(memberships.role, ['owner', 'dispatcher']), isNotNull(users.phone)));
  const phones = [dispatchPhone, ...staff.map((s) => s.phone ?? '')].map((p) => p.trim()).filter(Boolean);
  return [...new Set(phones)];
}
