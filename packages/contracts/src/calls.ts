// Service calls: the shared words, the state machine and the request shapes.
import { z } from 'zod';
import { listQueryBase, rowVersion, shortText, uuid } from './common.ts';
import { phoneNumber } from './phone.ts';

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
export const openCallStates: readonly CallState[] = ['reported', 'assigned', 'on_the_way', 'on_site', 'waiting_parts', 'at_shop', 'fixed'];

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

/** Public report from a game tag (no sign-in). */
export const publicReportInput = z.strictObject({
  problem: z.enum(problemKinds, { error: 'choose what is wrong' }),
  note: shortText(1000).default(''),
  phone: z.union([z.literal(''), phoneNumber]).default(''),
  smsConsent: z
    .union([z.boolean(), z.literal('on'), z.literal('yes')])
    .transform((v) => v === true || v === 'on' || v === 'yes')
    .default(false),
});
export type PublicReportInput = z.input<typeof publicReportInput>;

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

export const callListQuery = listQueryBase.extend({
  sort: z.enum(['openedAt', 'targetAt']).default('targetAt'),
  state: z.union([z.literal('open'), z.literal('all'), z.enum(callStates)]).default('open'),
  venueId: uuid.optional(),
  gameId: uuid.optional(),
  problem: z.enum(problemKinds).optional(),
  technicianId: z.union([uuid, z.literal('none'), z.literal('me')]).optional(),
});
export type CallListQuery = z.input<typeof callListQuery>;

export interface ServiceCall {
  id: string;
  ref: string;
  gameId: string;
  gameTitle: string;
  gameSerial: string;
  gameKind: string;
  venueId: string | null;
  venueName: string | null;
  latitude: number | null;
  longitude: number | null;
  problem: ProblemKind;
  severity: Severity;
  state: CallState;
  source: 'game_tag' | 'venue_view' | 'staff';
  note: string;
  technicianId: string | null;
  technicianName: string | null;
  acceptedAt: string | null;
  openedAt: string;
  targetAt: string;
  fixedAt: string | null;
  closedAt: string | null;
  version: number;
  reporterWantsSms: boolean;
}

export interface CallEvent {
  id: string;
  at: string;
  kind: string;
  actorName: string | null;
  actorLabel: string;
  fromState: CallState | null;
  toState: CallState | null;
  detail: Record<string, unknown>;
}

/** A call's short reference, as read out on the phone and shown in SMS. */
export function callRef(id: string): string {
  return id.replace(/-/g, '').slice(0, 6).toUpperCase();
}
