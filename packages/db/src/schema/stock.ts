// The parts catalogue, the stocks (warehouses and vans), every movement between them, and the parts used on jobs.
import { sql } from 'drizzle-orm';
import { check, foreignKey, index, integer, numeric, text, timestamp, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import { partKind, stockLocationKind, stockMovementReason, stockUnit } from './enums.ts';
import { games } from './games.ts';
import { users } from './identity.ts';
import { serviceCalls } from './calls.ts';
import { boardParts } from './parts-lists.ts';
import { benchJobs } from './bench-jobs.ts';
import { workOrders } from './care-plans.ts';
import { tenantTable } from './tenant-table.ts';

/** Quantities: whole numbers for countable parts (unit `each`), up to three decimals for metres, grams, millilitres. */
const quantity = (name: string) => numeric(name, { precision: 14, scale: 3, mode: 'number' });

export const catalogueParts = tenantTable(
  'catalogue_parts',
  {
    id: uuid('id').notNull().defaultRandom(),
    partNumber: text('part_number').notNull(),
    description: text('description').notNull(),
    kind: partKind.column('kind').notNull(),
    unit: stockUnit.column('unit').notNull().default('each'),
    unitCostCents: integer('unit_cost_cents').notNull(),
    supplier: text('supplier').notNull().default(''),
    notes: text('notes').notNull().default(''),
    version: integer('version').notNull().default(1),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
    retiredAt: timestamp('retired_at', { withTimezone: true }),
  },
  (t) => [
    partKind.check('catalogue_parts_kind_check', t.kind),
    stockUnit.check('catalogue_parts_unit_check', t.unit),
    check('catalogue_parts_cost_check', sql`unit_cost_cents >= 0`),
    uniqueIndex('catalogue_parts_tenant_number_key').on(t.tenantId, sql`lower(${t.partNumber})`),
    index('catalogue_parts_tenant_number_idx').on(t.tenantId, t.partNumber, t.id),
  ],
);

/** The parts-list entries a catalogue part fits (a 4700 µF 25 V cap fits C1 of one board and C7 of another). */
export const partFits = tenantTable(
  'part_fits',
  {
    cataloguePartId: uuid('catalogue_part_id').notNull(),
    boardPartId: uuid('board_part_id').notNull(),
  },
  (t) => [
    foreignKey({ columns: [t.tenantId, t.cataloguePartId], foreignColumns: [catalogueParts.tenantId, catalogueParts.id] }).onDelete(
      'cascade',
    ),
    foreignKey({ columns: [t.tenantId, t.boardPartId], foreignColumns: [boardParts.tenantId, boardParts.id] }).onDelete('cascade'),
    index('part_fits_tenant_board_part_idx').on(t.tenantId, t.boardPartId),
  ],
  { key: (t) => [t.cataloguePartId, t.boardPartId] },
);

/** A warehouse, or one technician's van (at most one van each). */
export const stockLocations = tenantTable(
  'stock_locations',
  {
    id: uuid('id').notNull().defaultRandom(),
    kind: stockLocationKind.column('kind').notNull(),
    name: text('name').notNull(),
    technicianId: uuid('technician_id').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    retiredAt: timestamp('retired_at', { withTimezone: true }),
  },
  (t) => [
    stockLocationKind.check('stock_locations_kind_check', t.kind),
    check('stock_locations_van_check', sql`kind = 'van' or technician_id is null`),
    uniqueIndex('stock_locations_tenant_van_key')
      .on(t.tenantId, t.technicianId)
      .where(sql`technician_id is not null`),
    index('stock_locations_tenant_kind_idx').on(t.tenantId, t.kind, t.name, t.id),
  ],
);

/** How many of a part a stock holds: never below zero (the database refuses it), with its reorder point. */
export const stockLevels = tenantTable(
  'stock_levels',
  {
    locationId: uuid('location_id').notNull(),
    cataloguePartId: uuid('catalogue_part_id').notNull(),
    quantity: quantity('quantity').notNull().default(0),
    /** At or below this, the part is on the list to order; null: not watched here. */
    reorderPoint: quantity('reorder_point'),
    /** How many to order when it is. */
    reorderQuantity: quantity('reorder_quantity'),
    countedAt: timestamp('counted_at', { withTimezone: true }),
    version: integer('version').notNull().default(1),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    foreignKey({ columns: [t.tenantId, t.locationId], foreignColumns: [stockLocations.tenantId, stockLocations.id] }),
    foreignKey({ columns: [t.tenantId, t.cataloguePartId], foreignColumns: [catalogueParts.tenantId, catalogueParts.id] }),
    check('stock_levels_quantity_check', sql`quantity >= 0`),
    check('stock_levels_reorder_check', sql`coalesce(reorder_point, 0) >= 0 and coalesce(reorder_quantity, 1) > 0`),
    index('stock_levels_tenant_part_idx').on(t.tenantId, t.cataloguePartId),
    index('stock_levels_tenant_reorder_idx')
      .on(t.tenantId, t.locationId, t.cataloguePartId)
      .where(sql`quantity <= reorder_point`),
  ],
  { key: (t) => [t.locationId, t.cataloguePartId] },
);

/**
 * Every change to a stock, never edited: received (to), transfer (from → to), used on a job (from), counted (at
 * `toLocationId`, with what the stock said and what was counted; the difference is counted − expected).
 */
export const stockMovements = tenantTable(
  'stock_movements',
  {
    id: uuid('id').notNull().defaultRandom(),
    cataloguePartId: uuid('catalogue_part_id').notNull(),
    reason: stockMovementReason.column('reason').notNull(),
    fromLocationId: uuid('from_location_id'),
    toLocationId: uuid('to_location_id'),
    quantity: quantity('quantity').notNull(),
    expectedQuantity: quantity('expected_quantity'),
    countedQuantity: quantity('counted_quantity'),
    unitCostCents: integer('unit_cost_cents').notNull(),
    serviceCallId: uuid('service_call_id'),
    workOrderId: uuid('work_order_id'),
    benchJobId: uuid('bench_job_id'),
    note: text('note').notNull().default(''),
    at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
    by: uuid('by').references(() => users.id, { onDelete: 'set null' }),
  },
  (t) => [
    foreignKey({ columns: [t.tenantId, t.cataloguePartId], foreignColumns: [catalogueParts.tenantId, catalogueParts.id] }),
    foreignKey({ columns: [t.tenantId, t.fromLocationId], foreignColumns: [stockLocations.tenantId, stockLocations.id] }),
    foreignKey({ columns: [t.tenantId, t.toLocationId], foreignColumns: [stockLocations.tenantId, stockLocations.id] }),
    foreignKey({ columns: [t.tenantId, t.serviceCallId], foreignColumns: [serviceCalls.tenantId, serviceCalls.id] }),
    foreignKey({ columns: [t.tenantId, t.workOrderId], foreignColumns: [workOrders.tenantId, workOrders.id] }),
    foreignKey({ columns: [t.tenantId, t.benchJobId], foreignColumns: [benchJobs.tenantId, benchJobs.id] }),
    stockMovementReason.check('stock_movements_reason_check', t.reason),
    check('stock_movements_quantity_check', sql`quantity >= 0`),
    check(
      'stock_movements_shape_check',
      sql`(reason = 'received' and from_location_id is null and to_location_id is not null)
        or (reason = 'transfer' and from_location_id is not null and to_location_id is not null and from_location_id <> to_location_id)
        or (reason = 'used' and from_location_id is not null and to_location_id is null)
        or (reason = 'counted' and to_location_id is not null and expected_quantity is not null and counted_quantity is not null)`,
    ),
    index('stock_movements_tenant_part_idx').on(t.tenantId, t.cataloguePartId, t.at, t.id),
    index('stock_movements_tenant_from_idx')
      .on(t.tenantId, t.fromLocationId, t.at, t.id)
      .where(sql`from_location_id is not null`),
    index('stock_movements_tenant_to_idx')
      .on(t.tenantId, t.toLocationId, t.at, t.id)
      .where(sql`to_location_id is not null`),
  ],
);

/** Parts fitted on a service call or a work order, taken off a stock (the technician's van) in the same transaction. */
export const partsUsed = tenantTable(
  'parts_used',
  {
    id: uuid('id').notNull().defaultRandom(),
    gameId: uuid('game_id').notNull(),
    serviceCallId: uuid('service_call_id'),
    workOrderId: uuid('work_order_id'),
    cataloguePartId: uuid('catalogue_part_id').notNull(),
    locationId: uuid('location_id').notNull(),
    quantity: quantity('quantity').notNull(),
    /** The part's cost when used: keep cost does not move when the catalogue's price does. */
    unitCostCents: integer('unit_cost_cents').notNull(),
    movementId: uuid('movement_id').notNull(),
    usedAt: timestamp('used_at', { withTimezone: true }).notNull().defaultNow(),
    usedBy: uuid('used_by').references(() => users.id, { onDelete: 'set null' }),
  },
  (t) => [
    foreignKey({ columns: [t.tenantId, t.gameId], foreignColumns: [games.tenantId, games.id] }),
    foreignKey({ columns: [t.tenantId, t.serviceCallId], foreignColumns: [serviceCalls.tenantId, serviceCalls.id] }),
    foreignKey({ columns: [t.tenantId, t.workOrderId], foreignColumns: [workOrders.tenantId, workOrders.id] }),
    foreignKey({ columns: [t.tenantId, t.cataloguePartId], foreignColumns: [catalogueParts.tenantId, catalogueParts.id] }),
    foreignKey({ columns: [t.tenantId, t.locationId], foreignColumns: [stockLocations.tenantId, stockLocations.id] }),
    foreignKey({ columns: [t.tenantId, t.movementId], foreignColumns: [stockMovements.tenantId, stockMovements.id] }),
    check('parts_used_one_job_check', sql`(service_call_id is null) <> (work_order_id is null)`),
    check('parts_used_quantity_check', sql`quantity > 0`),
    index('parts_used_tenant_call_idx')
      .on(t.tenantId, t.serviceCallId)
      .where(sql`service_call_id is not null`),
    index('parts_used_tenant_work_order_idx')
      .on(t.tenantId, t.workOrderId)
      .where(sql`work_order_id is not null`),
    index('parts_used_tenant_game_idx').on(t.tenantId, t.gameId, t.usedAt, t.id),
  ],
);
