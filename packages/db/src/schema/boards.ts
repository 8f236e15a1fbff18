// The boards actually in the games (serial, date code, last recap) and the cabinet's temperature through the day.
import { date, foreignKey, index, integer, jsonb, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { games } from './games.ts';
import { modelBoards } from './parts-lists.ts';
import { tenantTable } from './tenant-table.ts';

export const boardInstances = tenantTable(
  'board_instances',
  {
    id: uuid('id').notNull().defaultRandom(),
    boardId: uuid('board_id').notNull(),
    /** The game it is in; null while it sits on the shelf. */
    gameId: uuid('game_id'),
    serial: text('serial').notNull().default(''),
    /** The date code exactly as printed ("8934", "1989-W34"). */
    dateCode: text('date_code').notNull().default(''),
    /** The date the code reads as; null when the code is missing or reads two ways. */
    madeOn: date('made_on'),
    /** Why the date code gives no date (it reads two ways): flagged for a person to settle, never guessed. */
    dateCodeFlag: text('date_code_flag'),
    lastRecapOn: date('last_recap_on'),
    notes: text('notes').notNull().default(''),
    version: integer('version').notNull().default(1),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    foreignKey({ columns: [t.tenantId, t.boardId], foreignColumns: [modelBoards.tenantId, modelBoards.id] }),
    foreignKey({ columns: [t.tenantId, t.gameId], foreignColumns: [games.tenantId, games.id] }),
    index('board_instances_tenant_game_idx').on(t.tenantId, t.gameId),
    index('board_instances_tenant_board_idx').on(t.tenantId, t.boardId),
  ],
);

/** One slice of a cabinet's day: so many hours powered at about this temperature inside the cabinet. */
export interface CabinetSlice {
  hours: number;
  temperatureC: number;
}

/** How warm a game's cabinet runs through the day, for capacitor life; one row per game that has one. */
export const cabinetProfiles = tenantTable(
  'cabinet_profiles',
  {
    gameId: uuid('game_id').notNull(),
    slices: jsonb('slices').$type<CabinetSlice[]>().notNull(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [foreignKey({ columns: [t.tenantId, t.gameId], foreignColumns: [games.tenantId, games.id] }).onDelete('cascade')],
  { key: (t) => [t.gameId] },
);
