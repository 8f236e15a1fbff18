// Every change to a stock: received from a supplier, moved between stocks, counted, or taken off for a job. Each
// is one level change and its movement row in the caller's transaction. Stock never goes below zero: the take is a
// conditional update that locks the level (so of two uses of the last part exactly one passes), and should anything
// else reach the database's CHECK, it is answered the same way, never as a 500.
import type { Tx } from '@bumperline/db/client';
import { findCataloguePartForMove } from '@bumperline/db/queries/catalogue-parts';
import { findStockLocationForMove } from '@bumperline/db/queries/stock-locations';
import { addToLevel, getLevelsOfPart, quantityAt, setCountedLevel, takeFromLevel } from '@bumperline/db/queries/stock-levels';
import { getStockMovement, insertStockMovement, type StockMovementValues } from '@bumperline/db/queries/stock-movements';
import type { Role } from '@bumperline/contracts/roles';
import { checkStockQuantity, type StockUnitName } from '@bumperline/domain/stock/quantity-rules';
import { DomainError } from '@bumperline/domain/errors';
import { Conflict, InvalidInput, NotAllowed } from './workflow-errors.ts';

export interface StockActor {
  userId: string;
  role: Role;
}

type Part = NonNullable<Awaited<ReturnType<typeof findCataloguePartForMove>>>;
type Location = NonNullable<Awaited<ReturnType<typeof findStockLocationForMove>>>;

/** The catalogue part, for a move; 400 naming `field` when it is not in this company's catalogue or is retired. */
export async function partForMove(tx: Tx, id: string, field = 'cataloguePartId', allowRetired = false): Promise<Part> {
  const part = await findCataloguePartForMove(tx, id);
  if (!part) throw new InvalidInput([{ field, message: 'is not a part in the catalogue' }]);
  if (part.retiredAt && !allowRetired) throw new InvalidInput([{ field, message: 'is retired from the catalogue' }]);
  return part;
}

/** The stock, for a move; 400 naming `field` when it is not one of this company's or is retired. */
export async function locationForMove(tx: Tx, id: string, field: string): Promise<Location> {
  const location = await findStockLocationForMove(tx, id);
  if (!location) throw new InvalidInput([{ field, message: 'is not one of the company’s stocks' }]);
  if (location.retiredAt) throw new InvalidInput([{ field, message: 'is retired' }]);
  return location;
}

/** The quantity rule for the part's unit (whole numbers for parts counted each), as a 400 naming the field. */
export function checkQuantity(unit: StockUnitName, quantity: number, field = 'quantity', allowZero = false): void {
  try {
    checkStockQuantity(unit, quantity, field, allowZero);
  } catch (err) {
    if (err instanceof DomainError) throw new InvalidInput([{ field: err.field ?? field, message: err.message }]);
    throw err;
  }
}

/** A technician moves stock only to, from or at their own van. */
export function refuseUnlessOwnVan(actor: StockActor, locations: Location[], message: string): void {
  if (actor.role !== 'technician') return;
  if (!locations.some((l) => l.kind === 'van' && l.technicianId === actor.userId)) throw new NotAllowed(message);
}

function held(location: Pick<Location, 'kind' | 'name'>, quantity: number, unit: StockUnitName): string {
  const amount = unit === 'each' ? String(quantity) : `${quantity} ${unit}`;
  return location.kind === 'van' ? `only ${amount} on the van` : `only ${amount} at ${location.name}`;
}

/** 409 naming `quantity`: the stock holds less than asked for. */
async function tooFew(tx: Tx, location: Location, part: Part): Promise<Conflict> {
  const have = await quantityAt(tx, location.id, part.id);
  const message = held(location, have, part.unit);
  return new Conflict(`Not enough in stock: ${message}.`, { quantity: have }, [{ field: 'quantity', message }]);
}

/** True for the database refusing a level below zero (stock_levels_quantity_check), at any depth of causes. */
function isBelowZeroCheck(err: unknown): boolean {
  for (let e: unknown = err, depth = 0; e && depth < 4; e = (e as { cause?: unknown }).cause, depth++) {
    const { code, constraint } = e as { code?: string; constraint?: string };
    if (code === '23514' && constraint === 'stock_levels_quantity_check') return true;
  }
  return false;
}

/**
 * Takes `quantity` of the part off the stock, or refuses with 409 naming `quantity` ("only 3 on the van"). The
 * level's row is locked by the update until the transaction ends.
 */
export async function takeOff(tx: Tx, location: Location, part: Part, quantity: number): Promise<void> {
  let left: number | undefined;
  try {
    left = await takeFromLevel(tx, location.id, part.id, quantity);
  } catch (err) {
    if (isBelowZeroCheck(err))
      throw new Conflict(`Not enough in stock.`, undefined, [{ field: 'quantity', message: 'more than the stock holds' }]);
    throw err;
  }
  if (left === undefined) throw await tooFew(tx, location, part);
}

async function answer(tx: Tx, movementId: string, partId: string, locationIds: string[]) {
  const [movement, levels] = await Promise.all([getStockMovement(tx, movementId), getLevelsOfPart(tx, partId, locationIds)]);
  return { movement: movement!, levels };
}

async function record(tx: Tx, actor: StockActor, values: Omit<StockMovementValues, 'by'>) {
  return insertStockMovement(tx, { ...values, by: actor.userId });
}

export async function receiveStock(
  tx: Tx,
  actor: StockActor,
  input: { cataloguePartId: string; locationId: string; quantity: number; unitCostCents?: number | undefined; note: string },
) {
  const part = await partForMove(tx, input.cataloguePartId);
  const location = await locationForMove(tx, input.locationId, 'locationId');
  checkQuantity(part.unit, input.quantity);
  await addToLevel(tx, location.id, part.id, input.quantity);
  const id = await record(tx, actor, {
    cataloguePartId: part.id,
    reason: 'received',
    toLocationId: location.id,
    quantity: input.quantity,
    unitCostCents: input.unitCostCents ?? part.unitCostCents,
    note: input.note,
  });
  return answer(tx, id, part.id, [location.id]);
}

export async function transferStock(
  tx: Tx,
  actor: StockActor,
  input: { cataloguePartId: string; fromLocationId: string; toLocationId: string; quantity: number; note: string },
) {
  if (input.fromLocationId === input.toLocationId) {
    throw new InvalidInput([{ field: 'toLocationId', message: 'must be another stock than the one it comes from' }]);
  }
  const part = await partForMove(tx, input.cataloguePartId);
  const from = await locationForMove(tx, input.fromLocationId, 'fromLocationId');
  const to = await locationForMove(tx, input.toLocationId, 'toLocationId');
  refuseUnlessOwnVan(actor, [from, to], 'A technician moves stock only to or from their own van.');
  checkQuantity(part.unit, input.quantity);
  await takeOff(tx, from, part, input.quantity);
  await addToLevel(tx, to.id, part.id, input.quantity);
  const id = await record(tx, actor, {
    cataloguePartId: part.id,
    reason: 'transfer',
    fromLocationId: from.id,
    toLocationId: to.id,
    quantity: input.quantity,
    unitCostCents: part.unitCostCents,
    note: input.note,
  });
  return answer(tx, id, part.id, [from.id, to.id]);
}

/** Sets the stock to what was counted; the movement keeps what the stock said, so the difference shows. */
export async function countStock(
  tx: Tx,
  actor: StockActor,
  input: { cataloguePartId: string; locationId: string; countedQuantity: number; note: string },
) {
  const part = await partForMove(tx, input.cataloguePartId, 'cataloguePartId', true);
  const location = await locationForMove(tx, input.locationId, 'locationId');
  refuseUnlessOwnVan(actor, [location], 'A technician counts only their own van.');
  checkQuantity(part.unit, input.countedQuantity, 'countedQuantity', true);
  const expected = await setCountedLevel(tx, location.id, part.id, input.countedQuantity);
  const id = await record(tx, actor, {
    cataloguePartId: part.id,
    reason: 'counted',
    toLocationId: location.id,
    quantity: Math.abs(Math.round((input.countedQuantity - expected) * 1000) / 1000),
    expectedQuantity: expected,
    countedQuantity: input.countedQuantity,
    unitCostCents: part.unitCostCents,
    note: input.note,
  });
  return answer(tx, id, part.id, [location.id]);
}

/**
 * Takes a part off a stock for a job and writes the 'used' movement; the movement's id. The caller has checked
 * the job and who may take from the stock.
 */
export async function useStock(
  tx: Tx,
  actor: StockActor,
  p: {
    part: Part;
    location: Location;
    quantity: number;
    job: { serviceCallId?: string; workOrderId?: string; benchJobId?: string };
    note?: string;
  },
): Promise<string> {
  checkQuantity(p.part.unit, p.quantity);
  await takeOff(tx, p.location, p.part, p.quantity);
  return record(tx, actor, {
    cataloguePartId: p.part.id,
    reason: 'used',
    fromLocationId: p.location.id,
    quantity: p.quantity,
    unitCostCents: p.part.unitCostCents,
    serviceCallId: p.job.serviceCallId ?? null,
    workOrderId: p.job.workOrderId ?? null,
    benchJobId: p.job.benchJobId ?? null,
    note: p.note ?? '',
  });
}
