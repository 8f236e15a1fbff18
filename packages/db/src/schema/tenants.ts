// Operator companies (tenants): the rows every tenant-owned table hangs off.
import { sql } from 'drizzle-orm';
import { pgPolicy, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { currentTenant, currentUser } from './rls.ts';

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
