// Who belongs to an operator company, and invitations to join one.
import { sql } from 'drizzle-orm';
import { index, pgPolicy, text, timestamp, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import { memberRole } from './enums.ts';
import { users } from './identity.ts';
import { currentUser } from './rls.ts';
import { tenantTable } from './tenant-table.ts';

export const memberships = tenantTable(
  'memberships',
  {
    userId: uuid('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    role: memberRole.column('role').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    memberRole.check('memberships_role_check', t.role),
    index('memberships_user_idx').on(t.userId),
    // A person may read their own memberships in every company (to list and switch companies).
    pgPolicy('own_memberships', { for: 'select', to: 'public', using: sql`${t.userId} = ${currentUser}` }),
  ],
  { key: (t) => [t.userId] },
);

export const invitations = tenantTable(
  'invitations',
  {
    id: uuid('id').notNull().defaultRandom(),
    email: text('email').notNull(),
    role: memberRole.column('role').notNull(),
    tokenHash: text('token_hash').notNull(),
    invitedBy: uuid('invited_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
    acceptedAt: timestamp('accepted_at', { withTimezone: true }),
    revokedAt: timestamp('revoked_at', { withTimezone: true }),
  },
  (t) => [memberRole.check('invitations_role_check', t.role), uniqueIndex('invitations_token_key').on(t.tokenHash)],
);
