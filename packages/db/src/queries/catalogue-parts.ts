// The parts catalogue, scoped by the caller's tenant transaction: list (search, kind, keyset by part number or
// description), one part, create and versioned update, and the parts-list entries each part fits.
import { and, asc, eq, isNull, sql, type SQL } from 'drizzle-orm';
import type { Tx } from '../client.ts';
import { boardParts, catalogueParts, gameModels, modelBoards, partFits, stockLevels } from '../schema/index.ts';
import { currentTenant } from '../schema/rls.ts';
import { decodeCursor, keysetOrder, keysetWhere, toPage, type SortKey } from './keyset.ts';
import { updateAtVersion } from './versioned-update.ts';
import { escapeLike } from './venues.ts';

type PartKindValue = (typeof catalogueParts.$inferSelect)['kind'];
type UnitValue = (typeof catalogueParts.$inferSelect)['unit'];

const sortKeys = {
  // The raw part number, so the list reads catalogue_parts_tenant_number_idx in order.
  partNumber: { expr: sql`${catalogueParts.partNumber}`, type: 'text' },
  description: { expr: sql`lower(${catalogueParts.description})`, type: 'text' },
} satisfies Record<string, SortKey>;

// Sub-selects PostgreSQL runs only for the page's rows, after the sort and limit (qualified by hand: inside a
// subquery drizzle would print bare column names that bind to the inner table).
const totalQuantity = sql<number>`(select coalesce(sum(l.quantity), 0)::float8 from ${stockLevels} l where l.tenant_id = "catalogue_parts"."tenant_id" and l.catalogue_part_id = "catalogue_parts"."id")`;
const quantityAtLocation = (locationId: string | undefined) =>
  locationId
    ? sql<
        number | null
      >`(select coalesce((select l.quantity::float8 from ${stockLevels} l where l.tenant_id = "catalogue_parts"."tenant_id" and l.location_id = ${locationId} and l.catalogue_part_id = "catalogue_parts"."id"), 0))`
    : sql<number | null>`null::float8`;

export const cataloguePartColumns = {
  id: catalogueParts.id,
  partNumber: catalogueParts.partNumber,
  description: catalogueParts.description,
  kind: catalogueParts.kind,
  unit: catalogueParts.unit,
  unitCostCents: catalogueParts.unitCostCents,
  supplier: catalogueParts.supplier,
  notes: catalogueParts.notes,
  version: catalogueParts.version,
  createdAt: catalogueParts.createdAt,
  updatedAt: catalogueParts.updatedAt,
  retiredAt: catalogueParts.retiredAt,
};

export interface CatalogueListParams {
  q?: string;
  sort: keyof typeof sortKeys;
  order: 'asc' | 'desc';
  cursor?: string;
  limit: number;
  includeRetired?: boolean;
  kind?: PartKindValue;
  /** Show the quantity held at this stock. */
  locationId?: string;
  /** Keep only parts held (above zero) at this stock. */
  inStockAt?: string;
}

export async function listCatalogueParts(tx: Tx, p: CatalogueListParams) {
  const key = sortKeys[p.sort];
  const like = p.q ? `%${escapeLike(p.q)}%` : undefined;
  const filters: (SQL | undefined)[] = [
    eq(catalogueParts.tenantId, currentTenant),
    p.includeRetired ? undefined : isNull(catalogueParts.retiredAt),
    p.kind ? eq(catalogueParts.kind, p.kind) : undefined,
    like ? sql`(${catalogueParts.partNumber} ilike ${like} or ${catalogueParts.description} ilike ${like})` : undefined,
    p.inStockAt
      ? sql`exists (select 1 from ${stockLevels} l where l.tenant_id = "catalogue_parts"."tenant_id" and l.location_id = ${p.inStockAt} and l.catalogue_part_id = "catalogue_parts"."id" and l.quantity > 0)`
      : undefined,
    keysetWhere(key, catalogueParts.id, p.order, decodeCursor(p.cursor)),
  ];
  const rows = await tx
    .select({
      ...cataloguePartColumns,
      totalQuantity,
      quantityAt: quantityAtLocation(p.locationId),
      sortValue: sql<string>`${key.expr}::text`,
    })
    .from(catalogueParts)
    .where(and(...filters))
    .orderBy(...keysetOrder(key, catalogueParts.id, p.order))
    .limit(p.limit + 1);
  return toPage(rows, p.limit);
}

export async function getCataloguePart(tx: Tx, id: string) {
  const [part] = await tx
    .select({ ...cataloguePartColumns, totalQuantity, quantityAt: quantityAtLocation(undefined) })
    .from(catalogueParts)
    .where(and(eq(catalogueParts.tenantId, currentTenant), eq(catalogueParts.id, id)));
  return part;
}

/** The part's row locked against a concurrent change of its unit or cost while stock moves. */
export async function findCataloguePartForMove(tx: Tx, id: string) {
  const [part] = await tx
    .select({
      id: catalogueParts.id,
      unit: catalogueParts.unit,
      unitCostCents: catalogueParts.unitCostCents,
      retiredAt: catalogueParts.retiredAt,
    })
    .from(catalogueParts)
    .where(and(eq(catalogueParts.tenantId, currentTenant), eq(catalogueParts.id, id)))
    .for('share');
  return part;
}

export interface CataloguePartFields {
  partNumber: string;
  description: string;
  kind: PartKindValue;
  unit: UnitValue;
  unitCostCents: number;
  supplier: string;
  notes: string;
}

/** The new part's id, or undefined when the part number is already in the catalogue (any case). */
export async function insertCataloguePart(tx: Tx, values: CataloguePartFields): Promise<string | undefined> {
  const [row] = await tx
    .insert(catalogueParts)
    .values({ ...values, tenantId: sql`${currentTenant}` })
    .onConflictDoNothing()
    .returning({ id: catalogueParts.id });
  return row?.id;
}

/** Another part of the company with this part number (any case), for a clear message before the unique index says so. */
export async function findCataloguePartByNumber(tx: Tx, partNumber: string) {
  const [row] = await tx
    .select({ id: catalogueParts.id })
    .from(catalogueParts)
    .where(and(eq(catalogueParts.tenantId, currentTenant), sql`lower(${catalogueParts.partNumber}) = lower(${partNumber})`));
  return row?.id;
}

/** Applies the change only at `version`; undefined when the part moved on (or is gone). */
export async function updateCataloguePart(
  tx: Tx,
  id: string,
  version: number,
  patch: Partial<CataloguePartFields> & { retiredAt?: Date | null },
) {
  return (await updateAtVersion(tx, catalogueParts, id, version, patch))?.id;
}

const fitColumns = {
  boardPartId: boardParts.id,
  boardId: modelBoards.id,
  boardName: modelBoards.name,
  modelId: gameModels.id,
  modelName: sql<string>`${gameModels.maker} || ' ' || ${gameModels.title}`,
  designator: boardParts.designator,
  kind: boardParts.kind,
  value: boardParts.value,
};

/** The parts-list entries (still on their list) a catalogue part fits, by model, board and list order. */
export function listFitsOfPart(tx: Tx, cataloguePartId: string) {
  return tx
    .select(fitColumns)
    .from(partFits)
    .innerJoin(boardParts, and(eq(boardParts.tenantId, partFits.tenantId), eq(boardParts.id, partFits.boardPartId)))
    .innerJoin(modelBoards, and(eq(modelBoards.tenantId, boardParts.tenantId), eq(modelBoards.id, boardParts.boardId)))
    .innerJoin(gameModels, and(eq(gameModels.tenantId, modelBoards.tenantId), eq(gameModels.id, modelBoards.modelId)))
    .where(and(eq(partFits.tenantId, currentTenant), eq(partFits.cataloguePartId, cataloguePartId), isNull(boardParts.removedAt)))
    .orderBy(asc(gameModels.maker), asc(gameModels.title), asc(modelBoards.name), asc(boardParts.position));
}

/** A parts-list entry still on its list (undefined when it is not, or is another company's). */
export async function findBoardPartForFit(tx: Tx, boardPartId: string) {
  const [row] = await tx
    .select({ id: boardParts.id })
    .from(boardParts)
    .where(and(eq(boardParts.tenantId, currentTenant), eq(boardParts.id, boardPartId), isNull(boardParts.removedAt)));
  return row?.id;
}

/** Links the part to the entry (linking twice is a no-op). */
export async function linkPartFit(tx: Tx, cataloguePartId: string, boardPartId: string): Promise<void> {
  await tx
    .insert(partFits)
    .values({ tenantId: sql`${currentTenant}`, cataloguePartId, boardPartId })
    .onConflictDoNothing();
}

/** True when there was a link to remove. */
export async function unlinkPartFit(tx: Tx, cataloguePartId: string, boardPartId: string): Promise<boolean> {
  const removed = await tx
    .delete(partFits)
    .where(and(eq(partFits.tenantId, currentTenant), eq(partFits.cataloguePartId, cataloguePartId), eq(partFits.boardPartId, boardPartId)))
    .returning({ id: partFits.boardPartId });
  return removed.length > 0;
}

/**
 * For a model board's parts list: each entry's linked catalogue parts (not retired), with the quantity at `vanId`
 * (null without a van). Read from the board's parts (part_fits_tenant_board_part_idx per entry).
 */
export function listCatalogueFitsOfBoard(tx: Tx, boardId: string, vanId: string | null) {
  const vanQuantity = vanId
    ? sql<number>`coalesce((select l.quantity::float8 from ${stockLevels} l where l.tenant_id = ${partFits.tenantId} and l.location_id = ${vanId} and l.catalogue_part_id = ${catalogueParts.id}), 0)`
    : sql<number | null>`null::float8`;
  return tx
    .select({
      boardPartId: boardParts.id,
      designator: boardParts.designator,
      cataloguePartId: catalogueParts.id,
      partNumber: catalogueParts.partNumber,
      description: catalogueParts.description,
      kind: catalogueParts.kind,
      unit: catalogueParts.unit,
      unitCostCents: catalogueParts.unitCostCents,
      vanQuantity,
    })
    .from(boardParts)
    .innerJoin(partFits, and(eq(partFits.tenantId, boardParts.tenantId), eq(partFits.boardPartId, boardParts.id)))
    .innerJoin(catalogueParts, and(eq(catalogueParts.tenantId, partFits.tenantId), eq(catalogueParts.id, partFits.cataloguePartId)))
    .where(
      and(
        eq(boardParts.tenantId, currentTenant),
        eq(boardParts.boardId, boardId),
        isNull(boardParts.removedAt),
        isNull(catalogueParts.retiredAt),
      ),
    )
    .orderBy(asc(boardParts.position), asc(catalogueParts.partNumber));
}

/** True when the model board exists in this company. */
export async function modelBoardExists(tx: Tx, boardId: string): Promise<boolean> {
  const [row] = await tx
    .select({ id: modelBoards.id })
    .from(modelBoards)
    .where(and(eq(modelBoards.tenantId, currentTenant), eq(modelBoards.id, boardId)));
  return !!row;
}
