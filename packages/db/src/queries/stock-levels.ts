// What each stock holds, scoped by the tenant transaction. Quantities change only through these functions, each a
// single statement that locks the level row, and every caller writes the movement in the same transaction. The
// arithmetic happens in PostgreSQL's numeric, so 0.1 m + 0.2 m is exactly 0.3 m.
import { and, asc, desc, eq, inArray, isNull, lte, sql, type SQL } from 'drizzle-orm';
import type { Tx } from '../client.ts';
import { catalogueParts, stockLevels, stockLocations } from '../schema/index.ts';
import { currentTenant } from '../schema/rls.ts';
import { decodeCursor, keysetOrder, keysetWhere, toPage, type SortKey } from './keyset.ts';
import { escapeLike } from './venues.ts';

const levelColumns = {
  locationId: stockLevels.locationId,
  cataloguePartId: stockLevels.cataloguePartId,
  partNumber: catalogueParts.partNumber,
  description: catalogueParts.description,
  kind: catalogueParts.kind,
  unit: catalogueParts.unit,
  supplier: catalogueParts.supplier,
  quantity: stockLevels.quantity,
  reorderPoint: stockLevels.reorderPoint,
  reorderQuantity: stockLevels.reorderQuantity,
  low: sql<boolean>`coalesce(${stockLevels.quantity} <= ${stockLevels.reorderPoint}, false)`,
  countedAt: stockLevels.countedAt,
  version: stockLevels.version,
  updatedAt: stockLevels.updatedAt,
};

function selectLevels(tx: Tx) {
  return tx
    .select(levelColumns)
    .from(stockLevels)
    .innerJoin(catalogueParts, and(eq(catalogueParts.tenantId, stockLevels.tenantId), eq(catalogueParts.id, stockLevels.cataloguePartId)));
}

const partNumberKey: SortKey = { expr: sql`${catalogueParts.partNumber}`, type: 'text' };

export interface LevelListParams {
  q?: string;
  order: 'asc' | 'desc';
  cursor?: string;
  limit: number;
  low?: boolean;
}

/** One stock's levels by part number (keyset), from the level's primary key (tenant, location, part). */
export async function listStockLevels(tx: Tx, locationId: string, p: LevelListParams) {
  const like = p.q ? `%${escapeLike(p.q)}%` : undefined;
  const filters: (SQL | undefined)[] = [
    eq(stockLevels.tenantId, currentTenant),
    eq(stockLevels.locationId, locationId),
    p.low ? lte(stockLevels.quantity, sql`${stockLevels.reorderPoint}`) : undefined,
    like ? sql`(${catalogueParts.partNumber} ilike ${like} or ${catalogueParts.description} ilike ${like})` : undefined,
    keysetWhere(partNumberKey, catalogueParts.id, p.order, decodeCursor(p.cursor)),
  ];
  const rows = await tx
    .select({ ...levelColumns, id: catalogueParts.id, sortValue: sql<string>`${catalogueParts.partNumber}` })
    .from(stockLevels)
    .innerJoin(catalogueParts, and(eq(catalogueParts.tenantId, stockLevels.tenantId), eq(catalogueParts.id, stockLevels.cataloguePartId)))
    .where(and(...filters))
    .orderBy(...keysetOrder(partNumberKey, catalogueParts.id, p.order))
    .limit(p.limit + 1);
  const page = toPage(rows, p.limit);
  return { items: page.items.map(({ id: _id, ...level }) => level), nextCursor: page.nextCursor };
}

/** Every level of one stock that holds something or is watched (a van: a few dozen rows), by part number. */
export function listAllLevelsAt(tx: Tx, locationId: string) {
  return selectLevels(tx)
    .where(
      and(
        eq(stockLevels.tenantId, currentTenant),
        eq(stockLevels.locationId, locationId),
        sql`(${stockLevels.quantity} > 0 or ${stockLevels.reorderPoint} is not null)`,
      ),
    )
    .orderBy(asc(catalogueParts.partNumber), asc(catalogueParts.id));
}

/** The levels of one part at these stocks (after a change: what it now holds). */
export function getLevelsOfPart(tx: Tx, cataloguePartId: string, locationIds: string[]) {
  return selectLevels(tx).where(
    and(
      eq(stockLevels.tenantId, currentTenant),
      eq(stockLevels.cataloguePartId, cataloguePartId),
      inArray(stockLevels.locationId, locationIds),
    ),
  );
}

/** Where a part is kept (stock_levels_tenant_part_idx), with each stock's name and kind. */
export function listHoldingsOfPart(tx: Tx, cataloguePartId: string) {
  return tx
    .select({
      locationId: stockLevels.locationId,
      locationName: stockLocations.name,
      locationKind: stockLocations.kind,
      quantity: stockLevels.quantity,
      reorderPoint: stockLevels.reorderPoint,
      reorderQuantity: stockLevels.reorderQuantity,
      countedAt: stockLevels.countedAt,
      version: stockLevels.version,
    })
    .from(stockLevels)
    .innerJoin(stockLocations, and(eq(stockLocations.tenantId, stockLevels.tenantId), eq(stockLocations.id, stockLevels.locationId)))
    .where(and(eq(stockLevels.tenantId, currentTenant), eq(stockLevels.cataloguePartId, cataloguePartId)))
    .orderBy(desc(stockLocations.kind), asc(stockLocations.name));
}

/** What the stock holds of the part now (0 when it holds none). */
export async function quantityAt(tx: Tx, locationId: string, cataloguePartId: string): Promise<number> {
  const [row] = await tx
    .select({ quantity: stockLevels.quantity })
    .from(stockLevels)
    .where(
      and(
        eq(stockLevels.tenantId, currentTenant),
        eq(stockLevels.locationId, locationId),
        eq(stockLevels.cataloguePartId, cataloguePartId),
      ),
    );
  return row?.quantity ?? 0;
}

/** Adds to a stock (creating the level at first receipt); the new quantity. */
export async function addToLevel(tx: Tx, locationId: string, cataloguePartId: string, quantity: number): Promise<number> {
  const [row] = await tx
    .insert(stockLevels)
    .values({ tenantId: sql`${currentTenant}`, locationId, cataloguePartId, quantity })
    .onConflictDoUpdate({
      target: [stockLevels.tenantId, stockLevels.locationId, stockLevels.cataloguePartId],
      set: {
        quantity: sql`${stockLevels.quantity} + excluded.quantity`,
        version: sql`${stockLevels.version} + 1`,
        updatedAt: sql`now()`,
      },
    })
    .returning({ quantity: stockLevels.quantity });
  return row!.quantity;
}

/**
 * Takes from a stock only while it holds enough: one conditional UPDATE, which locks the row, so of two takes of the
 * last part the second re-reads the row after the first commits and finds too few. The new quantity, or undefined
 * when the stock holds less than `quantity` (or none at all).
 */
export async function takeFromLevel(tx: Tx, locationId: string, cataloguePartId: string, quantity: number): Promise<number | undefined> {
  const [row] = await tx
    .update(stockLevels)
    .set({ quantity: sql`${stockLevels.quantity} - ${quantity}`, version: sql`${stockLevels.version} + 1`, updatedAt: sql`now()` })
    .where(
      and(
        eq(stockLevels.tenantId, currentTenant),
        eq(stockLevels.locationId, locationId),
        eq(stockLevels.cataloguePartId, cataloguePartId),
        sql`${stockLevels.quantity} >= ${quantity}`,
      ),
    )
    .returning({ quantity: stockLevels.quantity });
  return row?.quantity;
}

/**
 * Sets a stock to what was counted; what it said before (read under the row lock, so a use in between is not
 * lost from the record). Creates the level when the part was not kept there.
 */
export async function setCountedLevel(tx: Tx, locationId: string, cataloguePartId: string, counted: number): Promise<number> {
  await tx
    .insert(stockLevels)
    .values({ tenantId: sql`${currentTenant}`, locationId, cataloguePartId, quantity: 0 })
    .onConflictDoNothing();
  const [before] = await tx
    .select({ quantity: stockLevels.quantity })
    .from(stockLevels)
    .where(
      and(
        eq(stockLevels.tenantId, currentTenant),
        eq(stockLevels.locationId, locationId),
        eq(stockLevels.cataloguePartId, cataloguePartId),
      ),
    )
    .for('update');
  await tx
    .update(stockLevels)
    .set({ quantity: counted, countedAt: sql`now()`, version: sql`${stockLevels.version} + 1`, updatedAt: sql`now()` })
    .where(
      and(
        eq(stockLevels.tenantId, currentTenant),
        eq(stockLevels.locationId, locationId),
        eq(stockLevels.cataloguePartId, cataloguePartId),
      ),
    );
  return before!.quantity;
}

/**
 * Sets a level's reorder point and quantity. With `version`: only while the level is still at it (false when it
 * moved on or is gone). Without: creates the level at 0 (false when it already exists — the caller must name its version).
 */
export async function setLevelReorder(
  tx: Tx,
  locationId: string,
  cataloguePartId: string,
  settings: { reorderPoint: number | null; reorderQuantity: number | null },
  version: number | undefined,
): Promise<boolean> {
  if (version === undefined) {
    const rows = await tx
      .insert(stockLevels)
      .values({ tenantId: sql`${currentTenant}`, locationId, cataloguePartId, quantity: 0, ...settings })
      .onConflictDoNothing()
      .returning({ v: stockLevels.version });
    return rows.length > 0;
  }
  const rows = await tx
    .update(stockLevels)
    .set({ ...settings, version: sql`${stockLevels.version} + 1`, updatedAt: sql`now()` })
    .where(
      and(
        eq(stockLevels.tenantId, currentTenant),
        eq(stockLevels.locationId, locationId),
        eq(stockLevels.cataloguePartId, cataloguePartId),
        eq(stockLevels.version, version),
      ),
    )
    .returning({ v: stockLevels.version });
  return rows.length > 0;
}

/**
 * Every level at or below its reorder point (the partial index stock_levels_tenant_reorder_idx holds only those),
 * in active stocks and for parts still in the catalogue, with what the order needs.
 */
export function listLowLevels(tx: Tx) {
  return tx
    .select({
      locationId: stockLevels.locationId,
      locationName: stockLocations.name,
      cataloguePartId: stockLevels.cataloguePartId,
      partNumber: catalogueParts.partNumber,
      description: catalogueParts.description,
      unit: catalogueParts.unit,
      supplier: catalogueParts.supplier,
      unitCostCents: catalogueParts.unitCostCents,
      quantity: stockLevels.quantity,
      reorderPoint: sql<number>`${stockLevels.reorderPoint}`.mapWith(Number),
      reorderQuantity: stockLevels.reorderQuantity,
    })
    .from(stockLevels)
    .innerJoin(catalogueParts, and(eq(catalogueParts.tenantId, stockLevels.tenantId), eq(catalogueParts.id, stockLevels.cataloguePartId)))
    .innerJoin(stockLocations, and(eq(stockLocations.tenantId, stockLevels.tenantId), eq(stockLocations.id, stockLevels.locationId)))
    .where(
      and(
        eq(stockLevels.tenantId, currentTenant),
        sql`${stockLevels.quantity} <= ${stockLevels.reorderPoint}`,
        isNull(catalogueParts.retiredAt),
        isNull(stockLocations.retiredAt),
      ),
    )
    .orderBy(asc(catalogueParts.supplier), asc(catalogueParts.partNumber), asc(stockLocations.name));
}
