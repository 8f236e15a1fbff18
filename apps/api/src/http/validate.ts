import type { z } from 'zod';
import { ValidationError } from './errors.ts';

/** Parses input with a shared zod schema; on failure throws a 400 naming each bad field. */
export function parse<S extends z.ZodType>(schema: S, input: unknown): z.infer<S> {
  const result = schema.safeParse(input);
  if (result.success) return result.data;
  const errors = result.error.issues.flatMap((issue) => {
    // Unknown fields are reported one per field, by name.
    if (issue.code === 'unrecognized_keys') {
      return issue.keys.map((key) => ({
        field: [...issue.path, key].join('.'),
        message: 'is not a known field',
      }));
    }
    const field = issue.path.join('.') || '(body)';
    return [{ field, message: issue.message }];
  });
  throw new ValidationError(errors);
}
