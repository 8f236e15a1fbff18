// Stocks: the office adds warehouses and vans (one van per technician), renames and retires them; a technician
// reads their own van.
import type { Tx } from '@bumperline/db/client';
import type { StockLocationInput } from '@bumperline/contracts/stock';
import { getMember } from '@bumperline/db/queries/team';
import {
  findVanOf,
  getStockLocation,
  insertStockLocation,
  insertVanFor,
  updateStockLocation,
} from '@bumperline/db/queries/stock-locations';
import { listAllLevelsAt } from '@bumperline/db/queries/stock-levels';
import { recordAudit } from '@bumperline/db/queries/audit';
import { InvalidInput, NotFound } from './workflow-errors.ts';

export async function createStockLocation(
  tx: Tx,
  input: { kind: StockLocationInput['kind']; name: string; technicianId?: string | undefined },
  actorUserId: string,
) {
  let id: string | undefined;
  if (input.kind === 'warehouse') {
    if (input.technicianId) throw new InvalidInput([{ field: 'technicianId', message: 'is only for a van' }]);
    if (!input.name) throw new InvalidInput([{ field: 'name', message: 'is required' }]);
    id = await insertStockLocation(tx, { kind: 'warehouse', name: input.name, technicianId: null });
  } else {
    if (!input.technicianId) throw new InvalidInput([{ field: 'technicianId', message: 'is required for a van' }]);
    const member = await getMember(tx, input.technicianId);
    if (!member || member.role === 'venue_contact') {
      throw new InvalidInput([{ field: 'technicianId', message: 'is not a member of the company who could drive a van' }]);
    }
    if (await findVanOf(tx, input.technicianId)) throw new InvalidInput([{ field: 'technicianId', message: 'already has a van' }]);
    if (input.name) id = await insertStockLocation(tx, { kind: 'van', name: input.name, technicianId: input.technicianId });
    else {
      await insertVanFor(tx, input.technicianId);
      id = (await findVanOf(tx, input.technicianId))?.id;
    }
    if (!id) throw new InvalidInput([{ field: 'technicianId', message: 'already has a van' }]);
  }
  const location = (await getStockLocation(tx, id!))!;
  await recordAudit(tx, { actorUserId, action: 'create', entity: 'stock_location', entityId: location.id, after: location });
  return location;
}

export async function renameStockLocation(tx: Tx, id: string, name: string, actorUserId: string) {
  const before = await getStockLocation(tx, id);
  if (!before) throw new NotFound('stock');
  await updateStockLocation(tx, id, { name });
  const after = (await getStockLocation(tx, id))!;
  await recordAudit(tx, { actorUserId, action: 'update', entity: 'stock_location', entityId: id, before, after });
  return after;
}

/** Retiring keeps the stock and its movements; it leaves the lists and takes no more moves. */
export async function retireStockLocation(tx: Tx, id: string, actorUserId: string) {
  const before = await getStockLocation(tx, id);
  if (!before) throw new NotFound('stock');
  if (before.retiredAt) return before;
  await updateStockLocation(tx, id, { retiredAt: new Date() });
  const after = (await getStockLocation(tx, id))!;
  await recordAudit(tx, { actorUserId, action: 'retire', entity: 'stock_location', entityId: id, before, after });
  return after;
}

/** The person's van and what is on it; no van yet: null and nothing (it is made when first needed). */
export async function myVan(tx: Tx, userId: string) {
  const location = await findVanOf(tx, userId);
  if (!location || location.retiredAt) return { location: null, levels: [] };
  return { location, levels: await listAllLevelsAt(tx, location.id) };
}
