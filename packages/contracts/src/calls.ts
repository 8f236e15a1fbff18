// Service calls: the request shapes and the responses. Their words and state machine are in call-vocabulary.ts.
import { z } from 'zod';
import { callSources, callStates, problemKinds, severities } from './call-vocabulary.ts';
import { isoDateTime, listQueryBase, pageOf, rowVersion, shortText, uuid } from './common.ts';
import { gameKinds } from './game-vocabulary.ts';

// Re-exported so that server code finds the whole contract of a call here; web code imports call-vocabulary.ts,
// which does not pull zod into the screens' bundles.
export {
  problemKinds,
  problemLabels,
  severities,
  severityLabels,
  defaultSeverity,
  callStates,
  callStateLabels,
  transitions,
  canTransition,
  callStateGroups,
  inStateGroup,
  callSources,
  callRef,
} from './call-vocabulary.ts';
export type { ProblemKind, Severity, CallState } from './call-vocabulary.ts';

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

/** The answer to a staff photo added to a call: its id and its entry in the call's photo list. */
export const callPhotoAdded = z.strictObject({ photoId: uuid, photo: callPhoto });
export type CallPhotoAdded = z.infer<typeof callPhotoAdded>;

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
