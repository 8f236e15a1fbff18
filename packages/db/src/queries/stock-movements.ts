// Stock movements: every change to a stock, never edited, scoped by the tenant transaction. Listed newest first
// per part (stock_movements_tenant_part_idx) or per stock (its from and to partial indexes, merged).
import { and, desc, eq, inArray, sql, type SQL } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import type { Tx } from '../client.ts';
import { catalogueParts, stockLocations, stockMovements, users } from '../schema/index.ts';
import { currentTenant } from '../schema/rls.ts';
import { decodeCursor, encodeCursor, keysetWhere, type SortKey } from './keyset.ts';

export type StockMovementValues = Omit<typeof stockMovements.$inferInsert, 'tenantId' | 'id' | 'at'>;

/** Writes a movement; its id. */
export async function insertStockMovement(tx: Tx, values: StockMovementValues): Promise<string> {
  const [row] = await tx
    .insert(stockMovements)
    .values({ ...values, tenantId: sql`${currentTenant}` })
    .returning({ id: stockMovements.id });
  return row!.id;
}

const fromLocation = alias(stockLocations, 'from_location');
const toLocation = alias(stockLocations, 'to_location');

const movementColumns = {
  id: stockMovements.id,
  cataloguePartId: stockMovements.cataloguePartId,
  partNumber: catalogueParts.partNumber,
  description: catalogueParts.description,
  unit: catalogueParts.unit,
  reason: stockMovements.reason,
  fromLocationId: stockMovements.fromLocationId,
  fromLocationName: fromLocation.name,
  toLocationId: stockMovements.toLocationId,
  toLocationName: toLocation.name,
  quantity: stockMovements.quantity,
  expectedQuantity: stockMovements.expectedQuantity,
  countedQuantity: stockMovements.countedQuantity,
  difference: sql<number | null>`(${stockMovements.countedQuantity} - ${stockMovements.expectedQuantity})::float8`,
  unitCostCents: stockMovements.unitCostCents,
  serviceCallId: stockMovements.serviceCallId,
  workOrderId: stockMovements.workOrderId,
  benchJobId: stockMovements.benchJobId,
  note: stockMovements.note,
  at: stockMovements.at,
  byName: users.name,
};

/** Names and part of the given movements (a page's rows, or one just written), newest first. */
function describeMovements(tx: Tx, where: SQL) {
  return tx
    .select(movementColumns)
    .from(stockMovements)
    .innerJoin(
      catalogueParts,
      and(eq(catalogueParts.tenantId, stockMovements.tenantId), eq(catalogueParts.id, stockMovements.cataloguePartId)),
    )
    .leftJoin(fromLocation, and(eq(fromLocation.tenantId, stockMovements.tenantId), eq(fromLocation.id, stockMovements.fromLocationId)))
    .leftJoin(toLocation, and(eq(toLocation.tenantId, stockMovements.tenantId), eq(toLocation.id, stockMovements.toLocationId)))
    .leftJoin(users, eq(users.id, stockMovements.by))
    .where(and(eq(stockMovements.tenantId, currentTenant), where))
    .orderBy(desc(stockMovements.at), desc(stockMovements.id));
}

export async function getStockMovement(tx: Tx, id: string) {
  const [row] = await describeMovements(tx, eq(stockMovements.id, id));
  return row;
}

const atKey: SortKey = { expr: sql`${stockMovements.at}`, type: 'timestamptz' };

export interface MovementListParams {
  cataloguePartId?: string;
  locationId?: string;
  cursor?: string;
  limit: number;
}

/**
 * A page of movements, newest first, of one part or of one stock. The page's ids are picked from the movement
 * table's own index first (for a stock: the newest from it and the newest to it, merged — a movement never goes
 * from a stock to itself, so none is listed twice); names are joined for those rows only.
 */
export async function listStockMovements(tx: Tx, p: MovementListParams) {
  const after = keysetWhere(atKey, stockMovements.id, 'desc', decodeCursor(p.cursor));
  const pick = (filter: SQL) =>
    tx
      .select({ id: stockMovements.id, atText: sql<string>`${stockMovements.at}::text` })
      .from(stockMovements)
      .where(and(eq(stockMovements.tenantId, currentTenant), filter, after))
      .orderBy(desc(stockMovements.at), desc(stockMovements.id))
      .limit(p.limit + 1);
  let picked: { id: string; atText: string }[];
  if (p.cataloguePartId) {
    picked = await pick(eq(stockMovements.cataloguePartId, p.cataloguePartId));
  } else {
    const location = p.locationId!;
    const [out, into] = [
      await pick(sql`${stockMovements.fromLocationId} = ${location} and ${stockMovements.fromLocationId} is not null`),
      await pick(sql`${stockMovements.toLocationId} = ${location} and ${stockMovements.toLocationId} is not null`),
    ];
    picked = [...out, ...into]
      .sort((a, b) => (a.atText === b.atText ? (a.id < b.id ? 1 : -1) : a.atText < b.atText ? 1 : -1))
      .slice(0, p.limit + 1);
  }
  const page = picked.slice(0, p.limit);
  const last = page[page.length - 1];
  const nextCursor = picked.length > p.limit && last ? encodeCursor({ v: last.atText, id: last.id }) : null;
  if (page.length === 0) return { items: [], nextCursor };
  const items = await describeMovements(
    tx,
    inArray(
      stockMovements.id,
      page.map((r) => r.id),
    ),
  );
  return { items, nextCursor };
}
