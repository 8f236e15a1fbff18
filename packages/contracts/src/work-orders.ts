// Work orders: one due piece of a care plan's work on one game, made by the scheduled care-plan run. Open until done
// or skipped (with a reason); moving one changes its day or its technician. Words are in care-vocabulary.ts.
import { z } from 'zod';
import { dueReasons, dueStates, meterKinds, workOrderStates } from './care-vocabulary.ts';
import { personRef } from './care-plans.ts';
import { int4, isoDate, isoDateTime, pageOf, rowVersion, shortText, uuid } from './common.ts';

export { workOrderStates, workOrderStateLabels } from './care-vocabulary.ts';
export type { WorkOrderState } from './care-vocabulary.ts';

/**
 * GET /api/work-orders. Open work by due date by default; `due` narrows open work to overdue / due soon (inside the
 * plan's lead) / later; `technicianId=me` is the signed-in person's; `plannedOn` is one local day (a route day).
 */
export const workOrderListQuery = z.strictObject({
  /** Matches the work's title, or the game's serial or title. */
  q: shortText(100).optional(),
  state: z.enum(workOrderStates).default('open'),
  due: z.enum(dueStates).optional(),
  gameId: uuid.optional(),
  venueId: uuid.optional(),
  carePlanId: uuid.optional(),
  technicianId: z.union([uuid, z.literal('none'), z.literal('me')]).optional(),
  plannedOn: z.iso.date({ error: 'must be a date as YYYY-MM-DD' }).optional(),
  order: z.enum(['asc', 'desc']).default('asc'),
  cursor: z.string().max(500).optional(),
  limit: z.coerce.number().int().min(1).max(200).default(25),
});
export type WorkOrderListQuery = z.input<typeof workOrderListQuery>;

export const workOrder = z.strictObject({
  id: uuid,
  carePlanId: uuid,
  carePlanName: z.string(),
  /** The plan's name when the work fell due. */
  title: z.string(),
  game: z.strictObject({
    id: uuid,
    serial: z.string(),
    modelTitle: z.string(),
    venue: z.strictObject({ id: uuid, name: z.string() }).nullable(),
  }),
  dueAt: isoDateTime,
  dueReason: z.enum(dueReasons),
  /** For open work only, at read time in the company's time zone; null once done or skipped. */
  dueState: z.enum(dueStates).nullable(),
  tasks: z.array(z.string()),
  benchTemplateId: uuid.nullable(),
  benchJobId: uuid.nullable(),
  skills: z.array(z.string()),
  onSiteMinutes: z.number().int(),
  state: z.enum(workOrderStates),
  technician: personRef.nullable(),
  /** The company's local date it is planned for (a route day). */
  plannedOn: isoDate.nullable(),
  note: z.string(),
  skipReason: z.string().nullable(),
  labourMinutes: z.number().int().nullable(),
  playsAtDone: z.number().int().nullable(),
  hoursAtDone: z.number().int().nullable(),
  closedAt: isoDateTime.nullable(),
  createdAt: isoDateTime,
  updatedAt: isoDateTime,
  version: z.number().int(),
});
export type WorkOrder = z.infer<typeof workOrder>;
export const workOrderPage = pageOf(workOrder);
export type WorkOrderPage = z.infer<typeof workOrderPage>;

/**
 * POST /api/work-orders/:id/move: a new day and/or technician. Changing the technician needs work-orders:plan; a
 * technician may move only the day of their own work. Stale version → 409 with `current`.
 */
export const workOrderMove = z
  .strictObject({
    version: rowVersion,
    plannedOn: isoDate.nullable().optional(),
    technicianId: uuid.nullable().optional(),
  })
  .refine((m) => m.plannedOn !== undefined || m.technicianId !== undefined, {
    error: 'give a new day or a new technician',
    path: ['plannedOn'],
  });
export type WorkOrderMove = z.input<typeof workOrderMove>;

/** POST /api/work-orders/:id/skip: why it was not done (required). */
export const workOrderSkip = z.strictObject({
  version: rowVersion,
  reason: shortText(1000).min(1, { error: 'is required: say why the work is skipped' }),
});
export type WorkOrderSkip = z.input<typeof workOrderSkip>;

/** A meter read when the work was done: the next plays/hours due counts from it. */
export const doneMeterReading = z.strictObject({
  meter: z.enum(meterKinds, { error: `must be one of ${meterKinds.join(', ')}` }),
  reading: z
    .number({ error: 'must be a number' })
    .int({ error: 'must be a whole number' })
    .min(0, { error: 'must not be negative' })
    .max(999_999_999_999, { error: 'is too large for a meter' }),
  rolledOver: z.boolean().default(false),
});
export type DoneMeterReading = z.input<typeof doneMeterReading>;

/**
 * POST /api/work-orders/:id/done: time spent on site in whole minutes (the screen reads "45 min"), an optional note
 * and the meters read then. Parts used are recorded before, on /api/work-orders/:id/parts-used. Writes the keep cost.
 * Done twice → 409 naming `state`.
 */
export const workOrderDone = z.strictObject({
  version: rowVersion,
  labourMinutes: int4().min(0, { error: 'must not be negative' }).max(1440, { error: 'must be at most 24 hours' }),
  note: shortText(2000).default(''),
  readings: z
    .array(doneMeterReading)
    .max(5)
    .refine((rs) => new Set(rs.map((r) => r.meter)).size === rs.length, { error: 'reads a meter twice' })
    .default([]),
});
export type WorkOrderDone = z.input<typeof workOrderDone>;
export type WorkOrderDoneParsed = z.output<typeof workOrderDone>;

/**
 * POST /api/work-orders/:id/bench-job: opens the bench job of a work order whose plan names a template, on one of
 * the game's boards. Returns the work order with its `benchJobId`. Finishing the bench job does not close the work
 * order: the technician still records time and meters and marks it done.
 */
export const workOrderOpenBenchJob = z.strictObject({ version: rowVersion, boardInstanceId: uuid });
export type WorkOrderOpenBenchJob = z.input<typeof workOrderOpenBenchJob>;

/** POST /dev/care-plans/run (demo mode, loopback only): runs the care-plan run as of `at` — the demo's clock. */
export const devCarePlanRun = z.strictObject({ at: isoDateTime });
export type DevCarePlanRun = z.input<typeof devCarePlanRun>;
export const carePlanRunResult = z.strictObject({
  at: isoDateTime,
  companies: z.number().int(),
  plansChecked: z.number().int(),
  workOrdersCreated: z.number().int(),
});
export type CarePlanRunResult = z.infer<typeof carePlanRunResult>;
