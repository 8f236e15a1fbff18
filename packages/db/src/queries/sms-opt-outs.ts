// Numbers that asked for no more texts (carrier rules, across every company): the outbox blocks them.
import { eq } from 'drizzle-orm';
import type { Db, Tx } from '../client.ts';
import { smsOptOuts } from '../schema/index.ts';

/** The number texted STOP (again): kept, with the time of its latest STOP. */
export async function optOut(db: Db, phone: string): Promise<void> {
  await db
    .insert(smsOptOuts)
    .values({ phone })
    .onConflictDoUpdate({ target: smsOptOuts.phone, set: { optedOutAt: new Date() } });
}

/** The provider refused to text the number because it opted out: recorded, if we did not know yet. */
export async function recordProviderOptOut(tx: Tx, phone: string): Promise<void> {
  await tx.insert(smsOptOuts).values({ phone }).onConflictDoNothing();
}

/** The number texted START: it may be texted again. */
export async function optIn(db: Db, phone: string): Promise<void> {
  await db.delete(smsOptOuts).where(eq(smsOptOuts.phone, phone));
}
