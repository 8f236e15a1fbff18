import { bigserial, index, jsonb, pgTable, primaryKey, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { tenants } from './tenancy.ts';
import { users } from './identity.ts';
import { tenantIsolation } from './rls.ts';

/** Who changed what: one row per change, with the fields before and after. */
export const auditLog = pgTable(
  'audit_log',
  {
    tenantId: uuid('tenant_id')
      .notNull()
      .references(() => tenants.id, { onDelete: 'cascade' }),
    id: bigserial('id', { mode: 'number' }).notNull(),
    at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
    actorUserId: uuid('actor_user_id').references(() => users.id, { onDelete: 'set null' }),
    action: text('action').notNull(),
    entity: text('entity').notNull(),
    entityId: text('entity_id').notNull(),
    changes: jsonb('changes').$type<Record<string, { from: unknown; to: unknown }>>().notNull().default({}),
  },
  (t) => [
    primaryKey({ columns: [t.tenantId, t.id] }),
    index('audit_log_tenant_entity_idx').on(t.tenantId, t.entity, t.entityId, t.at),
    index('audit_log_tenant_at_idx').on(t.tenantId, t.at),
    tenantIsolation(t.tenantId),
  ],
).enableRLS();
