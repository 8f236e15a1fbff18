// Idempotency-Key on changes: a phone queues each change with a key made when it was queued, and a flaky
// connection may deliver it twice. The first delivery applies the change and records its answer in the same
// transaction; a repeat gets the recorded answer and changes nothing.
//
// What is recorded: only answers of changes that committed (2xx). A refusal (400, 404, 409…) rolls the
// transaction back, the key with it, so the phone may re-send the same change — for a 409, re-based on the
// version the office has now — under the same key, and a delivery of the first attempt can never apply later.
import type { Request } from 'express';
import type { Tx } from '@bumperline/db/client';
import { claimChangeKey, findAppliedChange, forgetOldChanges, recordChangeAnswer } from '@bumperline/db/queries/applied-changes';
import { ConflictError, ValidationError } from './errors.ts';

export const IDEMPOTENCY_HEADER = 'Idempotency-Key';
/** Marks an answer replayed from the record rather than made now. */
export const REPLAYED_HEADER = 'Idempotent-Replayed';
/** Keys are kept this long; a queued change is sent within hours, not weeks. */
export const KEEP_KEYS_DAYS = 30;

const KEY_SHAPE = /^[A-Za-z0-9_-]{8,100}$/;
const CHANGING = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

/** The request's key, if it is a change that carries one; a malformed key is a 400 naming the header. */
export function idempotencyKeyOf(req: Request): string | undefined {
  if (!CHANGING.has(req.method)) return undefined;
  const key = req.get(IDEMPOTENCY_HEADER);
  if (key === undefined) return undefined;
  if (!KEY_SHAPE.test(key)) {
    throw new ValidationError([{ field: IDEMPOTENCY_HEADER, message: 'must be 8 to 100 letters, digits, "-" or "_"' }]);
  }
  return key;
}

export interface Answer {
  status: number;
  body: unknown;
}

/**
 * Runs `change` once per key inside the request's transaction `tx`: the key is claimed first (a concurrent
 * duplicate waits on it), the answer stored after. Returns the answer to send and whether it was replayed.
 */
export async function applyOnce(
  tx: Tx,
  req: Request,
  who: { userId: string },
  key: string,
  change: () => Promise<Answer>,
): Promise<Answer & { replayed: boolean }> {
  const path = req.originalUrl.split('?')[0] ?? req.path;
  if (!(await claimChangeKey(tx, { key, userId: who.userId, method: req.method, path }))) {
    const applied = await findAppliedChange(tx, key);
    if (!applied || applied.userId !== who.userId || applied.method !== req.method || applied.path !== path) {
      // Another person's key, or the same key on another change: never replay someone else's answer.
      throw new ConflictError('This Idempotency-Key was already used for another change.', undefined, [
        { field: IDEMPOTENCY_HEADER, message: 'was already used for another change; make a new key for each change' },
      ]);
    }
    return { status: applied.status, body: applied.body, replayed: true };
  }
  await forgetOldChanges(tx, KEEP_KEYS_DAYS);
  const answer = await change();
  await recordChangeAnswer(tx, key, answer);
  return { ...answer, replayed: false };
}
