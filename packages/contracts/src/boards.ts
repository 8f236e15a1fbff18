// Boards fitted in games (serial, date code as printed, last recap), every reading taken on their parts, the
// cabinet's temperature through the day, and when each board is due for a recap.
import { z } from 'zod';
import { readingVerdicts, benchJobStates, recapStatuses, RECAP_FLEET_MAX_PAGE, RECAP_FLEET_PAGE } from './bench-vocabulary.ts';
import { isoDate, isoDateTime, pageOf, rowVersion, shortText, uuid } from './common.ts';
import { partRow } from './parts-lists.ts';

// ---- A board in a game ----

export const boardInstanceInput = z.strictObject({
  /** Which of the model's boards this is. */
  boardId: uuid,
  serial: shortText(60).default(''),
  /** As printed on the board ("8934", "1989-W34"); read by the domain with the company's today. */
  dateCode: shortText(40).default(''),
  lastRecapOn: isoDate.nullable().default(null),
  notes: shortText(2000).default(''),
});
export type BoardInstanceInput = z.input<typeof boardInstanceInput>;

export const boardInstanceUpdate = boardInstanceInput.omit({ boardId: true }).partial().extend({ version: rowVersion });
export type BoardInstanceUpdate = z.input<typeof boardInstanceUpdate>;

export { recapStatuses, type RecapStatus } from './bench-vocabulary.ts';

/** When a board wants its electrolytics replaced, and why. */
export const recapEstimate = z.strictObject({
  status: z.enum(recapStatuses),
  /** What the clock runs from: the last recap, or the date the date code reads as; null when neither is known. */
  countedFrom: z.enum(['last-recap', 'date-code']).nullable(),
  countedFromDate: isoDate.nullable(),
  dueDate: isoDate.nullable(),
  lifeYears: z.number().nullable(),
  /** Whole months until due: 0 or less when overdue. */
  monthsUntilDue: z.number().int().nullable(),
  /** The electrolytic that sets the date, and its rating as the trade says it ("85 °C, 2,000 h"). */
  limitingDesignator: z.string().nullable(),
  limitingRating: z.string().nullable(),
  message: z.string(),
  /** What to do about it, when overdue (or when the date code needs settling). */
  recommendation: z.string().nullable(),
  /** True when the game has no cabinet profile of its own and our assumed day was used. */
  defaultProfile: z.boolean(),
});
export type RecapEstimate = z.infer<typeof recapEstimate>;

export const boardInstance = z.strictObject({
  id: uuid,
  boardId: uuid,
  boardName: z.string(),
  boardPartNumber: z.string(),
  model: z.strictObject({ id: uuid, maker: z.string(), title: z.string() }),
  /** The game it is in, and how people name it ("Comet Carnival · LT-010000"); null on the shelf. */
  gameId: uuid.nullable(),
  gameLabel: z.string().nullable(),
  serial: z.string(),
  dateCode: z.string(),
  madeOn: isoDate.nullable(),
  /** Why the date code gives no date (it reads two ways); a person settles it, nobody guesses. */
  dateCodeFlag: z.string().nullable(),
  lastRecapOn: isoDate.nullable(),
  notes: z.string(),
  version: z.number().int(),
  createdAt: isoDateTime,
  updatedAt: isoDateTime,
  recap: recapEstimate,
});
export type BoardInstance = z.infer<typeof boardInstance>;

/** A board of the game's model that can be fitted (for the "Add board" form). */
export const fittableBoard = z.strictObject({ id: uuid, name: z.string(), partNumber: z.string() });
export type FittableBoard = z.infer<typeof fittableBoard>;

/** The boards in a game, and the model's boards one may add. */
export const gameBoards = z.strictObject({
  items: z.array(boardInstance),
  modelBoards: z.array(fittableBoard),
});
export type GameBoards = z.infer<typeof gameBoards>;

// ---- The board's page: its parts list with every reading ----

export const partReadingPoint = z.strictObject({
  id: uuid,
  takenAt: isoDateTime,
  measuredText: z.string(),
  measured: z.number().nullable(),
  unit: z.string().nullable(),
  verdict: z.enum(readingVerdicts),
  min: z.number().nullable(),
  max: z.number().nullable(),
  deviationPercent: z.number().nullable(),
  indicative: z.boolean(),
  inCircuit: z.boolean(),
  benchJobId: uuid.nullable(),
});
export type PartReadingPoint = z.infer<typeof partReadingPoint>;

export const boardPartHistory = partRow.omit({ id: true, notes: true }).extend({
  partId: uuid,
  /** Taken off the parts list since; kept because readings were taken on it. */
  removed: z.boolean(),
  /** Oldest first. */
  readings: z.array(partReadingPoint),
});
export type BoardPartHistory = z.infer<typeof boardPartHistory>;

export const boardBenchJob = z.strictObject({
  id: uuid,
  templateName: z.string(),
  state: z.enum(benchJobStates),
  openedAt: isoDateTime,
  finishedAt: isoDateTime.nullable(),
});
export type BoardBenchJob = z.infer<typeof boardBenchJob>;

export const boardPage = z.strictObject({
  instance: boardInstance,
  parts: z.array(boardPartHistory),
  /** Newest first. */
  benchJobs: z.array(boardBenchJob),
});
export type BoardPage = z.infer<typeof boardPage>;

// ---- A cabinet's temperature through the day ----

/** Inside a coin-op cabinet in a bar: from an unheated winter room to a sunny window with hot lamps (common practice). */
export const CABINET_MIN_C = -10;
export const CABINET_MAX_C = 70;

export const cabinetSlice = z.strictObject({
  hours: z
    .number({ error: 'must be a number of hours' })
    .gt(0, { error: 'must be more than 0 h' })
    .max(24, { error: 'must be at most 24 h' }),
  temperatureC: z
    .number({ error: 'must be a temperature in °C' })
    .min(CABINET_MIN_C, { error: `must be a cabinet temperature between ${CABINET_MIN_C} °C and ${CABINET_MAX_C} °C` })
    .max(CABINET_MAX_C, { error: `must be a cabinet temperature between ${CABINET_MIN_C} °C and ${CABINET_MAX_C} °C` }),
});
export type CabinetSliceInput = z.infer<typeof cabinetSlice>;

export const cabinetProfileInput = z
  .strictObject({
    slices: z.array(cabinetSlice).min(1, { error: 'give at least one stretch of hours powered' }).max(24, { error: 'at most 24 lines' }),
  })
  .superRefine((v, ctx) => {
    const total = v.slices.reduce((sum, s) => sum + s.hours, 0);
    if (total > 24) {
      ctx.addIssue({ code: 'custom', path: ['slices'], message: `add up to ${total} h powered a day: a day has 24 hours` });
    }
  });
export type CabinetProfileInput = z.input<typeof cabinetProfileInput>;

export const cabinetProfile = z.strictObject({
  gameId: uuid,
  slices: z.array(z.strictObject({ hours: z.number(), temperatureC: z.number() })),
  hoursPerDay: z.number(),
  /** No profile of its own: these are our assumed slices. */
  isDefault: z.boolean(),
  updatedAt: isoDateTime.nullable(),
});
export type CabinetProfile = z.infer<typeof cabinetProfile>;

// ---- The fleet's recap list ----

export const recapFleetQuery = z.strictObject({
  status: z.enum(recapStatuses).optional(),
  /** Where the previous page ended in the ranking (the `nextCursor` it answered). */
  cursor: z.string().max(500, { error: 'is not a cursor this list gave' }).optional(),
  limit: z.coerce
    .number({ error: 'must be a number' })
    .int({ error: 'must be a whole number' })
    .min(1, { error: 'must be at least 1' })
    .max(RECAP_FLEET_MAX_PAGE, { error: `must be at most ${RECAP_FLEET_MAX_PAGE}` })
    .default(RECAP_FLEET_PAGE),
});
export type RecapFleetQuery = z.input<typeof recapFleetQuery>;

export const recapFleetRow = z.strictObject({
  boardInstanceId: uuid,
  boardName: z.string(),
  boardPartNumber: z.string(),
  serial: z.string(),
  dateCode: z.string(),
  gameId: uuid.nullable(),
  gameLabel: z.string().nullable(),
  venueId: uuid.nullable(),
  venueName: z.string().nullable(),
  recap: recapEstimate,
});
export type RecapFleetRow = z.infer<typeof recapFleetRow>;

/** One page of the ranking (overdue first, then by remaining life; boards whose date cannot be worked out last). */
export const recapFleet = pageOf(recapFleetRow).extend({
  /** The company's today the list was worked out for. */
  asOf: isoDate,
  /** Every board of the company by status, before the filter and the paging (0 for a status with none). */
  counts: z.record(z.enum(recapStatuses), z.number().int()),
});
export type RecapFleet = z.infer<typeof recapFleet>;
