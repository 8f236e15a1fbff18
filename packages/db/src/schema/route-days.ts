// Route days (one technician's stops for a date, in the order the dispatcher fixed, if any) and the record of
// changes already applied, so a change a phone sends twice over a flaky connection is applied once.
import { sql } from 'drizzle-orm';
import { date, index, integer, jsonb, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { users } from './identity.ts';
import { tenantTable } from './tenant-table.ts';

/**
 * A route day exists as a row only once someone changed it: its stops come from the technician's calls, work
 * orders and bench jobs for the date. `stopOrder` is the venues in the order the dispatcher dragged them to (kept
 * when the day re-plans); empty means the planner's order.
 */
export const routeDays = tenantTable(
  'route_days',
  {
    technicianId: uuid('technician_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    day: date('day').notNull(),
    stopOrder: uuid('stop_order')
      .array()
      .notNull()
      .default(sql`'{}'::uuid[]`),
    version: integer('version').notNull().default(1),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
    updatedBy: uuid('updated_by').references(() => users.id, { onDelete: 'set null' }),
  },
  () => [],
  { key: (t) => [t.technicianId, t.day] },
);

/**
 * A change sent with an Idempotency-Key (the phone's queued changes carry one each): the first request applies it
 * and stores its answer in the same transaction; a repeat gets the stored answer and changes nothing.
 */
export const appliedChanges = tenantTable(
  'applied_changes',
  {
    key: text('key').notNull(),
    userId: uuid('user_id').references(() => users.id, { onDelete: 'set null' }),
    method: text('method').notNull(),
    path: text('path').notNull(),
    status: integer('status').notNull(),
    body: jsonb('body'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('applied_changes_tenant_created_idx').on(t.tenantId, t.createdAt)],
  { key: (t) => [t.key] },
);
