// Service calls' shared words and state machine, without zod: the web app's screens import these, and the
// schemas in calls.ts are built on them.

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

export const callSources = ['game_tag', 'venue_view', 'staff'] as const;

/** A call's short reference, as read out on the phone and shown in SMS. */
export function callRef(id: string): string {
  return id.replace(/-/g, '').slice(0, 6).toUpperCase();
}
