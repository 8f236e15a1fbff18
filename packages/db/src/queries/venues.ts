// Venue queries. Every function takes the tenant-scoped transaction: row-level security confines it
// to the current company, and the explicit tenant filters keep the indexes in play.
import { and, eq, inArray, isNull, sql, type SQL } from 'drizzle-orm';
import type { Tx } from '../client.ts';
import { games, venues } from '../schema/index.ts';
import { currentTenant } from '../schema/rls.ts';
import { decodeCursor, keysetOrder, keysetWhere, toPage, type SortKey } from './keyset.ts';
import { updateAtVersion } from './versioned-update.ts';

const sortKeys: Record<'name' | 'city' | 'createdAt', SortKey> = {
  name: { expr: sql`lower(${venues.name})`, type: 'text' },
  city: { expr: sql`lower(${venues.city})`, type: 'text' },
  createdAt: { expr: sql`${venues.createdAt}`, type: 'timestamptz' },
};

// Qualified by hand: inside a subquery drizzle would print bare column names that bind to the inner table.
const gameCount = sql<number>`(select count(*)::int from ${games} g where g.tenant_id = "venues"."tenant_id" and g.venue_id = "venues"."id" and g.retired_at is null)`;

export interface VenueListParams {
  q?: string;
  sort: keyof typeof sortKeys;
  order: 'asc' | 'desc';
  cursor?: string;
  limit: number;
  includeRetired?: boolean;
}

export async function listVenues(tx: Tx, p: VenueListParams) {
  const key = sortKeys[p.sort];
  const filters: (SQL | undefined)[] = [
    eq(venues.tenantId, currentTenant),
    p.includeRetired ? undefined : isNull(venues.retiredAt),
    p.q
      ? sql`(${venues.name} ilike ${`%${escapeLike(p.q)}%`} or ${venues.city} ilike ${`%${escapeLike(p.q)}%`} or ${venues.addressLine} ilike ${`%${escapeLike(p.q)}%`})`
      : undefined,
    keysetWhere(key, venues.id, p.order, decodeCursor(p.cursor)),
  ];
  const rows = await tx
    .select({ ...venueColumns, gameCount, sortValue: sql<string>`${key.expr}::text` })
    .from(venues)
    .where(and(...filters))
    .orderBy(...keysetOrder(key, venues.id, p.order))
    .limit(p.limit + 1);
  return toPage(rows, p.limit);
}

export async function getVenue(tx: Tx, id: string) {
  const [v] = await tx
    .select({ ...venueColumns, gameCount })
    .from(venues)
    .where(and(eq(venues.tenantId, currentTenant), eq(venues.id, id)));
  return v;
}

export async function insertVenue(tx: Tx, values: Omit<typeof venues.$inferInsert, 'tenantId'>) {
  const [v] = await tx
    .insert(venues)
    .values({ ...values, tenantId: sql`${currentTenant}` })
    .returning({ id: venues.id });
  return v!.id;
}

/** Applies the change only when the row is still at `version`; undefined when it moved on (or is gone). */
export async function updateVenue(tx: Tx, id: string, version: number, patch: Partial<typeof venues.$inferInsert>) {
  return (await updateAtVersion(tx, venues, id, version, patch))?.id;
}

/** Name and address of each of these venues (a venue contact's own), in no particular order. */
export async function listVenueSummaries(tx: Tx, ids: string[]) {
  if (ids.length === 0) return [];
  return tx
    .select({ id: venues.id, name: venues.name, addressLine: venues.addressLine, city: venues.city })
    .from(venues)
    .where(and(eq(venues.tenantId, currentTenant), inArray(venues.id, ids)));
}

export const venueColumns = {
  id: venues.id,
  name: venues.name,
  addressLine: venues.addressLine,
  city: venues.city,
  postcode: venues.postcode,
  latitude: venues.latitude,
  longitude: venues.longitude,
  openingHours: venues.openingHours,
  contactName: venues.contactName,
  contactPhone: venues.contactPhone,
  contactEmail: venues.contactEmail,
  notes: venues.notes,
  version: venues.version,
  createdAt: venues.createdAt,
  updatedAt: venues.updatedAt,
  retiredAt: venues.retiredAt,
};

export function escapeLike(s: string): string {
  return s.replace(/[\\%_]/g, (c) => `\\${c}`);
}
