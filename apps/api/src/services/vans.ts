// Technicians' vans: one each, made when the technician first needs one (a transfer to it, a part used from it)
// or when the office adds it.
import type { Tx } from '@bumperline/db/client';
import { findVanOf, insertVanFor } from '@bumperline/db/queries/stock-locations';

/** The person's van, made now if they have none (named after them). */
export async function ensureVan(tx: Tx, userId: string) {
  const existing = await findVanOf(tx, userId);
  if (existing) return existing;
  await insertVanFor(tx, userId);
  // Another request may have made it at the same moment: the unique index kept one, and this reads it.
  return (await findVanOf(tx, userId))!;
}
