// The work-order workflow: move (a day, a technician), skip with a reason, mark done (time on site, note, meters
// read then, keep cost), and open the bench job of a plan that names a template. Each change is made at the version
// the person started from (409 with the order as it now is when stale) and leaves an audit entry.
import type { WorkOrder, WorkOrderDoneParsed } from '@bumperline/contracts/work-orders';
import type { Role } from '@bumperline/contracts/roles';
import { can } from '@bumperline/contracts/roles';
import type { Tx } from '@bumperline/db/client';
import { recordAudit } from '@bumperline/db/queries/audit';
import { getBoardInstance } from '@bumperline/db/queries/board-instances';
import { checkCarePlansOfGameBy } from '@bumperline/db/queries/care-plans';
import { isTechnician } from '@bumperline/db/queries/technicians';
import { getWorkOrder, updateWorkOrder, type WorkOrderRow } from '@bumperline/db/queries/work-orders';
import { openBenchJob } from './bench-jobs.ts';
import { companyToday } from './company-today.ts';
import { companyZone } from './care-plans.ts';
import { recordKeepCost } from './keep-cost.ts';
import { recordMeterReading } from './meters.ts';
import { Conflict, InvalidInput, NotAllowed, NotFound } from './workflow-errors.ts';

export interface WorkOrderActor {
  userId: string;
  tenantId: string;
  role: Role;
}

export function workOrderView(row: WorkOrderRow): WorkOrder {
  const { gameId: _gameId, technicianId: _technicianId, ...rest } = row;
  return {
    ...rest,
    dueAt: new Date(row.dueAt).toISOString(),
    closedAt: row.closedAt ? new Date(row.closedAt).toISOString() : null,
    createdAt: new Date(row.createdAt).toISOString(),
    updatedAt: new Date(row.updatedAt).toISOString(),
  };
}

export async function workOrderOrThrow(tx: Tx, id: string, tenantId: string, now: Date = new Date()): Promise<WorkOrderRow> {
  const row = await getWorkOrder(tx, id, now, await companyZone(tx, tenantId));
  if (!row) throw new NotFound('work order');
  return row;
}

function refuseStale(row: WorkOrderRow, sent: number): void {
  if (row.version !== sent) {
    throw new Conflict('Someone changed this work order since you opened it. Here it is as it now stands.', workOrderView(row), [
      { field: 'version', message: `is ${sent}, but the work order is now at version ${row.version}` },
    ]);
  }
}

function refuseClosed(row: WorkOrderRow): void {
  if (row.state !== 'open') {
    throw new Conflict(`This work order is already ${row.state === 'done' ? 'done' : 'skipped'}.`, workOrderView(row), [
      { field: 'state', message: `is ${row.state}: only open work can change` },
    ]);
  }
}

/** A technician works only on their own work orders (or unassigned ones, which they then take). */
function refuseOthers(row: WorkOrderRow, actor: WorkOrderActor): void {
  if (actor.role === 'technician' && row.technicianId !== null && row.technicianId !== actor.userId) {
    throw new NotAllowed('This work order is another technician’s. Ask the office to move it to you.');
  }
}

async function changed(
  tx: Tx,
  id: string,
  version: number,
  patch: Parameters<typeof updateWorkOrder>[3],
  actor: WorkOrderActor,
  before: WorkOrderRow,
) {
  if (!(await updateWorkOrder(tx, id, version, patch))) {
    const now = await workOrderOrThrow(tx, id, actor.tenantId);
    refuseClosed(now);
    refuseStale(now, version);
  }
  const after = await workOrderOrThrow(tx, id, actor.tenantId);
  return { before: workOrderView(before), after: workOrderView(after) };
}

export async function moveWorkOrder(
  tx: Tx,
  p: { id: string; version: number; plannedOn?: string | null; technicianId?: string | null; actor: WorkOrderActor },
): Promise<WorkOrder> {
  const row = await workOrderOrThrow(tx, p.id, p.actor.tenantId);
  refuseClosed(row);
  refuseStale(row, p.version);
  refuseOthers(row, p.actor);
  const patch: Parameters<typeof updateWorkOrder>[3] = {};
  if (p.technicianId !== undefined && p.technicianId !== row.technicianId) {
    if (!can(p.actor.role, 'work-orders:plan')) {
      throw new NotAllowed('Only the office can give a work order to another technician; you can move its day.');
    }
    if (p.technicianId !== null && !(await isTechnician(tx, p.technicianId))) {
      throw new InvalidInput([{ field: 'technicianId', message: 'is not a technician of this company' }]);
    }
    patch.technicianId = p.technicianId;
  }
  if (p.plannedOn !== undefined) {
    const today = await companyToday(tx, p.actor.tenantId);
    if (p.plannedOn !== null && p.plannedOn < today) {
      throw new InvalidInput([{ field: 'plannedOn', message: `is before today (${today}): plan it for today or later` }]);
    }
    patch.plannedOn = p.plannedOn;
  }
  const { before, after } = await changed(tx, p.id, p.version, patch, p.actor, row);
  await recordAudit(tx, { actorUserId: p.actor.userId, action: 'move', entity: 'work_order', entityId: p.id, before, after });
  return after;
}

export async function skipWorkOrder(tx: Tx, p: { id: string; version: number; reason: string; actor: WorkOrderActor; now?: Date }) {
  const row = await workOrderOrThrow(tx, p.id, p.actor.tenantId);
  refuseClosed(row);
  refuseStale(row, p.version);
  refuseOthers(row, p.actor);
  const now = p.now ?? new Date();
  const { before, after } = await changed(
    tx,
    p.id,
    p.version,
    { state: 'skipped', skipReason: p.reason, closedAt: now, closedBy: p.actor.userId },
    p.actor,
    row,
  );
  // The plan's next work on this game counts from here: let the run look again now.
  await checkCarePlansOfGameBy(tx, row.gameId, now);
  await recordAudit(tx, { actorUserId: p.actor.userId, action: 'skip', entity: 'work_order', entityId: p.id, before, after });
  return after;
}

/**
 * Done: the time on site and note, the meters read then (each a reading, refused like any other when lower than the
 * last without a rollover), and the keep cost from the parts recorded on it and the labour at the company's rate.
 */
export async function completeWorkOrder(tx: Tx, p: { id: string; input: WorkOrderDoneParsed; actor: WorkOrderActor; now?: Date }) {
  const row = await workOrderOrThrow(tx, p.id, p.actor.tenantId);
  refuseClosed(row);
  refuseStale(row, p.input.version);
  refuseOthers(row, p.actor);
  const now = p.now ?? new Date();
  let playsAtDone: number | null = null;
  let hoursAtDone: number | null = null;
  for (const [i, r] of p.input.readings.entries()) {
    const reading = await recordMeterReading(tx, {
      gameId: row.gameId,
      meter: r.meter,
      reading: r.reading,
      rolledOver: r.rolledOver,
      source: 'work_order',
      workOrderId: row.id,
      readBy: p.actor.userId,
      fieldPrefix: `readings.${i}.`,
    });
    if (reading.meter === 'plays') playsAtDone = reading.reading;
    if (reading.meter === 'hours') hoursAtDone = reading.reading;
  }
  const technicianId = row.technicianId ?? p.actor.userId;
  const { before, after } = await changed(
    tx,
    p.id,
    p.input.version,
    {
      state: 'done',
      labourMinutes: p.input.labourMinutes,
      note: p.input.note,
      playsAtDone,
      hoursAtDone,
      closedAt: now,
      closedBy: p.actor.userId,
      technicianId,
    },
    p.actor,
    row,
  );
  await recordKeepCost(tx, {
    source: 'work_order',
    sourceId: row.id,
    gameId: row.gameId,
    labourMinutes: p.input.labourMinutes,
    technicianId,
  });
  await checkCarePlansOfGameBy(tx, row.gameId, now);
  await recordAudit(tx, { actorUserId: p.actor.userId, action: 'done', entity: 'work_order', entityId: p.id, before, after });
  return after;
}

/**
 * Opens the bench job of a work order whose plan names a template, on one of the game's boards. Finishing that job
 * does not close the work order: the technician still says how long it took and reads the meters, so the work
 * order is marked done by hand (a bench job may also be finished days later, back at the shop).
 */
export async function openWorkOrderBenchJob(tx: Tx, p: { id: string; version: number; boardInstanceId: string; actor: WorkOrderActor }) {
  const row = await workOrderOrThrow(tx, p.id, p.actor.tenantId);
  refuseClosed(row);
  refuseStale(row, p.version);
  refuseOthers(row, p.actor);
  if (!row.benchTemplateId) {
    throw new Conflict('This work order has a task list, not a bench job.', workOrderView(row), [
      { field: 'benchTemplateId', message: 'is empty: the plan names no bench-job template' },
    ]);
  }
  if (row.benchJobId) {
    throw new Conflict('This work order already has its bench job.', workOrderView(row), [
      { field: 'benchJobId', message: 'is already set' },
    ]);
  }
  const board = await getBoardInstance(tx, p.boardInstanceId);
  if (!board || board.gameId !== row.gameId) {
    throw new InvalidInput([{ field: 'boardInstanceId', message: 'is not a board in this work order’s game' }]);
  }
  const benchJobId = await openBenchJob(tx, {
    boardInstanceId: board.id,
    templateId: row.benchTemplateId,
    fromWorkOrder: true,
    actor: { userId: p.actor.userId, tenantId: p.actor.tenantId },
  });
  const { before, after } = await changed(tx, p.id, p.version, { benchJobId }, p.actor, row);
  await recordAudit(tx, { actorUserId: p.actor.userId, action: 'open_bench_job', entity: 'work_order', entityId: p.id, before, after });
  return after;
}
