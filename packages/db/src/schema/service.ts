// Service calls and everything that hangs off them: their timeline, photos, the game's downtime,
// venue contacts, technicians' skills and home base, and the company's dispatch settings.
import { sql } from 'drizzle-orm';
import {
  boolean,
  doublePrecision,
  foreignKey,
  index,
  integer,
  jsonb,
  pgTable,
  primaryKey,
  text,
  timestamp,
  uniqueIndex,
  uuid,
} from 'drizzle-orm/pg-core';
import { callSeverity, callSource, callState, outboxChannel, outboxStatus, problemKind } from './enums.ts';
import { tenants } from './tenancy.ts';
import { users } from './identity.ts';
import { venues } from './venues.ts';
import { games } from './games.ts';
import { tenantIsolation } from './rls.ts';

/** Response targets in minutes per severity; map tiles; the threshold before a target at which dispatch is warned. */
export const tenantSettings = pgTable(
  'tenant_settings',
  {
    tenantId: uuid('tenant_id')
      .primaryKey()
      .references(() => tenants.id, { onDelete: 'cascade' }),
    responseTargets: jsonb('response_targets')
      .$type<{ down: number; fault: number; cosmetic: number }>()
      .notNull()
      .default({ down: 240, fault: 1440, cosmetic: 4320 }),
    warnBeforeMinutes: integer('warn_before_minutes').notNull().default(30),
    mapTileUrl: text('map_tile_url').notNull().default(''),
    dispatchPhone: text('dispatch_phone').notNull().default(''),
  },
  (t) => [tenantIsolation(t.tenantId)],
).enableRLS();

/** Which venue a venue contact speaks for. */
export const venueContacts = pgTable(
  'venue_contacts',
  {
    tenantId: uuid('tenant_id')
      .notNull()
      .references(() => tenants.id, { onDelete: 'cascade' }),
    venueId: uuid('venue_id').notNull(),
    userId: uuid('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
  },
  (t) => [
    primaryKey({ columns: [t.tenantId, t.venueId, t.userId] }),
    foreignKey({ columns: [t.tenantId, t.venueId], foreignColumns: [venues.tenantId, venues.id] }).onDelete('cascade'),
    index('venue_contacts_user_idx').on(t.tenantId, t.userId),
    tenantIsolation(t.tenantId),
  ],
).enableRLS();

/** A technician's skills (game kinds and specialities) and where their day starts. */
export const technicianProfiles = pgTable(
  'technician_profiles',
  {
    tenantId: uuid('tenant_id')
      .notNull()
      .references(() => tenants.id, { onDelete: 'cascade' }),
    userId: uuid('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    skills: text('skills')
      .array()
      .notNull()
      .default(sql`'{}'::text[]`),
    homeLatitude: doublePrecision('home_latitude'),
    homeLongitude: doublePrecision('home_longitude'),
    active: boolean('active').notNull().default(true),
  },
  (t) => [primaryKey({ columns: [t.tenantId, t.userId] }), tenantIsolation(t.tenantId)],
).enableRLS();

export const serviceCalls = pgTable(
  'service_calls',
  {
    tenantId: uuid('tenant_id')
      .notNull()
      .references(() => tenants.id, { onDelete: 'cascade' }),
    id: uuid('id').notNull().defaultRandom(),
    gameId: uuid('game_id').notNull(),
    venueId: uuid('venue_id'),
    problem: problemKind('problem').notNull(),
    severity: callSeverity('severity').notNull(),
    state: callState('state').notNull().default('reported'),
    source: callSource('source').notNull(),
    note: text('note').notNull().default(''),
    reporterPhone: text('reporter_phone'),
    reporterSmsConsent: boolean('reporter_sms_consent').notNull().default(false),
    technicianId: uuid('technician_id').references(() => users.id, { onDelete: 'set null' }),
    /** When the assigned technician accepted (by SMS reply or in the app); cleared on reassignment. */
    acceptedAt: timestamp('accepted_at', { withTimezone: true }),
    createdBy: uuid('created_by').references(() => users.id, { onDelete: 'set null' }),
    /** The public status page's secret, given to the reporter on the receipt. */
    statusToken: text('status_token').notNull(),
    openedAt: timestamp('opened_at', { withTimezone: true }).notNull().defaultNow(),
    targetAt: timestamp('target_at', { withTimezone: true }).notNull(),
    fixedAt: timestamp('fixed_at', { withTimezone: true }),
    closedAt: timestamp('closed_at', { withTimezone: true }),
    warnedAt: timestamp('warned_at', { withTimezone: true }),
    version: integer('version').notNull().default(1),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    primaryKey({ columns: [t.tenantId, t.id] }),
    foreignKey({ columns: [t.tenantId, t.gameId], foreignColumns: [games.tenantId, games.id] }),
    foreignKey({ columns: [t.tenantId, t.venueId], foreignColumns: [venues.tenantId, venues.id] }),
    uniqueIndex('service_calls_status_token_key').on(t.statusToken),
    index('service_calls_tenant_state_idx').on(t.tenantId, t.state, t.targetAt),
    index('service_calls_tenant_game_idx').on(t.tenantId, t.gameId, t.openedAt),
    index('service_calls_tenant_tech_idx').on(t.tenantId, t.technicianId, t.state),
    tenantIsolation(t.tenantId),
  ],
).enableRLS();

/** The call's timeline: every state change, assignment, note, joined report and message, with who and when. */
export const callEvents = pgTable(
  'call_events',
  {
    tenantId: uuid('tenant_id')
      .notNull()
      .references(() => tenants.id, { onDelete: 'cascade' }),
    id: uuid('id').notNull().defaultRandom(),
    callId: uuid('call_id').notNull(),
    at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
    actorUserId: uuid('actor_user_id').references(() => users.id, { onDelete: 'set null' }),
    /** Who acted when it was not a signed-in person: "reporter", "SMS from +1312…", "system". */
    actorLabel: text('actor_label').notNull().default(''),
    kind: text('kind', {
      enum: ['opened', 'state', 'assigned', 'unassigned', 'accepted', 'declined', 'note', 'report_joined', 'sms_in', 'photo', 'warned'],
    }).notNull(),
    fromState: callState('from_state'),
    toState: callState('to_state'),
    detail: jsonb('detail').$type<Record<string, unknown>>().notNull().default({}),
  },
  (t) => [
    primaryKey({ columns: [t.tenantId, t.id] }),
    foreignKey({ columns: [t.tenantId, t.callId], foreignColumns: [serviceCalls.tenantId, serviceCalls.id] }).onDelete('cascade'),
    index('call_events_tenant_call_idx').on(t.tenantId, t.callId, t.at),
    tenantIsolation(t.tenantId),
  ],
).enableRLS();

export const callPhotos = pgTable(
  'call_photos',
  {
    tenantId: uuid('tenant_id')
      .notNull()
      .references(() => tenants.id, { onDelete: 'cascade' }),
    id: uuid('id').notNull().defaultRandom(),
    callId: uuid('call_id').notNull(),
    storageKey: text('storage_key').notNull(),
    thumbKey: text('thumb_key').notNull(),
    contentType: text('content_type').notNull(),
    bytes: integer('bytes').notNull(),
    width: integer('width').notNull(),
    height: integer('height').notNull(),
    uploadedBy: text('uploaded_by').notNull().default('reporter'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    primaryKey({ columns: [t.tenantId, t.id] }),
    foreignKey({ columns: [t.tenantId, t.callId], foreignColumns: [serviceCalls.tenantId, serviceCalls.id] }).onDelete('cascade'),
    index('call_photos_tenant_call_idx').on(t.tenantId, t.callId),
    tenantIsolation(t.tenantId),
  ],
).enableRLS();

/** When a game was down; an open interval has no end. Feeds uptime, MTBF and MTTR. */
export const downtimeIntervals = pgTable(
  'downtime_intervals',
  {
    tenantId: uuid('tenant_id')
      .notNull()
      .references(() => tenants.id, { onDelete: 'cascade' }),
    id: uuid('id').notNull().defaultRandom(),
    gameId: uuid('game_id').notNull(),
    callId: uuid('call_id'),
    startedAt: timestamp('started_at', { withTimezone: true }).notNull(),
    endedAt: timestamp('ended_at', { withTimezone: true }),
  },
  (t) => [
    primaryKey({ columns: [t.tenantId, t.id] }),
    foreignKey({ columns: [t.tenantId, t.gameId], foreignColumns: [games.tenantId, games.id] }),
    index('downtime_tenant_game_idx').on(t.tenantId, t.gameId, t.startedAt),
    tenantIsolation(t.tenantId),
  ],
).enableRLS();

/**
 * Outgoing SMS and e-mail. Written in the same transaction as the change that causes them, sent by a
 * worker afterwards, retried with backoff: never lost, never sent twice.
 */
export const outbox = pgTable(
  'outbox',
  {
    tenantId: uuid('tenant_id')
      .notNull()
      .references(() => tenants.id, { onDelete: 'cascade' }),
    id: uuid('id').notNull().defaultRandom(),
    channel: outboxChannel('channel').notNull(),
    toAddress: text('to_address').notNull(),
    subject: text('subject').notNull().default(''),
    body: text('body').notNull(),
    callId: uuid('call_id'),
    status: outboxStatus('status').notNull().default('pending'),
    attempts: integer('attempts').notNull().default(0),
    nextAttemptAt: timestamp('next_attempt_at', { withTimezone: true }).notNull().defaultNow(),
    claimedAt: timestamp('claimed_at', { withTimezone: true }),
    lastError: text('last_error'),
    providerId: text('provider_id'),
    providerStatus: text('provider_status'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    sentAt: timestamp('sent_at', { withTimezone: true }),
  },
  (t) => [
    primaryKey({ columns: [t.tenantId, t.id] }),
    index('outbox_tenant_due_idx').on(t.tenantId, t.status, t.nextAttemptAt),
    index('outbox_tenant_call_idx').on(t.tenantId, t.callId),
    index('outbox_provider_idx').on(t.providerId),
    tenantIsolation(t.tenantId),
  ],
).enableRLS();
