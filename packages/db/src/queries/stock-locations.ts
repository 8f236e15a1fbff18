// Stocks: the company's warehouses and its technicians' vans (at most one each), scoped by the tenant transaction.
import { and, asc, desc, eq, isNull, sql } from 'drizzle-orm';
import type { Tx } from '../client.ts';
import { stockLevels, stockLocations, users } from '../schema/index.ts';
import { currentTenant } from '../schema/rls.ts';

type LocationKind = (typeof stockLocations.$inferSelect)['kind'];

// Counted per page row by sub-selects on the level's primary key (tenant, location, part): a company has few stocks.
const partCount = sql<number>`(select count(*)::int from ${stockLevels} l where l.tenant_id = "stock_locations"."tenant_id" and l.location_id = "stock_locations"."id" and l.quantity > 0)`;
const lowCount = sql<number>`(select count(*)::int from ${stockLevels} l where l.tenant_id = "stock_locations"."tenant_id" and l.location_id = "stock_locations"."id" and l.quantity <= l.reorder_point)`;

const locationColumns = {
  id: stockLocations.id,
  kind: stockLocations.kind,
  name: stockLocations.name,
  technicianId: stockLocations.technicianId,
  technicianName: users.name,
  createdAt: stockLocations.createdAt,
  retiredAt: stockLocations.retiredAt,
  partCount,
  lowCount,
};

function selectLocations(tx: Tx) {
  return tx.select(locationColumns).from(stockLocations).leftJoin(users, eq(users.id, stockLocations.technicianId));
}

/** Warehouses first, then vans (kind descending: "warehouse" > "van"), each by name. */
export function listStockLocations(tx: Tx, includeRetired = false) {
  return selectLocations(tx)
    .where(and(eq(stockLocations.tenantId, currentTenant), includeRetired ? undefined : isNull(stockLocations.retiredAt)))
    .orderBy(desc(stockLocations.kind), asc(stockLocations.name), asc(stockLocations.id));
}

export async function getStockLocation(tx: Tx, id: string) {
  const [row] = await selectLocations(tx).where(and(eq(stockLocations.tenantId, currentTenant), eq(stockLocations.id, id)));
  return row;
}

/** The technician's van (retired or not), if they have one. */
export async function findVanOf(tx: Tx, technicianId: string) {
  const [row] = await selectLocations(tx).where(
    and(eq(stockLocations.tenantId, currentTenant), eq(stockLocations.technicianId, technicianId)),
  );
  return row;
}

/** Kind, technician and whether it is retired: what a stock change needs to know about a stock. */
export async function findStockLocationForMove(tx: Tx, id: string) {
  const [row] = await tx
    .select({
      id: stockLocations.id,
      kind: stockLocations.kind,
      name: stockLocations.name,
      technicianId: stockLocations.technicianId,
      retiredAt: stockLocations.retiredAt,
    })
    .from(stockLocations)
    .where(and(eq(stockLocations.tenantId, currentTenant), eq(stockLocations.id, id)));
  return row;
}

/** The new stock's id; for a van, undefined when the technician already has one (the unique index decides). */
export async function insertStockLocation(
  tx: Tx,
  values: { kind: LocationKind; name: string; technicianId: string | null },
): Promise<string | undefined> {
  const [row] = await tx
    .insert(stockLocations)
    .values({ ...values, tenantId: sql`${currentTenant}` })
    .onConflictDoNothing()
    .returning({ id: stockLocations.id });
  return row?.id;
}

export async function updateStockLocation(tx: Tx, id: string, patch: { name?: string; retiredAt?: Date | null }): Promise<boolean> {
  const rows = await tx
    .update(stockLocations)
    .set(patch)
    .where(and(eq(stockLocations.tenantId, currentTenant), eq(stockLocations.id, id)))
    .returning({ id: stockLocations.id });
  return rows.length > 0;
}

/** Makes the person's van, named after them ("Dana Reyes's van"); nothing when they already have one. */
export async function insertVanFor(tx: Tx, userId: string): Promise<void> {
  await tx
    .insert(stockLocations)
    .values({
      tenantId: sql`${currentTenant}`,
      kind: 'van',
      technicianId: userId,
      name: sql`(select ${users.name} || '''s van' from ${users} where ${users.id} = ${userId})`,
    })
    .onConflictDoNothing();
}
