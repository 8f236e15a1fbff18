// The service-call workflow: opening (or joining) a call, moving it through its states, assigning a
// technician. The game's status and downtime follow the call, and every message it causes is written
// to the outbox in the same transaction, to be sent after commit by the outbox worker.
import {
  canTransition,
  callStateLabels,
  defaultSeverity,
  inStateGroup,
  type CallState,
  type ProblemKind,
  type Severity,
} from '@bumperline/contracts/calls';
import type { Role } from '@bumperline/contracts/roles';
import type { Tx } from '@bumperline/db/client';
import {
  countUnfixedCallsForGame,
  findUnfixedCallForGame,
  getCall,
  getCallRow,
  insertCall,
  updateCall,
} from '@bumperline/db/queries/calls';
import { insertEvent } from '@bumperline/db/queries/call-events';
import { closeDowntime, openDowntime } from '@bumperline/db/queries/downtime';
import { getGame, updateGame } from '@bumperline/db/queries/games';
import { findUserById } from '@bumperline/db/queries/identity';
import { enqueueMessage } from '@bumperline/db/queries/outbox';
import { getSettings } from '@bumperline/db/queries/settings';
import { isTechnician } from '@bumperline/db/queries/technicians';
import { venueContactEmails } from '@bumperline/db/queries/venue-contacts';
import { Conflict, InvalidInput, NotAllowed, NotFound } from './workflow-errors.ts';
import { reporterUpdateSms, technicianAssignedSms, venueCallClosedEmail, venueCallOpenedEmail } from './call-messages.ts';
import { appLink } from './links.ts';
import { recordServiceCallKeepCost } from './keep-cost.ts';

export interface CallActor {
  userId: string | null;
  role: Role | null;
  /** Shown on the timeline when there is no signed-in person: "reporter", "SMS from …", "system". */
  label: string;
}

export interface OpenCallParams {
  gameId: string;
  problem: ProblemKind;
  severity?: Severity;
  note: string;
  source: 'game_tag' | 'venue_view' | 'staff';
  reporterPhone?: string | null;
  smsConsent?: boolean;
  actor: CallActor;
  appOrigin: string;
  now?: Date;
}

export async function openCall(tx: Tx, p: OpenCallParams): Promise<{ callId: string; statusToken: string; joined: boolean }> {
  const game = await getGame(tx, p.gameId);
  if (!game || game.retiredAt) throw new InvalidInput([{ field: 'gameId', message: 'is not a game on location' }]);
  const now = p.now ?? new Date();
  const phone = p.smsConsent && p.reporterPhone ? p.reporterPhone : null;

  // A second report of a game already waiting for a fix joins that call.
  const existingId = await findUnfixedCallForGame(tx, p.gameId);
  if (existingId) {
    const existing = (await getCallRow(tx, existingId))!;
    await insertEvent(tx, {
      callId: existingId,
      kind: 'report_joined',
      actorUserId: p.actor.userId,
      actorLabel: p.actor.label,
      detail: { problem: p.problem, note: p.note, source: p.source },
    });
    if (phone && !existing.reporterPhone) {
      await updateCall(tx, existingId, existing.version, { reporterPhone: phone, reporterSmsConsent: true });
    }
    return { callId: existingId, statusToken: existing.statusToken, joined: true };
  }

  const severity = p.severity ?? defaultSeverity[p.problem];
  const settings = await getSettings(tx);
  const targetAt = new Date(now.getTime() + settings.responseTargets[severity] * 60_000);
  const { id, statusToken } = await insertCall(tx, {
    gameId: p.gameId,
    venueId: game.venueId,
    problem: p.problem,
    severity,
    source: p.source,
    note: p.note,
    reporterPhone: phone,
    reporterSmsConsent: !!phone,
    createdBy: p.actor.userId,
    openedAt: now,
    targetAt,
  });
  await insertEvent(tx, {
    callId: id,
    kind: 'opened',
    actorUserId: p.actor.userId,
    actorLabel: p.actor.label,
    toState: 'reported',
    at: now,
    detail: { problem: p.problem, severity, source: p.source },
  });
  await gameFollowsCall(tx, p.gameId, severity, id, now);

  if (game.venueId) {
    const facts = { id, gameTitle: game.model.title, venueName: game.venueName, problem: p.problem };
    const mail = venueCallOpenedEmail(facts, appLink(p.appOrigin, `/status/${statusToken}`));
    for (const to of await venueContactEmails(tx, game.venueId)) {
      await enqueueMessage(tx, { channel: 'email', to, subject: mail.subject, body: mail.body, callId: id });
    }
  }
  return { callId: id, statusToken, joined: false };
}

/** A new problem puts the game down (or needing attention) and starts its downtime. */
async function gameFollowsCall(tx: Tx, gameId: string, severity: Severity, callId: string, at: Date) {
  const game = (await getGame(tx, gameId))!;
  if (severity === 'down') {
    if (game.status !== 'down' && game.status !== 'in_shop') await updateGame(tx, gameId, game.version, { status: 'down' });
    await openDowntime(tx, gameId, callId, at);
  } else if (severity === 'fault' && game.status === 'running') {
    await updateGame(tx, gameId, game.version, { status: 'attention' });
  }
}

/** Once no unfixed call is left on the game, it is running again and its downtime ends. */
async function gameBackInService(tx: Tx, gameId: string, at: Date) {
  const game = (await getGame(tx, gameId))!;
  if ((await countUnfixedCallsForGame(tx, gameId)) === 0) {
    await closeDowntime(tx, gameId, at);
    if (game.status !== 'running') await updateGame(tx, gameId, game.version, { status: 'running' });
  } else if ((await countUnfixedCallsForGame(tx, gameId, 'down')) === 0) {
    await closeDowntime(tx, gameId, at);
    if (game.status === 'down' || game.status === 'in_shop') await updateGame(tx, gameId, game.version, { status: 'attention' });
  }
}

function assertMayWork(actor: CallActor, call: { technicianId: string | null }) {
  if (actor.role === 'technician' && call.technicianId !== actor.userId) {
    throw new NotAllowed('Only the technician assigned to this call, or a dispatcher, can change it.');
  }
}

export async function transitionCall(
  tx: Tx,
  p: { callId: string; to: CallState; version: number; note?: string; actor: CallActor; appOrigin: string; now?: Date },
) {
  const call = await getCallRow(tx, p.callId);
  if (!call) throw new NotFound('service call');
  assertMayWork(p.actor, call);
  if (p.to === 'cancelled' && p.actor.role === 'technician') {
    throw new NotAllowed('Only a dispatcher or an owner can cancel a call.');
  }
  if (call.version !== p.version) {
    throw new Conflict('This call changed since you opened it. Here is where it stands now.', await getCall(tx, p.callId));
  }
  if (!canTransition(call.state, p.to)) {
    throw new Conflict(
      `A call that is "${callStateLabels[call.state]}" cannot become "${callStateLabels[p.to]}".`,
      await getCall(tx, p.callId),
    );
  }
  const now = p.now ?? new Date();
  const patch: Parameters<typeof updateCall>[3] = { state: p.to };
  if (p.to === 'fixed') patch.fixedAt = now;
  if (p.to === 'on_site' && call.state === 'fixed') patch.fixedAt = null;
  if (p.to === 'closed' || p.to === 'cancelled') patch.closedAt = now;
  if (!(await updateCall(tx, p.callId, p.version, patch))) {
    throw new Conflict('This call changed since you opened it. Here is where it stands now.', await getCall(tx, p.callId));
  }
  await insertEvent(tx, {
    callId: p.callId,
    kind: 'state',
    at: now,
    actorUserId: p.actor.userId,
    actorLabel: p.actor.label,
    fromState: call.state,
    toState: p.to,
    detail: p.note ? { note: p.note } : {},
  });

  if (p.to === 'at_shop') {
    const game = (await getGame(tx, call.gameId))!;
    await updateGame(tx, call.gameId, game.version, { status: 'in_shop' });
  } else if (p.to === 'fixed' || p.to === 'cancelled') {
    await gameBackInService(tx, call.gameId, now);
    if (p.to === 'fixed')
      await recordServiceCallKeepCost(tx, { callId: call.id, gameId: call.gameId, technicianId: call.technicianId, fixedAt: now });
  } else if (p.to === 'on_site' && call.state === 'fixed') {
    await gameFollowsCall(tx, call.gameId, call.severity, call.id, now); // reopened: not fixed after all
  }

  const view = (await getCall(tx, p.callId))!;
  const facts = { id: view.id, gameTitle: view.gameTitle, venueName: view.venueName, problem: view.problem };
  const statusLink = appLink(p.appOrigin, `/status/${call.statusToken}`);
  if (call.reporterSmsConsent && call.reporterPhone && inStateGroup('reporterNotified', p.to)) {
    await enqueueMessage(tx, { channel: 'sms', to: call.reporterPhone, body: reporterUpdateSms(facts, p.to, statusLink), callId: call.id });
  }
  if (p.to === 'closed' && call.venueId) {
    const mail = venueCallClosedEmail(facts, statusLink);
    for (const to of await venueContactEmails(tx, call.venueId)) {
      await enqueueMessage(tx, { channel: 'email', to, subject: mail.subject, body: mail.body, callId: call.id });
    }
  }
  return view;
}

export async function assignCall(
  tx: Tx,
  p: { callId: string; technicianId: string | null; version: number; actor: CallActor; appOrigin: string; now?: Date },
) {
  const call = await getCallRow(tx, p.callId);
  if (!call) throw new NotFound('service call');
  if (call.version !== p.version) {
    throw new Conflict('Someone else changed this call first. Here is where it stands now.', await getCall(tx, p.callId));
  }
  if (!inStateGroup('awaitingArrival', call.state)) {
    throw new Conflict(`A call that is "${callStateLabels[call.state]}" cannot be (re)assigned.`, await getCall(tx, p.callId));
  }
  if (p.technicianId && !(await isTechnician(tx, p.technicianId))) {
    throw new InvalidInput([{ field: 'technicianId', message: 'is not a technician of this company' }]);
  }
  const now = p.now ?? new Date();
  const toState: CallState = p.technicianId ? 'assigned' : 'reported';
  const updated = await updateCall(tx, p.callId, p.version, { technicianId: p.technicianId, state: toState, acceptedAt: null });
  if (!updated) throw new Conflict('Someone else changed this call first. Here is where it stands now.', await getCall(tx, p.callId));
  await insertEvent(tx, {
    callId: p.callId,
    kind: p.technicianId ? 'assigned' : 'unassigned',
    at: now,
    actorUserId: p.actor.userId,
    actorLabel: p.actor.label,
    fromState: call.state,
    toState,
    detail: { technicianId: p.technicianId, previousTechnicianId: call.technicianId },
  });
  const view = (await getCall(tx, p.callId))!;
  if (p.technicianId) {
    const tech = await findUserById(tx, p.technicianId);
    if (tech?.phone) {
      const facts = { id: view.id, gameTitle: view.gameTitle, venueName: view.venueName, problem: view.problem };
      await enqueueMessage(tx, {
        channel: 'sms',
        to: tech.phone,
        body: technicianAssignedSms(facts, appLink(p.appOrigin, `/calls/${view.id}`)),
        callId: view.id,
      });
    }
  }
  return view;
}

/** The technician's answer to an assignment (an SMS reply or a button): accept, or decline back to dispatch. */
export async function answerAssignment(tx: Tx, p: { callId: string; technicianId: string; accept: boolean; actor: CallActor; now?: Date }) {
  const call = await getCallRow(tx, p.callId);
  if (!call || call.technicianId !== p.technicianId) throw new NotFound('assignment');
  const now = p.now ?? new Date();
  if (call.state !== 'assigned' || call.acceptedAt) {
    throw new Conflict(
      call.acceptedAt ? 'You already accepted this call.' : 'This call is no longer waiting for your answer.',
      await getCall(tx, call.id),
    );
  }
  const changed = await updateCall(
    tx,
    call.id,
    call.version,
    p.accept ? { acceptedAt: now } : { technicianId: null, state: 'reported', acceptedAt: null },
  );
  if (!changed) throw new Conflict('This call changed at the same moment. Here is where it stands now.', await getCall(tx, call.id));
  if (p.accept) {
    await insertEvent(tx, { callId: call.id, kind: 'accepted', at: now, actorUserId: p.technicianId, actorLabel: p.actor.label });
  } else {
    await insertEvent(tx, {
      callId: call.id,
      kind: 'declined',
      at: now,
      actorUserId: p.technicianId,
      actorLabel: p.actor.label,
      fromState: call.state,
      toState: 'reported',
    });
  }
  return getCall(tx, call.id);
}
