// Service calls and what hangs off them: their timeline, photos, and the game's downtime they cause.
import { sql } from 'drizzle-orm';
import { callStateGroups } from '@bumperline/contracts/calls';
import { boolean, date, foreignKey, index, integer, jsonb, text, timestamp, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import { callSeverity, callSource, callState, problemKind } from './enums.ts';
import { users } from './identity.ts';
import { venues } from './venues.ts';
import { games } from './games.ts';
import { tenantTable } from './tenant-table.ts';

/** The partial indexes' condition: a call still open (callStateGroups.open, written out as SQL). */
const isOpen = sql.raw(`state in (${callStateGroups.open.map((s) => `'${s}'`).join(', ')})`);

export const serviceCalls = tenantTable(
  'service_calls',
  {
    id: uuid('id').notNull().defaultRandom(),
    gameId: uuid('game_id').notNull(),
    venueId: uuid('venue_id'),
    problem: problemKind.column('problem').notNull(),
    severity: callSeverity.column('severity').notNull(),
    state: callState.column('state').notNull().default('reported'),
    source: callSource.column('source').notNull(),
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
    /** The route day the call is planned into; an open call without one is on its technician's today. */
    plannedOn: date('planned_on'),
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
    callState.check('service_calls_state_check', t.state),
    problemKind.check('service_calls_problem_check', t.problem),
    callSeverity.check('service_calls_severity_check', t.severity),
    callSource.check('service_calls_source_check', t.source),
    // One state (a filter, the warnings job, a game's unfixed calls), in target order.
    index('service_calls_tenant_state_idx').on(t.tenantId, t.state, t.targetAt, t.id),
    // The open list (Today, Calls): few rows of many, already in the order the list shows.
    index('service_calls_tenant_open_target_idx').on(t.tenantId, t.targetAt, t.id).where(isOpen),
    // Every state, newest or by target first.
    index('service_calls_tenant_opened_idx').on(t.tenantId, t.openedAt, t.id),
    index('service_calls_tenant_target_idx').on(t.tenantId, t.targetAt, t.id),
    index('service_calls_tenant_game_idx').on(t.tenantId, t.gameId, t.openedAt),
    index('service_calls_tenant_tech_idx').on(t.tenantId, t.technicianId, t.state),
    // A technician's open calls: their list, and their load when dispatch ranks technicians (the state is
    // in the index, so the load is counted from the index alone).
    index('service_calls_tenant_tech_open_idx').on(t.tenantId, t.technicianId, t.targetAt, t.id, t.state).where(isOpen),
    // A venue's calls (the venue page, the venue contact's view).
    index('service_calls_tenant_venue_idx').on(t.tenantId, t.venueId, t.openedAt),
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
    fromState: callState.column('from_state'),
    toState: callState.column('to_state'),
    detail: jsonb('detail').$type<Record<string, unknown>>().notNull().default({}),
  },
  (t) => [
    foreignKey({ columns: [t.tenantId, t.callId], foreignColumns: [serviceCalls.tenantId, serviceCalls.id] }).onDelete('cascade'),
    callState.check('call_events_from_state_check', t.fromState),
    callState.check('call_events_to_state_check', t.toState),
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
