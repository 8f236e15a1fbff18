// The outbox worker: sends the SMS and e-mail that changes wrote to the outbox table, company by company —
// only the companies one query across companies finds with rows to claim, so an idle company costs nothing.
// Rows are claimed in a short transaction and sent after it commits (a provider is never called while a
// transaction holds a connection), then marked sent, retried with exponential backoff, given up as
// failed, or blocked for numbers that opted out. Never lost: a row left 'sending' by a process that died
// mid-send is picked up again. Never sent twice: before sending such a row again, the provider's own
// message list is checked for it.
import type { Logger } from 'pino';
import { withScope, type Db, type Tx } from '@bumperline/db/client';
import { listCompaniesWithDueMessages } from '@bumperline/db/queries/due-work';
import {
  claimDueMessages,
  findMessagesByProviderId,
  markClaimSent,
  updateClaim,
  type ClaimedMessage as Claimed,
} from '@bumperline/db/queries/outbox';
import { recordProviderOptOut } from '@bumperline/db/queries/sms-opt-outs';
import type { Mailer } from '../services/mailer.ts';
import { SmsError, toSmsError, type SmsSender } from '../services/sms.ts';

export interface OutboxDeps {
  db: Db;
  sms: SmsSender;
  mailer: Mailer;
  logger?: Logger;
  /** Rows claimed per company per run; the next run (seconds later) takes the rest. */
  batchSize?: number;
  /** A row 'sending' for longer than this was left by a process that died: well above a send's timeout. */
  stuckAfterMs?: number;
}

export interface OutboxRunSummary {
  sent: number;
  retried: number;
  failed: number;
  blocked: number;
  /** Left 'sending' by a dead process and found at the provider: marked sent without sending again. */
  recovered: number;
}

/** Attempts before a message is given up as failed: with the delays below, about two hours of trying. */
export const MAX_ATTEMPTS = 8;
const DEFAULT_STUCK_AFTER_MS = 2 * 60_000;
/** How soon to look again at a stuck row when the provider could not be asked whether it was sent. */
const RECHECK_AFTER_MS = 60_000;

/** Wait before attempt n+1 after n failed attempts: 1, 2, 4, 8, 16, 32, then 60 minutes. */
export function retryDelayMs(attempts: number): number {
  return Math.min(2 ** Math.max(attempts - 1, 0), 60) * 60_000;
}

type Outcome =
  | { kind: 'sent'; providerId: string | null; providerStatus?: string; recovered?: boolean }
  | { kind: 'retry'; error: string }
  | { kind: 'failed'; error: string }
  | { kind: 'blocked'; error: string }
  | { kind: 'recheck'; error: string };

export async function runOutboxOnce(deps: OutboxDeps, now: Date = new Date()): Promise<OutboxRunSummary> {
  const summary: OutboxRunSummary = { sent: 0, retried: 0, failed: 0, blocked: 0, recovered: 0 };
  const stuckBefore = new Date(now.getTime() - (deps.stuckAfterMs ?? DEFAULT_STUCK_AFTER_MS));
  for (const tenantId of await listCompaniesWithDueMessages(deps.db, { now, stuckBefore })) {
    const rows = await withScope(deps.db, { tenantId }, (tx) => claimDueMessages(tx, { now, stuckBefore, limit: deps.batchSize ?? 50 }));
    for (const row of rows) {
      const outcome = await deliver(deps, row);
      await withScope(deps.db, { tenantId }, (tx) => record(tx, row, outcome, now));
      if (outcome.kind === 'sent') summary[outcome.recovered ? 'recovered' : 'sent']++;
      else if (outcome.kind === 'retry') summary[row.attempts >= MAX_ATTEMPTS ? 'failed' : 'retried']++;
      else if (outcome.kind !== 'recheck') summary[outcome.kind]++;
      if (outcome.kind !== 'sent')
        deps.logger?.warn(
          { outboxId: row.id, channel: row.channel, outcome: outcome.kind, error: outcome.error },
          'outbox message not sent',
        );
    }
  }
  return summary;
}

/** Sends one claimed row, outside any transaction. */
async function deliver(deps: OutboxDeps, row: Claimed): Promise<Outcome> {
  if (row.channel === 'email') {
    // SMTP offers no way to ask whether a message went out: a row stuck mid-send is sent again
    // (a duplicate e-mail is better than a lost one).
    try {
      await deps.mailer.send({ to: row.to, subject: row.subject, text: row.body });
      return { kind: 'sent', providerId: null };
    } catch (err) {
      const e = err as { responseCode?: number; code?: string; message?: string };
      const permanent = (e.responseCode ?? 0) >= 500 || e.code === 'EENVELOPE'; // SMTP 5xx: the address is refused
      return { kind: permanent ? 'failed' : 'retry', error: e.message ?? String(err) };
    }
  }

  if (row.stuckSince) {
    const found = await alreadySent(deps, row, row.stuckSince).catch((err: unknown) => toSmsError(err));
    if (found instanceof SmsError) return { kind: 'recheck', error: `could not check with the provider: ${found.message}` };
    if (found) return { kind: 'sent', providerId: found, recovered: true };
  }
  if (row.optedOut) return { kind: 'blocked', error: 'the recipient texted STOP' };
  try {
    const { providerId, providerStatus } = await deps.sms.send(row.to, row.body);
    return { kind: 'sent', providerId, providerStatus };
  } catch (err) {
    const e = err instanceof SmsError ? err : toSmsError(err);
    if (e.optedOut) return { kind: 'blocked', error: e.message };
    return { kind: e.retryable ? 'retry' : 'failed', error: `${e.message}${e.code ? ` (${e.code})` : ''}` };
  }
}

/** The provider's id of this row's message if a dead process sent it, skipping ids another row already owns. */
async function alreadySent(deps: OutboxDeps, row: Claimed, since: Date): Promise<string | undefined> {
  if (!deps.sms.sentSince) return undefined;
  for (const providerId of await deps.sms.sentSince(row.to, row.body, since)) {
    if ((await findMessagesByProviderId(deps.db, providerId)).length === 0) return providerId;
  }
  return undefined;
}

/** Writes the outcome, only if this claim still holds the row (same attempt, still 'sending'). */
async function record(tx: Tx, row: Claimed, outcome: Outcome, now: Date): Promise<void> {
  switch (outcome.kind) {
    case 'sent':
      await markClaimSent(tx, row, { providerId: outcome.providerId, providerStatus: outcome.providerStatus, sentAt: now });
      return;
    case 'retry': {
      const giveUp = row.attempts >= MAX_ATTEMPTS;
      await updateClaim(
        tx,
        row,
        giveUp
          ? { status: 'failed', lastError: `gave up after ${row.attempts} attempts: ${outcome.error}` }
          : { status: 'pending', lastError: outcome.error, nextAttemptAt: new Date(now.getTime() + retryDelayMs(row.attempts)) },
      );
      return;
    }
    case 'failed':
      await updateClaim(tx, row, { status: 'failed', lastError: outcome.error });
      return;
    case 'blocked':
      await updateClaim(tx, row, { status: 'blocked', lastError: outcome.error });
      // The provider's word that the number opted out is kept, so later messages stop here.
      if (row.channel === 'sms') await recordProviderOptOut(tx, row.to);
      return;
    case 'recheck':
      // Still possibly sent: stays 'sending' as it was (the next claim checks again), a little later,
      // and this look does not count as an attempt.
      await updateClaim(tx, row, {
        claimedAt: row.stuckSince,
        attempts: row.attempts - 1,
        lastError: outcome.error,
        nextAttemptAt: new Date(now.getTime() + RECHECK_AFTER_MS),
      });
      return;
  }
}
