// Response-target warnings: an open call nobody has reached yet whose target is near (within the company's
// warn_before_minutes) is texted once to the dispatch phone and to every owner and dispatcher with a
// mobile number. The texts go through the outbox; the call is marked warned and its timeline says so.
import type { Logger } from 'pino';
import { withScope, type Db, type Tx } from '@bumperline/db/client';
import { getCall, lockCallsToWarn, markCallWarned } from '@bumperline/db/queries/calls';
import { insertEvent } from '@bumperline/db/queries/call-events';
import { listCompaniesWithCallsToWarn } from '@bumperline/db/queries/due-work';
import { enqueueMessage } from '@bumperline/db/queries/outbox';
import { getSettings } from '@bumperline/db/queries/settings';
import { listMemberPhones } from '@bumperline/db/queries/team';
import { callStateGroups } from '@bumperline/contracts/calls';
import { longestWarningLeadMinutes } from '@bumperline/contracts/settings';
import { dispatcherWarningSms } from '../services/call-messages.ts';
import { appLink } from '../services/links.ts';

export interface TargetWarningDeps {
  db: Db;
  appOrigin: string;
  logger?: Logger;
}

/** Runs once over the companies with a call to warn about (one query finds them); returns how many calls were warned about. */
export async function runTargetWarningsOnce(deps: TargetWarningDeps, now: Date = new Date()): Promise<number> {
  let warned = 0;
  for (const tenantId of await listCompaniesWithCallsToWarn(deps.db, { now, longestLeadMinutes: longestWarningLeadMinutes })) {
    warned += await withScope(deps.db, { tenantId }, (tx) => warnCompany(tx, deps.appOrigin, now));
  }
  if (warned) deps.logger?.info({ warned }, 'response-target warnings queued');
  return warned;
}

async function warnCompany(tx: Tx, appOrigin: string, now: Date): Promise<number> {
  const settings = await getSettings(tx);
  const horizon = new Date(now.getTime() + settings.warnBeforeMinutes * 60_000);
  // Once someone is on site the target is met or missed: only calls awaiting arrival are warned about.
  const due = await lockCallsToWarn(tx, { states: callStateGroups.awaitingArrival, dueBy: horizon });
  if (due.length === 0) return 0;

  const recipients = await warningRecipients(tx, settings.dispatchPhone);
  for (const { id, targetAt } of due) {
    const call = (await getCall(tx, id))!;
    const minutesLeft = Math.round((targetAt.getTime() - now.getTime()) / 60_000);
    const text = dispatcherWarningSms({ ...call, targetAt }, minutesLeft, appLink(appOrigin, `/calls/${id}`));
    for (const to of recipients) await enqueueMessage(tx, { channel: 'sms', to, body: text, callId: id });
    await markCallWarned(tx, id, now);
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
  const staff = await listMemberPhones(tx, ['owner', 'dispatcher']);
  const phones = [dispatchPhone, ...staff].map((p) => p.trim()).filter(Boolean);
  return [...new Set(phones)];
}
