// The parts catalogue: what the company buys and stocks (part number, kind, unit, cost, supplier), where each part
// is kept, and which parts-list entries it fits. Money is integer cents; the screen reads "$0.45" into cents.
import { z } from 'zod';
import { int4, isoDateTime, listQueryBase, pageOf, requiredText, rowVersion, shortText, uuid } from './common.ts';
import { partKinds } from './bench-vocabulary.ts';
import { stockLocationKinds, stockUnits } from './stock-vocabulary.ts';

export { partKindLabels, partKinds } from './bench-vocabulary.ts';
export { stockUnitLabels, stockUnits } from './stock-vocabulary.ts';

export const cataloguePartInput = z.strictObject({
  partNumber: requiredText(60),
  description: requiredText(200),
  kind: z.enum(partKinds, { error: 'must be one of the part kinds' }),
  unit: z.enum(stockUnits, { error: 'must be each, m, g or ml' }).default('each'),
  unitCostCents: int4().min(0, { error: 'must not be negative' }),
  supplier: shortText(120).default(''),
  notes: shortText(2000).default(''),
});
export type CataloguePartInput = z.input<typeof cataloguePartInput>;

/** An edit names the version it started from; a stale one is refused with the part as it now is (409). */
export const cataloguePartUpdate = cataloguePartInput.partial().extend({ version: rowVersion });
export type CataloguePartUpdate = z.input<typeof cataloguePartUpdate>;

export const catalogueSort = z.enum(['partNumber', 'description']);
export type CatalogueSort = z.infer<typeof catalogueSort>;
/**
 * The catalogue list: search part number and description, filter by kind. With `locationId` each part carries the
 * quantity held there (the parts-used picker shows the van's quantity); `inStockAt` keeps only parts held there.
 */
export const catalogueListQuery = listQueryBase.extend({
  sort: catalogueSort.default('partNumber'),
  kind: z.enum(partKinds, { error: 'must be one of the part kinds' }).optional(),
  locationId: uuid.optional(),
  inStockAt: uuid.optional(),
});
export type CatalogueListQuery = z.input<typeof catalogueListQuery>;

export const cataloguePart = z.strictObject({
  id: uuid,
  partNumber: z.string(),
  description: z.string(),
  kind: z.enum(partKinds),
  unit: z.enum(stockUnits),
  unitCostCents: z.number().int(),
  supplier: z.string(),
  notes: z.string(),
  version: z.number().int(),
  createdAt: isoDateTime,
  updatedAt: isoDateTime,
  retiredAt: isoDateTime.nullable(),
  /** Held across every stock. */
  totalQuantity: z.number(),
  /** Held at the list's `locationId` (null when the list named none). */
  quantityAt: z.number().nullable(),
});
export type CataloguePart = z.infer<typeof cataloguePart>;
export const cataloguePage = pageOf(cataloguePart);
export type CataloguePage = z.infer<typeof cataloguePage>;

/** One stock's holding of the part (the part page's "where it is kept"). */
export const partHolding = z.strictObject({
  locationId: uuid,
  locationName: z.string(),
  locationKind: z.enum(stockLocationKinds),
  quantity: z.number(),
  reorderPoint: z.number().nullable(),
  reorderQuantity: z.number().nullable(),
  countedAt: isoDateTime.nullable(),
  version: z.number().int(),
});
export type PartHolding = z.infer<typeof partHolding>;

/** A parts-list entry the part fits: the board (and its model) and the entry's designator and value. */
export const partFit = z.strictObject({
  boardPartId: uuid,
  boardId: uuid,
  boardName: z.string(),
  modelId: uuid,
  modelName: z.string(),
  designator: z.string(),
  kind: z.enum(partKinds),
  value: z.string(),
});
export type PartFit = z.infer<typeof partFit>;

/** The part page: the part, where it is kept, and what it fits. Movements are their own paged list. */
export const cataloguePartDetail = z.strictObject({
  part: cataloguePart,
  holdings: z.array(partHolding),
  fits: z.array(partFit),
});
export type CataloguePartDetail = z.infer<typeof cataloguePartDetail>;

/** Linking a catalogue part to a parts-list entry (POST /api/parts/:id/fits; DELETE …/fits/:boardPartId unlinks). */
export const partFitInput = z.strictObject({ boardPartId: uuid });
export type PartFitInput = z.input<typeof partFitInput>;
export const partFitList = z.strictObject({ items: z.array(partFit) });
export type PartFitList = z.infer<typeof partFitList>;

/**
 * GET /api/boards/:boardId/catalogue-fits (`boardId` is a model board, as in the parts lists): for each entry of
 * the board's parts list that has catalogue parts linked, those parts, with the quantity on the signed-in person's
 * van (null when they have no van). The stop screen and the bench job's parts-used picker read it.
 */
export const boardCatalogueFit = z.strictObject({
  boardPartId: uuid,
  designator: z.string(),
  cataloguePartId: uuid,
  partNumber: z.string(),
  description: z.string(),
  kind: z.enum(partKinds),
  unit: z.enum(stockUnits),
  unitCostCents: z.number().int(),
  vanQuantity: z.number().nullable(),
});
export type BoardCatalogueFit = z.infer<typeof boardCatalogueFit>;
export const boardCatalogueFitList = z.strictObject({ items: z.array(boardCatalogueFit) });
export type BoardCatalogueFitList = z.infer<typeof boardCatalogueFitList>;
