// The company's activity (audit) log: who changed what, newest first.
import { z } from 'zod';
import { isoDateTime } from './common.ts';

export const activityQuery = z.strictObject({
  entity: z.string().max(40).optional(),
  entityId: z.string().max(60).optional(),
  /** The id of the last entry already shown: the next page starts below it. */
  before: z.coerce.number().int().positive().max(Number.MAX_SAFE_INTEGER).optional(),
  limit: z.coerce.number().int().min(1).max(200).default(50),
});
export type ActivityQuery = z.input<typeof activityQuery>;

export const activityEntry = z.strictObject({
  id: z.number().int(),
  at: isoDateTime,
  action: z.string(),
  entity: z.string(),
  entityId: z.string(),
  /** Each changed field's value before and after. */
  changes: z.record(z.string(), z.strictObject({ from: z.unknown(), to: z.unknown() })),
  actorName: z.string().nullable(),
});
export type ActivityEntry = z.infer<typeof activityEntry>;

/** A page of entries; `nextBefore` is the `before` of the next page, null on the last. */
export const activityPage = z.strictObject({ items: z.array(activityEntry), nextBefore: z.number().int().nullable() });
export type ActivityPage = z.infer<typeof activityPage>;
