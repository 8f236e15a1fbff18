// What the SMS provider posts to us: messages people text to our number (/inbound) and delivery status
// changes of what we sent (/status). Both are form-encoded and signed with X-Twilio-Signature over our
// public URL; anything unsigned or mis-signed is refused before it can change anything.
import express, { Router, type RequestHandler } from 'express';
import twilio from 'twilio';
import type { Logger } from 'pino';
import { callRef } from '@bumperline/contracts/calls';
import { withScope, type Db, type Tx } from '@bumperline/db/client';
import { findNewestPendingAssignment, lockAssignment } from '@bumperline/db/queries/calls';
import { insertEvent } from '@bumperline/db/queries/call-events';
import { findMessagesByProviderId, recordProviderStatus } from '@bumperline/db/queries/outbox';
import { optIn, optOut } from '@bumperline/db/queries/sms-opt-outs';
import { findTechniciansByPhone } from '@bumperline/db/queries/technicians';
import { HttpError, ValidationError } from '../http/errors.ts';
import { refuseNulBytes } from '../http/nul-bytes.ts';
import { answerAssignment } from '../services/service-calls.ts';

export interface SmsWebhookDeps {
  db: Db;
  /** The provider's auth token: the key of the signatures. */
  authToken: string;
  /** Our public origin, as configured at the provider: the signed URL is this plus the path. */
  publicOrigin: string;
  logger?: Logger;
}

// Carrier keywords, which the provider also acts on (it confirms STOP and START itself). A keyword
// counts only as the whole message. YES opts back in and is also a technician's "accept".
const OPT_OUT = new Set(['STOP', 'STOPALL', 'UNSUBSCRIBE', 'CANCEL', 'END', 'QUIT']);
const OPT_IN = new Set(['START', 'YES', 'UNSTOP']);
const HELP = new Set(['HELP', 'INFO']);
const ACCEPT = new Set(['YES', 'Y', 'ACCEPT', 'OK']);
const DECLINE = new Set(['NO', 'N', 'DECLINE']);

const HELP_TEXT = 'Bumperline service calls: reply YES to accept a call, NO to decline it. Reply STOP to stop texts, START to resume.';

/** "yes", " Yes! " and "YES." all read as YES. */
function keywordOf(body: string): string {
  return body
    .trim()
    .toUpperCase()
    .replace(/^[^A-Z]+|[^A-Z]+$/g, '');
}

function twiml(reply?: string): string {
  const response = new twilio.twiml.MessagingResponse();
  if (reply) response.message(reply);
  return response.toString();
}

function requireSignature(deps: SmsWebhookDeps): RequestHandler {
  return (req, _res, next) => {
    const signature = req.header('x-twilio-signature');
    const params = (req.body ?? {}) as Record<string, string>;
    const url = `${deps.publicOrigin.replace(/\/$/, '')}${req.originalUrl}`;
    if (!signature || !twilio.validateRequest(deps.authToken, signature, url, params)) {
      throw new HttpError(
        403,
        'Signature refused',
        'This webhook is not signed by the SMS provider with our key.',
        [{ field: 'header:x-twilio-signature', message: signature ? 'does not match the request' : 'is required' }],
        'signature',
      );
    }
    next();
  };
}

function requiredParam(params: Record<string, unknown>, name: string): string {
  const value = params[name];
  if (typeof value !== 'string' || !value.trim()) throw new ValidationError([{ field: name, message: 'is required' }]);
  return value.trim();
}

export function smsWebhookRouter(deps: SmsWebhookDeps): Router {
  const r = Router();
  r.use(express.urlencoded({ extended: false, limit: '20kb' }));
  r.use(requireSignature(deps));
  r.use(refuseNulBytes);

  r.post('/inbound', async (req, res) => {
    const from = requiredParam(req.body, 'From');
    const body = typeof req.body.Body === 'string' ? req.body.Body : '';
    const reply = await handleInbound(deps, from, body);
    res.type('text/xml').send(twiml(reply));
  });

  r.post('/status', async (req, res) => {
    const sid = requiredParam(req.body, 'MessageSid');
    const status = requiredParam(req.body, 'MessageStatus').toLowerCase();
    const errorCode = typeof req.body.ErrorCode === 'string' ? req.body.ErrorCode : undefined;
    await recordStatus(deps, sid, status, errorCode);
    res.status(204).end();
  });

  return r;
}

/** Returns the text to answer with, if any. */
async function handleInbound(deps: SmsWebhookDeps, from: string, body: string): Promise<string | undefined> {
  const word = keywordOf(body);
  if (OPT_OUT.has(word)) {
    await optOut(deps.db, from);
    return undefined; // the provider confirms; nothing more may be sent
  }
  if (OPT_IN.has(word)) await optIn(deps.db, from);
  if (HELP.has(word)) return HELP_TEXT;

  const pending = await newestPendingAssignment(deps.db, from);
  if (!pending) return undefined; // not a technician waiting to answer: nothing to say
  const answer = ACCEPT.has(word) ? true : DECLINE.has(word) ? false : undefined;
  return withScope(deps.db, { tenantId: pending.tenantId, userId: pending.technicianId }, (tx) =>
    applyAnswer(tx, { ...pending, from, body, answer }),
  );
}

interface PendingAssignment {
  tenantId: string;
  technicianId: string;
  callId: string;
}

/**
 * The newest call assigned to this number's technician and not yet accepted, across every company the
 * technician works for: the phone number is all we know, so the lookup starts from it.
 */
async function newestPendingAssignment(db: Db, phone: string): Promise<PendingAssignment | undefined> {
  let newest: (PendingAssignment & { at: Date }) | undefined;
  for (const t of await findTechniciansByPhone(db, phone)) {
    const call = await withScope(db, { tenantId: t.tenantId, userId: t.userId }, (tx) => findNewestPendingAssignment(tx, t.userId));
    if (call && (!newest || call.at > newest.at)) newest = { tenantId: t.tenantId, technicianId: t.userId, callId: call.id, at: call.at };
  }
  return newest && { tenantId: newest.tenantId, technicianId: newest.technicianId, callId: newest.callId };
}

async function applyAnswer(tx: Tx, p: PendingAssignment & { from: string; body: string; answer: boolean | undefined }): Promise<string> {
  const label = `SMS from ${p.from}`;
  // Lock the call and look again: a second reply, or a dispatcher reassigning, may have come first.
  const call = await lockAssignment(tx, p.callId);
  await insertEvent(tx, { callId: p.callId, kind: 'sms_in', actorUserId: p.technicianId, actorLabel: label, detail: { body: p.body } });
  const ref = callRef(p.callId);
  const stillPending = call && call.state === 'assigned' && call.technicianId === p.technicianId && !call.acceptedAt;
  if (!stillPending) return `Call ${ref} is no longer waiting for your answer.`;
  if (p.answer === undefined) return `Reply YES to accept call ${ref} or NO to decline it.`;

  const view = await answerAssignment(tx, {
    callId: p.callId,
    technicianId: p.technicianId,
    accept: p.answer,
    actor: { userId: p.technicianId, role: 'technician', label },
  });
  const what = view ? `${view.gameTitle}${view.venueName ? ` at ${view.venueName}` : ''}` : '';
  return p.answer ? `Accepted call ${ref}${what ? `: ${what}` : ''}. Thank you.` : `Declined call ${ref}; it is back with dispatch.`;
}

// Status changes can arrive out of order; a later stage never goes back to an earlier one.
const STAGE: Record<string, number> = {
  accepted: 0,
  scheduled: 0,
  queued: 0,
  sending: 1,
  sent: 2,
  delivered: 3,
  read: 4,
  undelivered: 3,
  failed: 3,
};

async function recordStatus(deps: SmsWebhookDeps, providerId: string, status: string, errorCode: string | undefined): Promise<void> {
  if (!Object.hasOwn(STAGE, status)) throw new ValidationError([{ field: 'MessageStatus', message: 'is not a known message status' }]);
  const owners = await findMessagesByProviderId(deps.db, providerId);
  if (owners.length === 0) deps.logger?.debug({ providerId, status }, 'status for a message we do not know (yet)');
  // Only over an earlier stage (or none yet): a late "sent" must not overwrite "delivered".
  const notLater = Object.keys(STAGE).filter((s) => STAGE[s]! <= STAGE[status]!);
  const undelivered = status === 'failed' || status === 'undelivered';
  const failure = undelivered ? `the provider reports ${status}${errorCode ? ` (error ${errorCode})` : ''}` : undefined;
  for (const row of owners) {
    await withScope(deps.db, { tenantId: row.tenantId }, (tx) => recordProviderStatus(tx, row.id, status, { over: notLater, failure }));
  }
}
