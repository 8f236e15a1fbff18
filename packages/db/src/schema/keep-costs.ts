// What each job cost to keep a game running: parts at cost and labour at the company's rate, one row per job.
import { sql } from 'drizzle-orm';
import { bigint, check, foreignKey, index, integer, timestamp, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import { keepCostSource } from './enums.ts';
import { games } from './games.ts';
import { users } from './identity.ts';
import { tenantTable } from './tenant-table.ts';

/** Written when a service call is fixed, a work order done or a bench job finished; the owner's analytics read it. */
export const keepCostEntries = tenantTable(
  'keep_cost_entries',
  {
    id: uuid('id').notNull().defaultRandom(),
    gameId: uuid('game_id').notNull(),
    source: keepCostSource.column('source').notNull(),
    sourceId: uuid('source_id').notNull(),
    partsCents: bigint('parts_cents', { mode: 'number' }).notNull(),
    labourMinutes: integer('labour_minutes').notNull(),
    /** The company's labour rate when the job was done, so a later rate change leaves past costs alone. */
    labourRateCents: integer('labour_rate_cents').notNull(),
    labourCents: bigint('labour_cents', { mode: 'number' }).notNull(),
    technicianId: uuid('technician_id').references(() => users.id, { onDelete: 'set null' }),
    recordedAt: timestamp('recorded_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    foreignKey({ columns: [t.tenantId, t.gameId], foreignColumns: [games.tenantId, games.id] }),
    keepCostSource.check('keep_cost_entries_source_check', t.source),
    check('keep_cost_entries_amounts_check', sql`parts_cents >= 0 and labour_minutes >= 0 and labour_cents >= 0`),
    uniqueIndex('keep_cost_entries_source_key').on(t.tenantId, t.source, t.sourceId),
    index('keep_cost_entries_tenant_game_idx').on(t.tenantId, t.gameId, t.recordedAt, t.id),
  ],
);
