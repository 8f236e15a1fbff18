import { z } from 'zod';

export const uuid = z.uuid({ error: 'must be an id' });
export const shortText = (max = 200) =>
  z
    .string()
    .trim()
    .max(max, { error: `must be at most ${max} characters` })
    // PostgreSQL text cannot hold NUL: refuse it here, beside the field, rather than fail in the database.
    .refine((s) => !s.includes('\u0000'), { error: 'must not contain a NUL character' });
export const requiredText = (max = 200) => shortText(max).min(1, { error: 'is required' });

/** PostgreSQL `integer` (int4): integer fields stay inside it, so a huge number is a 400, not a database error. */
export const INT4_MAX = 2_147_483_647;
export const int4 = () =>
  z
    .number({ error: 'must be a number' })
    .int({ error: 'must be a whole number' })
    .max(INT4_MAX, { error: `must be at most ${INT4_MAX}` });

/** The version an edit started from (optimistic concurrency). */
export const rowVersion = int4().min(1, { error: 'must be at least 1' });

/**
 * RFC 9457 problem details, with our field-level errors: what every refused request answers. Not strict:
 * the RFC allows extension members (a 409 carries the row as it now is in `current`).
 */
export const problemDetails = z.object({
  type: z.string(),
  title: z.string(),
  status: z.number().int(),
  detail: z.string().optional(),
  instance: z.string().optional(),
  errors: z.array(z.strictObject({ field: z.string(), message: z.string() })).optional(),
});
export type ProblemDetails = z.infer<typeof problemDetails>;

/** Query string of every list endpoint: search, sort, keyset cursor, page size. */
export const listQueryBase = z.strictObject({
  q: shortText(100).optional(),
  order: z.enum(['asc', 'desc']).default('asc'),
  cursor: z.string().max(500).optional(),
  limit: z.coerce.number().int().min(1).max(200).default(25),
  includeRetired: z
    .enum(['true', 'false'])
    .transform((v) => v === 'true')
    .optional(),
});

/** The response of a list endpoint: one page of `item`s and the cursor of the next page (null on the last). */
export const pageOf = <T extends z.ZodType>(item: T) => z.strictObject({ items: z.array(item), nextCursor: z.string().nullable() });

/** A moment as the API sends it: a Date becomes an ISO 8601 string in JSON (UTC, `Z`). */
export const isoDateTime = z.iso.datetime({ offset: true });
/** A calendar date as the API sends it (PostgreSQL `date`): YYYY-MM-DD. */
export const isoDate = z.iso.date({ error: 'must be a date as YYYY-MM-DD' });
