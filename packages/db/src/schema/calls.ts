// Service calls and what hangs off them: their timeline, photos, and the game's downtime they cause.
import { boolean, foreignKey, index, integer, jsonb, text, timestamp, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import { callSeverity, callSource, callState, problemKind } from './enums.ts';
import { users } from './identity.ts';
import { venues } from './venues.ts';
import { games } from './games.ts';
import { tenantTable } from './tenant-table.ts';

export const serviceCalls = tenantTable(
  'service_calls',
  {
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
    foreignKey({ columns: [t.tenantId, t.gameId], foreignColumns: [games.tenantId, games.id] }),
    foreignKey({ columns: [t.tenantId, t.venueId], foreignColumns: [venues.tenantId, venues.id] }),
    uniqueIndex('service_calls_status_token_key').on(t.statusToken),
    index('service_calls_tenant_state_idx').on(t.tenantId, t.state, t.targetAt),
    index('service_calls_tenant_game_idx').on(t.tenantId, t.gameId, t.openedAt),
    index('service_calls_tenant_tech_idx').on(t.tenantId, t.technicianId, t.state),
  ],
);

/** The call's timeline: every state change, assignment, note, joined report and message, with who and when. */
export const callEvents = tenantTable(
  'call_events',
  {
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
    foreignKey({ columns: [t.tenantId, t.callId], foreignColumns: [serviceCalls.tenantId, serviceCalls.id] }).onDelete('cascade'),
    index('call_events_tenant_call_idx').on(t.tenantId, t.callId, t.at),
  ],
);

export const callPhotos = tenantTable(
  'call_photos',
  {
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
    foreignKey({ columns: [t.tenantId, t.callId], foreignColumns: [serviceCalls.tenantId, serviceCalls.id] }).onDelete('cascade'),
    index('call_photos_tenant_call_idx').on(t.tenantId, t.callId),
  ],
);

/** When a game was down; an open interval has no end. Feeds uptime, MTBF and MTTR. */
export const downtimeIntervals = tenantTable(
  'downtime_intervals',
  {
    id: uuid('id').notNull().defaultRandom(),
    gameId: uuid('game_id').notNull(),
    callId: uuid('call_id'),
    startedAt: timestamp('started_at', { withTimezone: true }).notNull(),
    endedAt: timestamp('ended_at', { withTimezone: true }),
  },
  (t) => [
    foreignKey({ columns: [t.tenantId, t.gameId], foreignColumns: [games.tenantId, games.id] }),
    index('downtime_tenant_game_idx').on(t.tenantId, t.gameId, t.startedAt),
  ],
);
