// Deletes rate-limit counters whose window has passed. A counter is only read by the next hit on its
// key, so without this every address and e-mail ever counted would keep a row.
import type { Db } from '@bumperline/db/client';
import { deleteExpiredCounters } from '@bumperline/db/queries/rate-limits';

/** One pass; returns how many counters went. */
export function runRateLimitCleanupOnce(deps: { db: Db }): Promise<number> {
  return deleteExpiredCounters(deps.db);
}
