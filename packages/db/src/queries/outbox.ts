// The outbox: SMS and e-mail written in the same transaction as the change that causes them, then
// claimed and sent by the worker (apps/api/src/jobs/outbox-worker.ts), and updated from the provider's
// delivery reports.
import { and, asc, eq, inArray, isNull, or, sql } from 'drizzle-orm';
import type { Db, Tx } from '../client.ts';
import { outbox } from '../schema/index.ts';
import { currentTenant } from '../schema/rls.ts';

export async function enqueueMessage(tx: Tx, m: { channel: 'sms' | 'email'; to: string; subject?: string; body: string; callId?: string }) {
  await tx.insert(outbox).values({
    tenantId: sql`${currentTenant}`,
    channel: m.channel,
    toAddress: m.to,
    subject: m.subject ?? '',
    body: m.body,
    callId: m.callId,
  });
}

export async function listCallMessages(tx: Tx, callId: string) {
  return tx
    .select({
      id: outbox.id,
      channel: outbox.channel,
      toAddress: outbox.toAddress,
      subject: outbox.subject,
      body: outbox.body,
      status: outbox.status,
      providerStatus: outbox.providerStatus,
      createdAt: outbox.createdAt,
      sentAt: outbox.sentAt,
    })
    .from(outbox)
    .where(and(eq(outbox.tenantId, currentTenant), eq(outbox.callId, callId)))
    .orderBy(asc(outbox.createdAt));
}

/** A row the worker claimed: marked 'sending', with this claim counted in `attempts`. */
export interface ClaimedMessage {
  id: string;
  channel: 'sms' | 'email';
  to: string;
  subject: string;
  body: string;
  /** Counting this claim. */
  attempts: number;
  /** When it was claimed before, if a dead process left it 'sending'. */
  stuckSince: Date | null;
  optedOut: boolean;
}

/**
 * Claims the current company's due rows and the rows stuck in 'sending' since before `stuckBefore`: locked
 * with SKIP LOCKED, so concurrent workers take different rows, and marked 'sending' (the attempt counted)
 * before the transaction commits.
 */
export async function claimDueMessages(tx: Tx, p: { now: Date; stuckBefore: Date; limit: number }): Promise<ClaimedMessage[]> {
  const result = await tx.execute<{
    id: string;
    channel: 'sms' | 'email';
    to_address: string;
    subject: string;
    body: string;
    attempts: number;
    was_status: string;
    was_claimed_at: string | Date | null;
    opted_out: boolean;
  }>(sql`
    with due as (
      select o.id, o.status as was_status, o.claimed_at as was_claimed_at
      from outbox o
      where o.tenant_id = ${currentTenant}
        and o.next_attempt_at <= ${p.now}
        and (o.status = 'pending' or (o.status = 'sending' and o.claimed_at < ${p.stuckBefore}))
      order by o.next_attempt_at
      limit ${p.limit}
      for update skip locked
    )
    update outbox o
    set status = 'sending', claimed_at = ${p.now}, attempts = o.attempts + 1
    from due
    where o.tenant_id = ${currentTenant} and o.id = due.id
    returning o.id, o.channel, o.to_address, o.subject, o.body, o.attempts, due.was_status, due.was_claimed_at,
      exists (select 1 from sms_opt_outs s where s.phone = o.to_address) as opted_out`);
  return result.rows.map((r) => ({
    id: r.id,
    channel: r.channel,
    to: r.to_address,
    subject: r.subject,
    body: r.body,
    attempts: r.attempts,
    stuckSince: r.was_status === 'sending' && r.was_claimed_at ? new Date(r.was_claimed_at) : null,
    optedOut: r.opted_out,
  }));
}

/** Only while this claim still holds the row: same attempt, still 'sending'. */
function stillClaimed(claim: Pick<ClaimedMessage, 'id' | 'attempts'>) {
  return and(
    eq(outbox.tenantId, currentTenant),
    eq(outbox.id, claim.id),
    eq(outbox.status, 'sending'),
    eq(outbox.attempts, claim.attempts),
  );
}

/** The claimed row went out. */
export async function markClaimSent(
  tx: Tx,
  claim: Pick<ClaimedMessage, 'id' | 'attempts'>,
  sent: { providerId: string | null; providerStatus?: string; sentAt: Date },
): Promise<void> {
  await tx
    .update(outbox)
    .set({
      status: 'sent',
      providerId: sent.providerId,
      // A status callback may have come first; the send's own answer only fills a gap.
      providerStatus: sql`coalesce(${outbox.providerStatus}, ${sent.providerStatus ?? null})`,
      sentAt: sent.sentAt,
      lastError: null,
    })
    .where(stillClaimed(claim));
}

/** Any other outcome of a claim: retried later, failed, blocked, or left to be checked again. */
export async function updateClaim(
  tx: Tx,
  claim: Pick<ClaimedMessage, 'id' | 'attempts'>,
  patch: Pick<Partial<typeof outbox.$inferInsert>, 'status' | 'lastError' | 'nextAttemptAt' | 'claimedAt' | 'attempts'>,
): Promise<void> {
  await tx.update(outbox).set(patch).where(stillClaimed(claim));
}

/**
 * The rows, in whichever company, that the provider knows by this message id: a delivery report names
 * no company, so a narrow SECURITY DEFINER function (drizzle/0003_…) finds them.
 */
export async function findMessagesByProviderId(db: Db, providerId: string): Promise<{ tenantId: string; id: string }[]> {
  const r = await db.execute<{ tenant_id: string; id: string }>(sql`select tenant_id, id from outbox_by_provider_id(${providerId})`);
  return r.rows.map((row) => ({ tenantId: row.tenant_id, id: row.id }));
}

/**
 * The provider's delivery status for a row, written only over no status or one of `over` (reports arrive
 * out of order: a late "sent" must not overwrite "delivered"). With `failure`, the row failed.
 */
export async function recordProviderStatus(tx: Tx, id: string, status: string, p: { over: string[]; failure?: string }): Promise<void> {
  await tx
    .update(outbox)
    .set({ providerStatus: status, ...(p.failure !== undefined ? { status: 'failed' as const, lastError: p.failure } : {}) })
    .where(
      and(eq(outbox.tenantId, currentTenant), eq(outbox.id, id), or(isNull(outbox.providerStatus), inArray(outbox.providerStatus, p.over))),
    );
}
