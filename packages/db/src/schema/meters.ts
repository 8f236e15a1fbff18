// The meters each game has (and where each rolls over), and every reading taken of them.
import { bigint, boolean, check, foreignKey, index, timestamp, uuid } from 'drizzle-orm/pg-core';
import { sql } from 'drizzle-orm';
import { meterKind, meterReadingSource } from './enums.ts';
import { games } from './games.ts';
import { users } from './identity.ts';
import { workOrders } from './care-plans.ts';
import { tenantTable } from './tenant-table.ts';

/** Which meters a game has; `rollsOverAt` is the count at which it wraps to zero (1,000,000 for six digits), null if never. */
export const gameMeters = tenantTable(
  'game_meters',
  {
    gameId: uuid('game_id').notNull(),
    meter: meterKind.column('meter').notNull(),
    rollsOverAt: bigint('rolls_over_at', { mode: 'number' }),
  },
  (t) => [
    foreignKey({ columns: [t.tenantId, t.gameId], foreignColumns: [games.tenantId, games.id] }).onDelete('cascade'),
    meterKind.check('game_meters_meter_check', t.meter),
    check('game_meters_rolls_over_at_check', sql`rolls_over_at is null or rolls_over_at > 0`),
  ],
  { key: (t) => [t.gameId, t.meter] },
);

/**
 * A meter read at a visit, a work order or a collection. A reading lower than the last is accepted only as a
 * rollover (`rolledOver`, and the game's meter has a rollover point); readings are never edited.
 */
export const meterReadings = tenantTable(
  'meter_readings',
  {
    id: uuid('id').notNull().defaultRandom(),
    gameId: uuid('game_id').notNull(),
    meter: meterKind.column('meter').notNull(),
    reading: bigint('reading', { mode: 'number' }).notNull(),
    rolledOver: boolean('rolled_over').notNull().default(false),
    source: meterReadingSource.column('source').notNull(),
    workOrderId: uuid('work_order_id'),
    readAt: timestamp('read_at', { withTimezone: true }).notNull().defaultNow(),
    readBy: uuid('read_by').references(() => users.id, { onDelete: 'set null' }),
  },
  (t) => [
    foreignKey({ columns: [t.tenantId, t.gameId], foreignColumns: [games.tenantId, games.id] }).onDelete('cascade'),
    foreignKey({ columns: [t.tenantId, t.workOrderId], foreignColumns: [workOrders.tenantId, workOrders.id] }),
    meterKind.check('meter_readings_meter_check', t.meter),
    meterReadingSource.check('meter_readings_source_check', t.source),
    check('meter_readings_reading_check', sql`reading >= 0`),
    index('meter_readings_tenant_game_meter_idx').on(t.tenantId, t.gameId, t.meter, t.readAt, t.id),
  ],
);
