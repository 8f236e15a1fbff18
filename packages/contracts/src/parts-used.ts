// Parts fitted on a service call or a work order. Recording one takes it off a stock in the same transaction: the
// technician's own van by default, or a stock the office names. There is no delete and no negative use: a part that
// went back unused is transferred back to a stock (the movement says so).
//   POST /api/calls/:id/parts-used, POST /api/work-orders/:id/parts-used   body: partsUsedInput   → 201 partUsed
//   GET  /api/calls/:id/parts-used, GET  /api/work-orders/:id/parts-used                          → partsUsedList
// Refused: a closed call or a done/skipped work order (409 naming `state`); more than the stock holds (409 naming
// `quantity`, "only 3 on the van"); a fraction of a part counted `each` (400 naming `quantity`).
import { z } from 'zod';
import { isoDateTime, uuid } from './common.ts';
import { stockUnits } from './stock-vocabulary.ts';
import { movedQuantity } from './stock-quantity.ts';

export const partsUsedInput = z.strictObject({
  cataloguePartId: uuid,
  quantity: movedQuantity,
  /** The stock it came from; default: the signed-in person's van (created on first use). */
  locationId: uuid.optional(),
});
export type PartsUsedInput = z.input<typeof partsUsedInput>;

export const partUsed = z.strictObject({
  id: uuid,
  gameId: uuid,
  serviceCallId: uuid.nullable(),
  workOrderId: uuid.nullable(),
  cataloguePartId: uuid,
  partNumber: z.string(),
  description: z.string(),
  unit: z.enum(stockUnits),
  locationId: uuid,
  locationName: z.string(),
  quantity: z.number(),
  /** The part's cost when it was used (keep cost does not move when the catalogue's price does). */
  unitCostCents: z.number().int(),
  usedAt: isoDateTime,
  usedByName: z.string().nullable(),
});
export type PartUsed = z.infer<typeof partUsed>;
export const partsUsedList = z.strictObject({ items: z.array(partUsed) });
export type PartsUsedList = z.infer<typeof partsUsedList>;
