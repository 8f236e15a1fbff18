import type { Request } from 'express';
import { NotFoundError } from './errors.ts';

/** An id as our tables issue them (a UUID). */
export const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** The :id path parameter; anything that is not an id cannot name a row, so it is simply not found. */
export function idParam(req: Request, name = 'id'): string {
  const id = req.params[name];
  if (typeof id !== 'string' || !UUID.test(id)) throw new NotFoundError();
  return id;
}
