// Service calls: the shared words, the state machine, the request shapes and the responses.
import { z } from 'zod';
import { isoDateTime, listQueryBase, pageOf, rowVersion, shortText, uuid } from './common.ts';
import { gameKinds } from './games.ts';

export const problemKinds = ['dead', 'no_credit', 'ball_stuck', 'no_sound', 'display_out', 'other'] as const;
export type ProblemKind = (typeof problemKinds)[number];
export const problemLabels: Record<ProblemKind, string> = {
  dead: 'Dead — no lights, no power',
  no_credit: 'Takes money but gives no credit',
  ball_stuck: 'Ball stuck',
  no_sound: 'No sound',
  display_out: 'Display or screen out',
  other: 'Something else',
};

export const severities = ['down', 'fault', 'cosmetic'] as const;
export type Severity = (typeof severities)[number];
export const severityLabels: Record<Severity, string> = {
  down: 'Game down',
  fault: 'Playable with a fault',
  cosmetic: 'Cosmetic',
};
/** What a report from the game tag most likely means for the game (staff can change it). */
export const defaultSeverity: Record<ProblemKind, Severity> = {
  dead: 'down',
  no_credit: 'down',
  ball_stuck: 'down',
  no_sound: 'fault',
  display_out: 'fault',
  other: 'fault',
};

export const callStates = [
  'reported',
  'assigned',
  'on_the_way',
  'on_site',
  'waiting_parts',
  'at_shop',
  'fixed',
  'closed',
  'cancelled',
] as const;
export type CallState = (typeof callStates)[number];
export const callStateLabels: Record<CallState, string> = {
  reported: 'Reported',
  assigned: 'Assigned',
  on_the_way: 'On the way',
  on_site: 'On site',
  waiting_parts: 'Waiting on parts',
  at_shop: 'Taken to the shop',
  fixed: 'Fixed',
  closed: 'Closed',
  cancelled: 'Cancelled',
};

/**
 * Which state may follow which. Assignment itself (reported → assigned, and back) goes through
 * the assign action, not a plain transition.
 */
export const transitions: Record<CallState, readonly CallState[]> = {
  reported: ['cancelled'],
  assigned: ['on_the_way', 'on_site', 'cancelled'],
  on_the_way: ['on_site', 'cancelled'],
  on_site: ['fixed', 'waiting_parts', 'at_shop'],
  waiting_parts: ['on_site', 'fixed', 'at_shop'],
  at_shop: ['fixed'],
  fixed: ['closed', 'on_site'],
  closed: [],
  cancelled: [],
};

export function canTransition(from: CallState, to: CallState): boolean {
  return transitions[from].includes(to);
}

/** States with no way out: the call is over. */
const finishedStates = callStates.filter((s) => transitions[s].length === 0);

/**
 * The groups of states the product reasons with, each said once, beside the transition table they
 * follow from. Queries, jobs, services and screens use these; none lists states of its own.
 */
export const callStateGroups = {
  /** Not over yet (a fixed call still waits to be closed): the dispatch list. */
  open: callStates.filter((s) => !finishedStates.includes(s)),
  /** The game still waits for its fix: it stays down, and a new report of it joins the call. */
  unfixed: callStates.filter((s) => !finishedStates.includes(s) && s !== 'fixed'),
  /** Nobody has reached the game yet: the response target is running and the assignment may change. */
  awaitingArrival: ['reported', 'assigned', 'on_the_way'],
  /** On a technician's plate: counts towards their load when calls are handed out. */
  technicianLoad: ['assigned', 'on_the_way', 'on_site', 'waiting_parts'],
  /** The reporter (when they asked for texts) hears of a move into these. */
  reporterNotified: ['on_the_way', 'on_site', 'at_shop', 'fixed', 'closed', 'cancelled'],
} as const satisfies Record<string, readonly CallState[]>;

export function inStateGroup(group: keyof typeof callStateGroups, state: CallState): boolean {
  return (callStateGroups[group] as readonly CallState[]).includes(state);
}

/** A call opened by staff or from the venue view. */
export const openCallInput = z.strictObject({
  gameId: uuid,
  problem: z.enum(problemKinds),
  severity: z.enum(severities).optional(),
  note: shortText(2000).default(''),
});
export type OpenCallInput = z.input<typeof openCallInput>;

export const transitionInput = z.strictObject({
  to: z.enum(callStates),
  version: rowVersion,
  note: shortText(2000).optional(),
});
export const assignInput = z.strictObject({
  technicianId: uuid.nullable(),
  version: rowVersion,
});
export const severityInput = z.strictObject({ severity: z.enum(severities), version: rowVersion });
export const noteInput = z.strictObject({ note: shortText(2000).min(1, { error: 'is required' }) });
/** The assigned technician's answer to an assignment, from the app (an SMS reply does the same). */
export const answerInput = z.strictObject({ accept: z.boolean() });

export const callListQuery = listQueryBase.extend({
  sort: z.enum(['openedAt', 'targetAt']).default('targetAt'),
  state: z.union([z.literal('open'), z.literal('all'), z.enum(callStates)]).default('open'),
  venueId: uuid.optional(),
  gameId: uuid.optional(),
  problem: z.enum(problemKinds).optional(),
  technicianId: z.union([uuid, z.literal('none'), z.literal('me')]).optional(),
});
export type CallListQuery = z.input<typeof callListQuery>;

export const callSources = ['game_tag', 'venue_view', 'staff'] as const;

/** A call as staff see it: in the dispatch list, on its page, and after each change. */
export const serviceCall = z.strictObject({
  id: uuid,
  gameId: uuid,
  gameTitle: z.string(),
  gameSerial: z.string(),
  gameKind: z.enum(gameKinds),
  venueId: uuid.nullable(),
  venueName: z.string().nullable(),
  latitude: z.number().nullable(),
  longitude: z.number().nullable(),
  problem: z.enum(problemKinds),
  severity: z.enum(severities),
  state: z.enum(callStates),
  source: z.enum(callSources),
  note: z.string(),
  technicianId: uuid.nullable(),
  technicianName: z.string().nullable(),
  acceptedAt: isoDateTime.nullable(),
  openedAt: isoDateTime,
  targetAt: isoDateTime,
  fixedAt: isoDateTime.nullable(),
  closedAt: isoDateTime.nullable(),
  version: z.number().int(),
  /** The reporter asked for text updates and left a number (the number itself never leaves the API). */
  reporterWantsSms: z.boolean(),
});
export type ServiceCall = z.infer<typeof serviceCall>;
export const callPage = pageOf(serviceCall);
export type CallPage = z.infer<typeof callPage>;
/** A call opened by staff: `joined` when the report joined a call already open on the game. */
export const openedCall = serviceCall.extend({ joined: z.boolean() });
export type OpenedCall = z.infer<typeof openedCall>;

/** One entry of a call's timeline. */
export const callEvent = z.strictObject({
  id: uuid,
  at: isoDateTime,
  kind: z.string(),
  actorName: z.string().nullable(),
  actorLabel: z.string(),
  fromState: z.enum(callStates).nullable(),
  toState: z.enum(callStates).nullable(),
  detail: z.record(z.string(), z.unknown()),
});
export type CallEvent = z.infer<typeof callEvent>;

/** A text or e-mail sent about the call; `toAddress` is masked for those without `calls:contacts`. */
export const callMessage = z.strictObject({
  id: uuid,
  channel: z.enum(['sms', 'email']),
  toAddress: z.string(),
  subject: z.string(),
  body: z.string(),
  status: z.string(),
  providerStatus: z.string().nullable(),
  createdAt: isoDateTime,
  sentAt: isoDateTime.nullable(),
});
export type CallMessage = z.infer<typeof callMessage>;

/** A photo sent with a report: its file is fetched from /api/calls/:id/photos/:photoId. */
export const callPhoto = z.strictObject({
  id: uuid,
  width: z.number().int(),
  height: z.number().int(),
  createdAt: isoDateTime,
  uploadedBy: z.string(),
});
export type CallPhoto = z.infer<typeof callPhoto>;

export const callDetail = z.strictObject({
  call: serviceCall,
  events: z.array(callEvent),
  messages: z.array(callMessage),
  photos: z.array(callPhoto),
});
export type CallDetail = z.infer<typeof callDetail>;

export const noteAdded = z.strictObject({ ok: z.literal(true) });
export type NoteAdded = z.infer<typeof noteAdded>;

/** A technician of the company, with their home base and open load (for dispatchers). */
export const technician = z.strictObject({
  userId: uuid,
  name: z.string(),
  phone: z.string().nullable(),
  skills: z.array(z.string()),
  homeLatitude: z.number().nullable(),
  homeLongitude: z.number().nullable(),
  openCalls: z.number().int(),
});
export type Technician = z.infer<typeof technician>;
export const technicianList = z.strictObject({ items: z.array(technician) });
export type TechnicianList = z.infer<typeof technicianList>;

/** A technician ranked for one call; `rank` is null when the call or the technician has no location. */
export const rankedTechnician = z.strictObject({
  userId: uuid,
  name: z.string(),
  skills: z.array(z.string()),
  openCalls: z.number().int(),
  hasPhone: z.boolean(),
  rank: z
    .strictObject({
      id: uuid,
      score: z.number(),
      distanceKm: z.number(),
      excluded: z.boolean(),
      missingSkills: z.array(z.string()),
      reasons: z.array(z.string()),
    })
    .nullable(),
});
export type RankedTechnician = z.infer<typeof rankedTechnician>;
export const rankedTechnicianList = z.strictObject({ items: z.array(rankedTechnician) });
export type RankedTechnicianList = z.infer<typeof rankedTechnicianList>;

/** A call's short reference, as read out on the phone and shown in SMS. */
export function callRef(id: string): string {
  return id.replace(/-/g, '').slice(0, 6).toUpperCase();
}
