// Parts fitted on service calls and work orders, scoped by the tenant transaction. The row is written with the
// stock movement that took the part off a stock, in the same transaction (services/parts-used.ts).
import { and, asc, eq, sql } from 'drizzle-orm';
import type { Tx } from '../client.ts';
import { catalogueParts, partsUsed, serviceCalls, stockLocations, users, workOrders } from '../schema/index.ts';
import { currentTenant } from '../schema/rls.ts';

/** The call's game, state and technician, locked against a state change until the part is recorded. */
export async function findCallForPartsUsed(tx: Tx, callId: string) {
  const [row] = await tx
    .select({ id: serviceCalls.id, gameId: serviceCalls.gameId, state: serviceCalls.state })
    .from(serviceCalls)
    .where(and(eq(serviceCalls.tenantId, currentTenant), eq(serviceCalls.id, callId)))
    .for('share');
  return row;
}

/** The work order's game and state, locked against a state change until the part is recorded. */
export async function findWorkOrderForPartsUsed(tx: Tx, workOrderId: string) {
  const [row] = await tx
    .select({ id: workOrders.id, gameId: workOrders.gameId, state: workOrders.state })
    .from(workOrders)
    .where(and(eq(workOrders.tenantId, currentTenant), eq(workOrders.id, workOrderId)))
    .for('share');
  return row;
}

export type PartUsedValues = Omit<typeof partsUsed.$inferInsert, 'tenantId' | 'id' | 'usedAt'>;

export async function insertPartUsed(tx: Tx, values: PartUsedValues): Promise<string> {
  const [row] = await tx
    .insert(partsUsed)
    .values({ ...values, tenantId: sql`${currentTenant}` })
    .returning({ id: partsUsed.id });
  return row!.id;
}

const partUsedColumns = {
  id: partsUsed.id,
  gameId: partsUsed.gameId,
  serviceCallId: partsUsed.serviceCallId,
  workOrderId: partsUsed.workOrderId,
  cataloguePartId: partsUsed.cataloguePartId,
  partNumber: catalogueParts.partNumber,
  description: catalogueParts.description,
  unit: catalogueParts.unit,
  locationId: partsUsed.locationId,
  locationName: stockLocations.name,
  quantity: partsUsed.quantity,
  unitCostCents: partsUsed.unitCostCents,
  usedAt: partsUsed.usedAt,
  usedByName: users.name,
};

function selectPartsUsed(tx: Tx) {
  return tx
    .select(partUsedColumns)
    .from(partsUsed)
    .innerJoin(catalogueParts, and(eq(catalogueParts.tenantId, partsUsed.tenantId), eq(catalogueParts.id, partsUsed.cataloguePartId)))
    .innerJoin(stockLocations, and(eq(stockLocations.tenantId, partsUsed.tenantId), eq(stockLocations.id, partsUsed.locationId)))
    .leftJoin(users, eq(users.id, partsUsed.usedBy));
}

export async function getPartUsed(tx: Tx, id: string) {
  const [row] = await selectPartsUsed(tx).where(and(eq(partsUsed.tenantId, currentTenant), eq(partsUsed.id, id)));
  return row;
}

/** A job's parts in the order they were used (parts_used_tenant_call_idx / _work_order_idx). */
export function listPartsUsed(tx: Tx, job: { serviceCallId: string } | { workOrderId: string }) {
  const filter =
    'serviceCallId' in job
      ? and(eq(partsUsed.serviceCallId, job.serviceCallId), sql`${partsUsed.serviceCallId} is not null`)
      : and(eq(partsUsed.workOrderId, job.workOrderId), sql`${partsUsed.workOrderId} is not null`);
  return selectPartsUsed(tx)
    .where(and(eq(partsUsed.tenantId, currentTenant), filter))
    .orderBy(asc(partsUsed.usedAt), asc(partsUsed.id));
}
