// Stocks (warehouses and technicians' vans), what each holds, every movement, and what to order. Quantities are
// numbers in the part's unit: whole for `each`, up to three decimals for m, g and ml (checked against the part).
import { z } from 'zod';
import { isoDateTime, listQueryBase, pageOf, requiredText, rowVersion, shortText, uuid, int4 } from './common.ts';
import { partKinds } from './bench-vocabulary.ts';
import { stockLocationKinds, stockMovementReasons, stockUnits } from './stock-vocabulary.ts';
import { heldQuantity, movedQuantity } from './stock-quantity.ts';

export { stockLocationKinds, stockMovementReasonLabels, stockMovementReasons, stockUnitLabels } from './stock-vocabulary.ts';
export { MAX_STOCK_QUANTITY } from './stock-quantity.ts';

/** A new stock: a warehouse by name, or a technician's van (one each; the name defaults to "<name>'s van"). */
export const stockLocationInput = z.strictObject({
  kind: z.enum(stockLocationKinds, { error: 'must be warehouse or van' }),
  name: shortText(80).default(''),
  /** Required for a van, refused for a warehouse. */
  technicianId: uuid.optional(),
});
export type StockLocationInput = z.input<typeof stockLocationInput>;

export const stockLocationUpdate = z.strictObject({ name: requiredText(80) });
export type StockLocationUpdate = z.input<typeof stockLocationUpdate>;

export const stockLocation = z.strictObject({
  id: uuid,
  kind: z.enum(stockLocationKinds),
  name: z.string(),
  technicianId: uuid.nullable(),
  technicianName: z.string().nullable(),
  createdAt: isoDateTime,
  retiredAt: isoDateTime.nullable(),
  /** Parts held here (quantity above zero). */
  partCount: z.number().int(),
  /** Parts at or below their reorder point here. */
  lowCount: z.number().int(),
});
export type StockLocation = z.infer<typeof stockLocation>;
export const stockLocationList = z.strictObject({ items: z.array(stockLocation) });
export type StockLocationList = z.infer<typeof stockLocationList>;

/** One part held at one stock. */
export const stockLevel = z.strictObject({
  locationId: uuid,
  cataloguePartId: uuid,
  partNumber: z.string(),
  description: z.string(),
  kind: z.enum(partKinds),
  unit: z.enum(stockUnits),
  supplier: z.string(),
  quantity: z.number(),
  /** At or below this the part is on the list to order; null: not watched here. */
  reorderPoint: z.number().nullable(),
  reorderQuantity: z.number().nullable(),
  /** True when a reorder point is set and the quantity is at or below it. */
  low: z.boolean(),
  countedAt: isoDateTime.nullable(),
  version: z.number().int(),
  updatedAt: isoDateTime,
});
export type StockLevel = z.infer<typeof stockLevel>;
export const stockLevelPage = pageOf(stockLevel);
export type StockLevelPage = z.infer<typeof stockLevelPage>;

/** A stock's levels, by part number; `low` keeps only the parts at or below their reorder point. */
export const stockLevelListQuery = listQueryBase.extend({
  low: z
    .enum(['true', 'false'])
    .transform((v) => v === 'true')
    .optional(),
});
export type StockLevelListQuery = z.input<typeof stockLevelListQuery>;

/**
 * Setting a part's reorder point and quantity at a stock (PUT /api/stock/locations/:id/levels/:partId).
 * `version` is the level's version; omit it when the part is not kept there yet (the level is created at 0).
 */
export const stockLevelSettings = z.strictObject({
  reorderPoint: heldQuantity.nullable(),
  reorderQuantity: movedQuantity.nullable(),
  version: rowVersion.optional(),
});
export type StockLevelSettings = z.input<typeof stockLevelSettings>;

/** Received from a supplier into a stock (stock:manage). `unitCostCents` is what was paid; default: the catalogue's. */
export const stockReceiveInput = z.strictObject({
  cataloguePartId: uuid,
  locationId: uuid,
  quantity: movedQuantity,
  unitCostCents: int4().min(0, { error: 'must not be negative' }).optional(),
  note: shortText(500).default(''),
});
export type StockReceiveInput = z.input<typeof stockReceiveInput>;

/** Moved from one stock to another (stock:move; a technician only to or from their own van). */
export const stockTransferInput = z.strictObject({
  cataloguePartId: uuid,
  fromLocationId: uuid,
  toLocationId: uuid,
  quantity: movedQuantity,
  note: shortText(500).default(''),
});
export type StockTransferInput = z.input<typeof stockTransferInput>;

/** A count: what is really there. The stock is set to it and the movement keeps what it said before. */
export const stockCountInput = z.strictObject({
  cataloguePartId: uuid,
  locationId: uuid,
  countedQuantity: heldQuantity,
  note: shortText(500).default(''),
});
export type StockCountInput = z.input<typeof stockCountInput>;

export const stockMovement = z.strictObject({
  id: uuid,
  cataloguePartId: uuid,
  partNumber: z.string(),
  description: z.string(),
  unit: z.enum(stockUnits),
  reason: z.enum(stockMovementReasons),
  fromLocationId: uuid.nullable(),
  fromLocationName: z.string().nullable(),
  toLocationId: uuid.nullable(),
  toLocationName: z.string().nullable(),
  /** For a count: how far the count moved the stock (|counted − expected|); otherwise what moved. */
  quantity: z.number(),
  expectedQuantity: z.number().nullable(),
  countedQuantity: z.number().nullable(),
  /** counted − expected (negative: fewer than the stock said); null unless counted. */
  difference: z.number().nullable(),
  unitCostCents: z.number().int(),
  serviceCallId: uuid.nullable(),
  workOrderId: uuid.nullable(),
  benchJobId: uuid.nullable(),
  note: z.string(),
  at: isoDateTime,
  byName: z.string().nullable(),
});
export type StockMovement = z.infer<typeof stockMovement>;
export const stockMovementPage = pageOf(stockMovement);
export type StockMovementPage = z.infer<typeof stockMovementPage>;

/** Movements newest first, of one part or of one stock (exactly one of the two). */
export const stockMovementListQuery = z
  .strictObject({
    cataloguePartId: uuid.optional(),
    locationId: uuid.optional(),
    cursor: z.string().max(500).optional(),
    limit: z.coerce.number().int().min(1).max(200).default(25),
  })
  .refine((q) => (q.cataloguePartId === undefined) !== (q.locationId === undefined), {
    error: 'name a part or a stock, not both',
    path: ['cataloguePartId'],
  });
export type StockMovementListQuery = z.input<typeof stockMovementListQuery>;

/** What a receive, transfer or count answers: its movement and the levels it changed, as they now are. */
export const stockChange = z.strictObject({ movement: stockMovement, levels: z.array(stockLevel) });
export type StockChange = z.infer<typeof stockChange>;

/** The signed-in person's van (null until they have one) and everything on it. */
export const myVan = z.strictObject({ location: stockLocation.nullable(), levels: z.array(stockLevel) });
export type MyVan = z.infer<typeof myVan>;

/** One line of what to order: a part at a stock at or below its reorder point. */
export const reorderLine = z.strictObject({
  locationId: uuid,
  locationName: z.string(),
  cataloguePartId: uuid,
  partNumber: z.string(),
  description: z.string(),
  unit: z.enum(stockUnits),
  quantity: z.number(),
  reorderPoint: z.number(),
  /** How many to order (the level's reorder quantity; when unset, enough to reach one above the reorder point). */
  orderQuantity: z.number(),
  unitCostCents: z.number().int(),
  /** orderQuantity × unit cost, rounded to the cent. */
  lineCostCents: z.number().int(),
});
export type ReorderLine = z.infer<typeof reorderLine>;
/** What to order, grouped by supplier ('' = no supplier named), each with its total. */
export const reorderList = z.strictObject({
  groups: z.array(z.strictObject({ supplier: z.string(), lines: z.array(reorderLine), totalCents: z.number().int() })),
});
export type ReorderList = z.infer<typeof reorderList>;
