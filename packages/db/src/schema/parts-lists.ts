// A game model's boards and each board's parts list: the reference the bench measures against.
import { foreignKey, index, integer, text, uniqueIndex, uuid, timestamp } from 'drizzle-orm/pg-core';
import { partKind } from './enums.ts';
import { gameModels } from './games.ts';
import { tenantTable } from './tenant-table.ts';

/** A board of a model ("Power supply", "Sound board"), with the maker's part number as printed. */
export const modelBoards = tenantTable(
  'model_boards',
  {
    id: uuid('id').notNull().defaultRandom(),
    modelId: uuid('model_id').notNull(),
    name: text('name').notNull(),
    partNumber: text('part_number').notNull().default(''),
    notes: text('notes').notNull().default(''),
    /** Bumped on every save of the parts list: two editors cannot silently overwrite each other. */
    version: integer('version').notNull().default(1),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    foreignKey({ columns: [t.tenantId, t.modelId], foreignColumns: [gameModels.tenantId, gameModels.id] }).onDelete('cascade'),
    uniqueIndex('model_boards_tenant_model_name_key').on(t.tenantId, t.modelId, t.name),
  ],
);

/** One line of a board's parts list, written as the trade writes it; the domain code reads the values. */
export const boardParts = tenantTable(
  'board_parts',
  {
    id: uuid('id').notNull().defaultRandom(),
    boardId: uuid('board_id').notNull(),
    position: integer('position').notNull(),
    designator: text('designator').notNull(),
    kind: partKind.column('kind').notNull(),
    /** "4k7", "100µF", "T2.5A 250V", "brown black red gold", "1N4004". */
    value: text('value').notNull(),
    /** "5%", "±10 %", "J", "+80/-20%"; empty where the kind has none (a diode, a connector). */
    tolerance: text('tolerance').notNull().default(''),
    /** Wattage or voltage as written: "1/2 W", "35 V". */
    rating: text('rating').notNull().default(''),
    /** An electrolytic's rated (upper category) temperature in °C. */
    ratedTemperatureC: integer('rated_temperature_c'),
    /** An electrolytic's rated life in hours at that temperature. */
    ratedLifeHours: integer('rated_life_hours'),
    notes: text('notes').notNull().default(''),
    /** Taken off the list. Kept, never deleted, so the readings taken on it stay in the board's history; a save
     * that lists the designator again brings the same row back. */
    removedAt: timestamp('removed_at', { withTimezone: true }),
  },
  (t) => [
    foreignKey({ columns: [t.tenantId, t.boardId], foreignColumns: [modelBoards.tenantId, modelBoards.id] }).onDelete('cascade'),
    partKind.check('board_parts_kind_check', t.kind),
    uniqueIndex('board_parts_tenant_board_designator_key').on(t.tenantId, t.boardId, t.designator),
    index('board_parts_tenant_board_position_idx').on(t.tenantId, t.boardId, t.position),
  ],
);
