import { bigserial, index, jsonb, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { users } from './identity.ts';
import { tenantTable } from './tenant-table.ts';

/** Who changed what: one row per change, with the fields before and after. */
export const auditLog = tenantTable(
  'audit_log',
  {
    id: bigserial('id', { mode: 'number' }).notNull(),
    at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
    actorUserId: uuid('actor_user_id').references(() => users.id, { onDelete: 'set null' }),
    action: text('action').notNull(),
    entity: text('entity').notNull(),
    entityId: text('entity_id').notNull(),
    changes: jsonb('changes').$type<Record<string, { from: unknown; to: unknown }>>().notNull().default({}),
  },
  (t) => [
    index('audit_log_tenant_entity_idx').on(t.tenantId, t.entity, t.entityId, t.at),
    index('audit_log_tenant_at_idx').on(t.tenantId, t.at),
  ],
);
