// Words and closed sets of care plans, work orders, meters and route days. No zod here: the web app's technician
// screens import these values without downloading zod.

/** What a care plan covers: every game of a model, or one game. */
export const carePlanScopes = ['model', 'game'] as const;
export type CarePlanScope = (typeof carePlanScopes)[number];

/** Why a work order fell due: the plan's calendar rule, plays or power-on hours on the meter, or capacitor life. */
export const dueReasons = ['calendar', 'plays', 'hours', 'capacitor_life'] as const;
export type DueReason = (typeof dueReasons)[number];

export const dueReasonLabels: Record<DueReason, string> = {
  calendar: 'By the calendar',
  plays: 'By plays on the meter',
  hours: 'By power-on hours',
  capacitor_life: 'Capacitors near end of life',
};

/** A work order is open until it is done or skipped (with a reason); moving it changes its date or technician. */
export const workOrderStates = ['open', 'done', 'skipped'] as const;
export type WorkOrderState = (typeof workOrderStates)[number];

export const workOrderStateLabels: Record<WorkOrderState, string> = {
  open: 'To do',
  done: 'Done',
  skipped: 'Skipped',
};

/** How urgent open work is: past its due moment, inside the lead before it, or further off. */
export const dueStates = ['overdue', 'due_soon', 'later'] as const;
export type DueStateName = (typeof dueStates)[number];

export const dueStateLabels: Record<DueStateName, string> = {
  overdue: 'Overdue',
  due_soon: 'Due soon',
  later: 'Later',
};

/**
 * The meters a game can have. Plays and power-on hours drive care plans; coins, bills and credits are what
 * collections read. Each game says which it has and where each rolls over (`game_meters`).
 */
export const meterKinds = ['plays', 'hours', 'coins_in', 'bills_in', 'credits'] as const;
export type MeterKind = (typeof meterKinds)[number];

export const meterKindLabels: Record<MeterKind, string> = {
  plays: 'Plays',
  hours: 'Power-on hours',
  coins_in: 'Coins in',
  bills_in: 'Bills in',
  credits: 'Credits',
};

/** Where a meter reading was taken. */
export const meterReadingSources = ['visit', 'work_order', 'collection'] as const;
export type MeterReadingSource = (typeof meterReadingSources)[number];

/** The kinds of work that make up a route day's stop. */
export const stopItemKinds = ['service_call', 'work_order', 'bench_job'] as const;
export type StopItemKind = (typeof stopItemKinds)[number];

export const stopItemKindLabels: Record<StopItemKind, string> = {
  service_call: 'Service call',
  work_order: 'Care-plan work',
  bench_job: 'Bench job',
};
