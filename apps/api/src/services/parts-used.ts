// Parts fitted on a service call or a work order: the parts_used row, its 'used' movement and the stock's decrement,
// in one transaction. The part comes off the person's own van unless the office names another stock; a technician
// takes only from their own van. A closed call or a done/skipped work order takes no more parts (409 naming `state`).
import type { Tx } from '@bumperline/db/client';
import { callStateGroups, type CallState } from '@bumperline/contracts/calls';
import type { PartsUsedInput } from '@bumperline/contracts/parts-used';
import {
  findCallForPartsUsed,
  findWorkOrderForPartsUsed,
  getPartUsed,
  insertPartUsed,
  listPartsUsed,
} from '@bumperline/db/queries/parts-used';
import { findStockLocationForMove } from '@bumperline/db/queries/stock-locations';
import { ensureVan } from './vans.ts';
import { locationForMove, partForMove, refuseUnlessOwnVan, useStock, type StockActor } from './stock-moves.ts';
import { Conflict, NotFound } from './workflow-errors.ts';

export type PartsUsedJob = { kind: 'call'; id: string } | { kind: 'workOrder'; id: string };

/** The job's game, or NotFound; Conflict naming `state` when it is closed. */
async function openJob(tx: Tx, job: PartsUsedJob): Promise<{ gameId: string }> {
  if (job.kind === 'call') {
    const call = await findCallForPartsUsed(tx, job.id);
    if (!call) throw new NotFound('call');
    if (!(callStateGroups.open as readonly CallState[]).includes(call.state)) {
      throw new Conflict('This call is closed: it takes no more parts.', undefined, [{ field: 'state', message: `is ${call.state}` }]);
    }
    return call;
  }
  const order = await findWorkOrderForPartsUsed(tx, job.id);
  if (!order) throw new NotFound('work order');
  if (order.state !== 'open') {
    throw new Conflict(`This work order is ${order.state}: it takes no more parts.`, undefined, [
      { field: 'state', message: `is ${order.state}` },
    ]);
  }
  return order;
}

/** The stock named, or the actor's own van (made on first use). */
async function sourceStock(tx: Tx, actor: StockActor, locationId: string | undefined) {
  if (locationId) return locationForMove(tx, locationId, 'locationId');
  const van = await ensureVan(tx, actor.userId);
  return (await findStockLocationForMove(tx, van.id))!;
}

export async function recordPartUsed(
  tx: Tx,
  actor: StockActor,
  job: PartsUsedJob,
  input: Omit<PartsUsedInput, 'quantity'> & { quantity: number },
) {
  const { gameId } = await openJob(tx, job);
  const part = await partForMove(tx, input.cataloguePartId);
  const location = await sourceStock(tx, actor, input.locationId);
  refuseUnlessOwnVan(actor, [location], 'A technician takes parts only from their own van.');
  const jobLink = job.kind === 'call' ? { serviceCallId: job.id } : { workOrderId: job.id };
  const movementId = await useStock(tx, actor, { part, location, quantity: input.quantity, job: jobLink });
  const id = await insertPartUsed(tx, {
    gameId,
    serviceCallId: job.kind === 'call' ? job.id : null,
    workOrderId: job.kind === 'workOrder' ? job.id : null,
    cataloguePartId: part.id,
    locationId: location.id,
    quantity: input.quantity,
    unitCostCents: part.unitCostCents,
    movementId,
    usedBy: actor.userId,
  });
  return (await getPartUsed(tx, id))!;
}

export async function partsUsedOn(tx: Tx, job: PartsUsedJob) {
  if (job.kind === 'call') {
    if (!(await findCallForPartsUsed(tx, job.id))) throw new NotFound('call');
    return { items: await listPartsUsed(tx, { serviceCallId: job.id }) };
  }
  if (!(await findWorkOrderForPartsUsed(tx, job.id))) throw new NotFound('work order');
  return { items: await listPartsUsed(tx, { workOrderId: job.id }) };
}
