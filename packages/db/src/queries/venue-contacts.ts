// Which people speak for a venue (venue contacts see that venue's games and calls in the venue view).
import { and, eq, sql } from 'drizzle-orm';
import type { Tx } from '../client.ts';
import { memberships, users, venueContacts, venues } from '../schema/index.ts';
import { currentTenant } from '../schema/rls.ts';

export async function listVenueContacts(tx: Tx, venueId: string) {
  return tx
    .select({ userId: users.id, name: users.name, email: users.email })
    .from(venueContacts)
    .innerJoin(users, eq(users.id, venueContacts.userId))
    .where(and(eq(venueContacts.tenantId, currentTenant), eq(venueContacts.venueId, venueId)))
    .orderBy(users.name);
}

/** Members of the company whose role is venue contact: the people who can be linked to a venue. */
export async function listVenueContactMembers(tx: Tx) {
  return tx
    .select({ userId: users.id, name: users.name, email: users.email })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.tenantId, currentTenant), eq(memberships.role, 'venue_contact')))
    .orderBy(users.name);
}

export async function linkVenueContact(tx: Tx, venueId: string, userId: string) {
  await tx
    .insert(venueContacts)
    .values({ tenantId: sql`${currentTenant}`, venueId, userId })
    .onConflictDoNothing();
}

export async function unlinkVenueContact(tx: Tx, venueId: string, userId: string) {
  const r = await tx
    .delete(venueContacts)
    .where(and(eq(venueContacts.tenantId, currentTenant), eq(venueContacts.venueId, venueId), eq(venueContacts.userId, userId)))
    .returning({ userId: venueContacts.userId });
  return r.length > 0;
}

/** E-mail addresses of a venue's contacts (people linked to it, and the venue's own contact address). */
export async function venueContactEmails(tx: Tx, venueId: string): Promise<string[]> {
  const linked = await tx
    .select({ email: users.email })
    .from(venueContacts)
    .innerJoin(users, eq(users.id, venueContacts.userId))
    .where(and(eq(venueContacts.tenantId, currentTenant), eq(venueContacts.venueId, venueId)));
  const [v] = await tx
    .select({ email: venues.contactEmail })
    .from(venues)
    .where(and(eq(venues.tenantId, currentTenant), eq(venues.id, venueId)));
  return [...new Set([...linked.map((l) => l.email.toLowerCase()), ...(v?.email ? [v.email.toLowerCase()] : [])])];
}

export async function venueIdsOfContact(tx: Tx, userId: string): Promise<string[]> {
  const rows = await tx
    .select({ venueId: venueContacts.venueId })
    .from(venueContacts)
    .where(and(eq(venueContacts.tenantId, currentTenant), eq(venueContacts.userId, userId)));
  return rows.map((r) => r.venueId);
}
