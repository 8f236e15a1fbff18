import { z } from 'zod';

export const uuid = z.uuid({ error: 'must be an id' });
export const shortText = (max = 200) =>
  z
    .string()
    .trim()
    .max(max, { error: `must be at most ${max} characters` });
export const requiredText = (max = 200) => shortText(max).min(1, { error: 'is required' });

/** RFC 9457 problem details, with our field-level errors. */
export interface ProblemDetails {
  type: string;
  title: string;
  status: number;
  detail?: string;
  instance?: string;
  errors?: { field: string; message: string }[];
}

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

export interface Page<T> {
  items: T[];
  nextCursor: string | null;
}
