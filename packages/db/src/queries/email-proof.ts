// Opening a link we mailed proves the person reads mail at the address. The first proof marks the
// address verified and ends every session. Unless the link is the sign-up's own confirmation, which
// vouches for the password chosen at that sign-up, it also drops a password set before then: whoever
// chose it never showed they own the address (they may have signed up with someone else's).
import { and, eq, isNull, sql } from 'drizzle-orm';
import type { Db, Tx } from '../client.ts';
import { users } from '../schema/index.ts';
import { revokeAllSessionsOf } from './identity.ts';

/** Records the proof; true when it was the address's first. */
export async function recordEmailProof(db: Db | Tx, userId: string, opts: { keepPassword: boolean }): Promise<boolean> {
  const [first] = await db
    .update(users)
    .set({ emailVerifiedAt: sql`now()`, ...(opts.keepPassword ? {} : { passwordHash: null }) })
    .where(and(eq(users.id, userId), isNull(users.emailVerifiedAt)))
    .returning({ id: users.id });
  if (!first) return false;
  await revokeAllSessionsOf(db, userId);
  return true;
}
