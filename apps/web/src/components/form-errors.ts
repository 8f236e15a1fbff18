// Puts the API's field errors (RFC 9457 `errors`) onto a react-hook-form form; returns what is left.
import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { ApiError } from '../lib/api-client.ts';
import { asSentence } from '../lib/format.ts';

export function applyServerErrors<T extends FieldValues>(
  err: unknown,
  setError: UseFormSetError<T>,
  known: readonly string[],
): string | null {
  if (!(err instanceof ApiError)) return 'Something went wrong. Try again.';
  const unplaced: string[] = [];
  for (const e of err.problem.errors ?? []) {
    const top = e.field.split('.')[0]!;
    if (known.includes(top)) setError(top as Path<T>, { type: 'server', message: e.message });
    else unplaced.push(`${e.field} ${e.message}`);
  }
  if (!err.problem.errors?.length) return err.message;
  return unplaced.length ? unplaced.join('; ') : null;
}

/** zod's messages read "must be …" after the field label. */
export function fieldMessage(message: string | undefined): string | undefined {
  return message ? asSentence(message) : undefined;
}
