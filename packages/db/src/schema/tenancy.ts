// Operator companies (tenants), who belongs to them, and invitations to join.
import { sql } from 'drizzle-orm';
import { index, pgPolicy, pgTable, primaryKey, text, timestamp, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import { memberRole } from './enums.ts';
import { users } from './identity.ts';
import { currentTenant, currentUser, tenantIsolation } from './rls.ts';

export const tenants = pgTable(
  'tenants',
  {
    id: uuid('id').primaryKey(),
    name: text('name').notNull(),
    timeZone: text('time_zone').notNull(),
    currency: text('currency').notNull(),
    locale: text('locale').notNull().default('en-US'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    // The current company, plus (read-only) the companies the signed-in person belongs to, for the switcher.
    pgPolicy('tenant_self', {
      for: 'all',
      to: 'public',
      using: sql`${t.id} = ${currentTenant}`,
      withCheck: sql`${t.id} = ${currentTenant}`,
    }),
    pgPolicy('tenant_of_member', {
      for: 'select',
      to: 'public',
      using: sql`${t.id} in (select m.tenant_id from memberships m where m.user_id = ${currentUser})`,
    }),
  ],
).enableRLS();

export const memberships = pgTable(
  'memberships',
  {
    tenantId: uuid('tenant_id')
      .notNull()
      .references(() => tenants.id, { onDelete: 'cascade' }),
    userId: uuid('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    role: memberRole('role').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    primaryKey({ columns: [t.tenantId, t.userId] }),
    index('memberships_user_idx').on(t.userId),
    tenantIsolation(t.tenantId),
    // A person may read their own memberships in every company (to list and switch companies).
    pgPolicy('own_memberships', { for: 'select', to: 'public', using: sql`${t.userId} = ${currentUser}` }),
  ],
).enableRLS();

export const invitations = pgTable(
  'invitations',
  {
    tenantId: uuid('tenant_id')
      .notNull()
      .references(() => tenants.id, { onDelete: 'cascade' }),
    id: uuid('id').notNull().defaultRandom(),
    email: text('email').notNull(),
    role: memberRole('role').notNull(),
    tokenHash: text('token_hash').notNull(),
    invitedBy: uuid('invited_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
    acceptedAt: timestamp('accepted_at', { withTimezone: true }),
    revokedAt: timestamp('revoked_at', { withTimezone: true }),
  },
  (t) => [primaryKey({ columns: [t.tenantId, t.id] }), uniqueIndex('invitations_token_key').on(t.tokenHash), tenantIsolation(t.tenantId)],
).enableRLS();
