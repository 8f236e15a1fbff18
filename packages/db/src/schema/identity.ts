// People and their sign-in state. These rows are not owned by one operator company: a person
// may belong to several, so they carry no tenant_id and are reached through memberships.
import { sql } from 'drizzle-orm';
import { boolean, index, integer, pgTable, text, timestamp, uniqueIndex, uuid } from 'drizzle-orm/pg-core';

export const users = pgTable(
  'users',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    email: text('email').notNull(),
    name: text('name').notNull(),
    passwordHash: text('password_hash'),
    /** Mobile number in E.164 (+13125550100), for SMS. */
    phone: text('phone'),
    /**
     * When the person first opened a link mailed to this address. Until then the password signs nobody
     * in, and the first link other than the sign-up's own confirmation drops it (see queries/email-proof.ts).
     */
    emailVerifiedAt: timestamp('email_verified_at', { withTimezone: true }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex('users_email_key').on(sql`lower(${t.email})`)],
);

/** One row per signed-in browser; the token carries only its id, so revoking the row signs it out at once. */
export const userSessions = pgTable(
  'user_sessions',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    userId: uuid('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    activeTenantId: uuid('active_tenant_id'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    lastSeenAt: timestamp('last_seen_at', { withTimezone: true }).notNull().defaultNow(),
    revokedAt: timestamp('revoked_at', { withTimezone: true }),
  },
  (t) => [index('user_sessions_user_idx').on(t.userId)],
);

/**
 * One-time e-mailed tokens: password resets, sign-in links (venue contacts sign in without a password)
 * and the confirmation of a new sign-up's address.
 */
export const emailTokens = pgTable('email_tokens', {
  tokenHash: text('token_hash').primaryKey(),
  purpose: text('purpose', { enum: ['password-reset', 'sign-in', 'verify-email'] }).notNull(),
  userId: uuid('user_id')
    .notNull()
    .references(() => users.id, { onDelete: 'cascade' }),
  expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  usedAt: timestamp('used_at', { withTimezone: true }),
});

export const platformAdmins = pgTable('platform_admins', {
  userId: uuid('user_id')
    .primaryKey()
    .references(() => users.id, { onDelete: 'cascade' }),
  active: boolean('active').notNull().default(true),
});

/**
 * Rate-limit counters shared by every API instance (sign-in attempts, public reports). Keys are SHA-256
 * hashes, so no address or e-mail is stored; a counter starts again once its window has passed.
 */
export const rateLimitCounters = pgTable('rate_limit_counters', {
  key: text('key').primaryKey(),
  hits: integer('hits').notNull(),
  resetAt: timestamp('reset_at', { withTimezone: true }).notNull(),
});
