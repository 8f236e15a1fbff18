// A game's meters (which it has, where each rolls over), the readings taken of them, and what the game has cost to
// keep running (keep cost). Words are in care-vocabulary.ts.
import { z } from 'zod';
import { meterKinds, meterReadingSources } from './care-vocabulary.ts';
import { personRef } from './care-plans.ts';
import { isoDateTime, uuid } from './common.ts';

export { meterKinds, meterKindLabels, meterReadingSources } from './care-vocabulary.ts';
export type { MeterKind, MeterReadingSource } from './care-vocabulary.ts';

/** The largest count a meter holds here (twelve digits); a reading past it is a typing slip. */
export const METER_MAX = 999_999_999_999;

const meterKind = z.enum(meterKinds, { error: `must be one of ${meterKinds.join(', ')}` });

export const gameMeter = z.strictObject({
  meter: meterKind,
  /** The count at which it wraps to zero (1,000,000 for six digits); null if it never does. */
  rollsOverAt: z
    .number({ error: 'must be a number' })
    .int({ error: 'must be a whole number' })
    .min(1, { error: 'must be at least 1' })
    .max(METER_MAX + 1, { error: 'is too large for a meter' })
    .nullable(),
});
export type GameMeter = z.infer<typeof gameMeter>;

/** GET and PUT /api/games/:id/meters: the whole set (a meter left out is removed; its readings stay). */
export const gameMeterList = z.strictObject({
  items: z
    .array(gameMeter)
    .max(meterKinds.length)
    .refine((ms) => new Set(ms.map((m) => m.meter)).size === ms.length, { error: 'lists a meter twice' }),
});
export type GameMeterList = z.infer<typeof gameMeterList>;

/**
 * POST /api/games/:id/meter-readings. Lower than the last reading is refused (naming `reading`) unless the game's
 * meter rolls over and `rolledOver` is true. Recording a reading makes the care plans covering the game look again.
 */
export const meterReadingInput = z.strictObject({
  meter: meterKind,
  reading: z
    .number({ error: 'must be a number' })
    .int({ error: 'must be a whole number' })
    .min(0, { error: 'must not be negative' })
    .max(METER_MAX, { error: 'is too large for a meter' }),
  rolledOver: z.boolean().default(false),
});
export type MeterReadingInput = z.input<typeof meterReadingInput>;

export const meterReading = z.strictObject({
  id: uuid,
  gameId: uuid,
  meter: z.enum(meterKinds),
  reading: z.number().int(),
  rolledOver: z.boolean(),
  source: z.enum(meterReadingSources),
  workOrderId: uuid.nullable(),
  readAt: isoDateTime,
  readBy: personRef.nullable(),
});
export type MeterReading = z.infer<typeof meterReading>;

/** GET /api/games/:id/meter-readings/latest: the newest reading of each meter the game has been read on. */
export const latestMeterReadings = z.strictObject({ items: z.array(meterReading) });
export type LatestMeterReadings = z.infer<typeof latestMeterReadings>;

/** GET /api/games/:id/keep-cost: parts at cost and labour at the company's rate over the last 12 months. */
export const gameKeepCost = z.strictObject({
  gameId: uuid,
  since: isoDateTime,
  currency: z.string(),
  jobs: z.number().int(),
  partsCents: z.number().int(),
  labourMinutes: z.number().int(),
  labourCents: z.number().int(),
  totalCents: z.number().int(),
});
export type GameKeepCost = z.infer<typeof gameKeepCost>;
