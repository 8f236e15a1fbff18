// Service-call queries, scoped by the caller's tenant transaction.
import { randomBytes } from 'node:crypto';
import { and, asc, desc, eq, inArray, isNull, sql, type SQL } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import type { Tx } from '../client.ts';
import {
  callEvents,
  callPhotos,
  downtimeIntervals,
  gameModels,
  games,
  memberships,
  outbox,
  serviceCalls,
  technicianProfiles,
  tenantSettings,
  users,
  venueContacts,
  venues,
} from '../schema/index.ts';
import { currentTenant } from '../schema/rls.ts';
import { decodeCursor, keysetOrder, keysetWhere, toPage, type SortKey } from './keyset.ts';
import { escapeLike } from './venues.ts';

type CallRow = typeof serviceCalls.$inferSelect;
type CallState = CallRow['state'];
export const OPEN_STATES: CallState[] = ['reported', 'assigned', 'on_the_way', 'on_site', 'waiting_parts', 'at_shop', 'fixed'];
/** States in which the game is still waiting for a fix: a new report joins such a call. */
export const UNFIXED_STATES: CallState[] = ['reported', 'assigned', 'on_the_way', 'on_site', 'waiting_parts', 'at_shop'];

const tech = alias(users, 'tech');

export const callColumns = {
  id: serviceCalls.id,
  gameId: serviceCalls.gameId,
  gameTitle: gameModels.title,
  gameSerial: games.serial,
  gameKind: gameModels.kind,
  venueId: serviceCalls.venueId,
  venueName: venues.name,
  latitude: venues.latitude,
  longitude: venues.longitude,
  problem: serviceCalls.problem,
  severity: serviceCalls.severity,
  state: serviceCalls.state,
  source: serviceCalls.source,
  note: serviceCalls.note,
  technicianId: serviceCalls.technicianId,
  technicianName: tech.name,
  acceptedAt: serviceCalls.acceptedAt,
  openedAt: serviceCalls.openedAt,
  targetAt: serviceCalls.targetAt,
  fixedAt: serviceCalls.fixedAt,
  closedAt: serviceCalls.closedAt,
  version: serviceCalls.version,
  reporterWantsSms: sql<boolean>`(${serviceCalls.reporterSmsConsent} and ${serviceCalls.reporterPhone} is not null)`,
};

function fromCalls(tx: Tx, columns: Record<string, unknown>) {
  return tx
    .select(columns as typeof callColumns)
    .from(serviceCalls)
    .innerJoin(games, and(eq(games.tenantId, serviceCalls.tenantId), eq(games.id, serviceCalls.gameId)))
    .innerJoin(gameModels, and(eq(gameModels.tenantId, games.tenantId), eq(gameModels.id, games.modelId)))
    .leftJoin(venues, and(eq(venues.tenantId, serviceCalls.tenantId), eq(venues.id, serviceCalls.venueId)))
    .leftJoin(tech, eq(tech.id, serviceCalls.technicianId));
}

export type CallView = Awaited<ReturnType<typeof getCall>> & {};

export async function getCall(tx: Tx, id: string) {
  const [c] = await fromCalls(tx, callColumns).where(and(eq(serviceCalls.tenantId, currentTenant), eq(serviceCalls.id, id)));
  return c;
}

/** The raw row, with the reporter's phone (never sent to the browser). */
export async function getCallRow(tx: Tx, id: string) {
  const [c] = await tx
    .select()
    .from(serviceCalls)
    .where(and(eq(serviceCalls.tenantId, currentTenant), eq(serviceCalls.id, id)));
  return c;
}

const sortKeys: Record<'openedAt' | 'targetAt', SortKey> = {
  openedAt: { expr: sql`${serviceCalls.openedAt}`, type: 'timestamptz' },
  targetAt: { expr: sql`${serviceCalls.targetAt}`, type: 'timestamptz' },
};

export interface CallListParams {
  q?: string;
  sort: keyof typeof sortKeys;
  order: 'asc' | 'desc';
  cursor?: string;
  limit: number;
  state: 'open' | 'all' | CallState;
  venueId?: string;
  gameId?: string;
  problem?: CallRow['problem'];
  technicianId?: string | 'none';
  /** Venue contacts see only their venues' calls. */
  onlyVenueIds?: string[];
}

export async function listCalls(tx: Tx, p: CallListParams) {
  const key = sortKeys[p.sort];
  const like = p.q ? `%${escapeLike(p.q)}%` : undefined;
  const filters: (SQL | undefined)[] = [
    eq(serviceCalls.tenantId, currentTenant),
    p.state === 'open' ? inArray(serviceCalls.state, OPEN_STATES) : p.state === 'all' ? undefined : eq(serviceCalls.state, p.state),
    p.venueId ? eq(serviceCalls.venueId, p.venueId) : undefined,
    p.gameId ? eq(serviceCalls.gameId, p.gameId) : undefined,
    p.problem ? eq(serviceCalls.problem, p.problem) : undefined,
    p.technicianId === 'none'
      ? isNull(serviceCalls.technicianId)
      : p.technicianId
        ? eq(serviceCalls.technicianId, p.technicianId)
        : undefined,
    p.onlyVenueIds ? (p.onlyVenueIds.length ? inArray(serviceCalls.venueId, p.onlyVenueIds) : sql`false`) : undefined,
    like
      ? sql`(${gameModels.title} ilike ${like} or ${venues.name} ilike ${like} or ${games.serial} ilike ${like} or ${serviceCalls.note} ilike ${like})`
      : undefined,
    keysetWhere(key, serviceCalls.id, p.order, decodeCursor(p.cursor)),
  ];
  const rows = (await fromCalls(tx, { ...callColumns, sortValue: sql<string>`${key.expr}::text` })
    .where(and(...filters))
    .orderBy(...keysetOrder(key, serviceCalls.id, p.order))
    .limit(p.limit + 1)) as unknown as (CallView & { sortValue: string })[];
  return toPage(rows, p.limit);
}

/** An unfixed call on this game, which a new report should join rather than open a second one. */
export async function findUnfixedCallForGame(tx: Tx, gameId: string) {
  const [c] = await tx
    .select({ id: serviceCalls.id })
    .from(serviceCalls)
    .where(and(eq(serviceCalls.tenantId, currentTenant), eq(serviceCalls.gameId, gameId), inArray(serviceCalls.state, UNFIXED_STATES)))
    .orderBy(asc(serviceCalls.openedAt))
    .limit(1);
  return c?.id;
}

export function newStatusToken(): string {
  return randomBytes(18).toString('base64url');
}

export async function insertCall(tx: Tx, values: Omit<typeof serviceCalls.$inferInsert, 'tenantId' | 'statusToken'>) {
  const [c] = await tx
    .insert(serviceCalls)
    .values({ ...values, tenantId: sql`${currentTenant}`, statusToken: newStatusToken() })
    .returning({ id: serviceCalls.id, statusToken: serviceCalls.statusToken });
  return c!;
}

/** Applies the change only at `version` (optimistic concurrency); undefined when someone else got there first. */
export async function updateCall(tx: Tx, id: string, version: number, patch: Partial<typeof serviceCalls.$inferInsert>) {
  const [c] = await tx
    .update(serviceCalls)
    .set({ ...patch, version: sql`${serviceCalls.version} + 1`, updatedAt: new Date() })
    .where(and(eq(serviceCalls.tenantId, currentTenant), eq(serviceCalls.id, id), eq(serviceCalls.version, version)))
    .returning({ id: serviceCalls.id, version: serviceCalls.version });
  return c;
}

export async function insertEvent(tx: Tx, e: Omit<typeof callEvents.$inferInsert, 'tenantId'>) {
  await tx.insert(callEvents).values({ ...e, tenantId: sql`${currentTenant}` });
}

export async function listEvents(tx: Tx, callId: string) {
  return tx
    .select({
      id: callEvents.id,
      at: callEvents.at,
      kind: callEvents.kind,
      actorName: users.name,
      actorLabel: callEvents.actorLabel,
      fromState: callEvents.fromState,
      toState: callEvents.toState,
      detail: callEvents.detail,
    })
    .from(callEvents)
    .leftJoin(users, eq(users.id, callEvents.actorUserId))
    .where(and(eq(callEvents.tenantId, currentTenant), eq(callEvents.callId, callId)))
    .orderBy(asc(callEvents.at), asc(callEvents.id));
}

export async function openDowntime(tx: Tx, gameId: string, callId: string, at: Date) {
  const [open] = await tx
    .select({ id: downtimeIntervals.id })
    .from(downtimeIntervals)
    .where(and(eq(downtimeIntervals.tenantId, currentTenant), eq(downtimeIntervals.gameId, gameId), isNull(downtimeIntervals.endedAt)));
  if (open) return; // already down: one interval covers overlapping calls
  await tx.insert(downtimeIntervals).values({ tenantId: sql`${currentTenant}`, gameId, callId, startedAt: at });
}

export async function closeDowntime(tx: Tx, gameId: string, at: Date) {
  await tx
    .update(downtimeIntervals)
    .set({ endedAt: at })
    .where(and(eq(downtimeIntervals.tenantId, currentTenant), eq(downtimeIntervals.gameId, gameId), isNull(downtimeIntervals.endedAt)));
}

export async function listDowntime(tx: Tx, gameId: string) {
  return tx
    .select({
      id: downtimeIntervals.id,
      callId: downtimeIntervals.callId,
      startedAt: downtimeIntervals.startedAt,
      endedAt: downtimeIntervals.endedAt,
    })
    .from(downtimeIntervals)
    .where(and(eq(downtimeIntervals.tenantId, currentTenant), eq(downtimeIntervals.gameId, gameId)))
    .orderBy(desc(downtimeIntervals.startedAt));
}

export async function countUnfixedCallsForGame(tx: Tx, gameId: string, severity?: CallRow['severity']) {
  const [r] = await tx
    .select({ n: sql<number>`count(*)::int` })
    .from(serviceCalls)
    .where(
      and(
        eq(serviceCalls.tenantId, currentTenant),
        eq(serviceCalls.gameId, gameId),
        inArray(serviceCalls.state, UNFIXED_STATES),
        severity ? eq(serviceCalls.severity, severity) : undefined,
      ),
    );
  return r?.n ?? 0;
}

export async function enqueueMessage(tx: Tx, m: { channel: 'sms' | 'email'; to: string; subject?: string; body: string; callId?: string }) {
  await tx.insert(outbox).values({
    tenantId: sql`${currentTenant}`,
    channel: m.channel,
    toAddress: m.to,
    subject: m.subject ?? '',
    body: m.body,
    callId: m.callId,
  });
}

export async function listCallMessages(tx: Tx, callId: string) {
  return tx
    .select({
      id: outbox.id,
      channel: outbox.channel,
      toAddress: outbox.toAddress,
      subject: outbox.subject,
      body: outbox.body,
      status: outbox.status,
      providerStatus: outbox.providerStatus,
      createdAt: outbox.createdAt,
      sentAt: outbox.sentAt,
    })
    .from(outbox)
    .where(and(eq(outbox.tenantId, currentTenant), eq(outbox.callId, callId)))
    .orderBy(asc(outbox.createdAt));
}

export async function getSettings(tx: Tx) {
  const [s] = await tx.select().from(tenantSettings).where(eq(tenantSettings.tenantId, currentTenant));
  if (s) return s;
  const [created] = await tx
    .insert(tenantSettings)
    .values({ tenantId: sql`${currentTenant}` })
    .onConflictDoNothing()
    .returning();
  return created ?? (await tx.select().from(tenantSettings).where(eq(tenantSettings.tenantId, currentTenant)))[0]!;
}

export async function updateSettings(tx: Tx, patch: Partial<typeof tenantSettings.$inferInsert>) {
  await getSettings(tx);
  const [s] = await tx.update(tenantSettings).set(patch).where(eq(tenantSettings.tenantId, currentTenant)).returning();
  return s!;
}

/** Technicians of the company with their skills, home base, phone and open load. */
export async function listTechnicians(tx: Tx) {
  return tx
    .select({
      userId: users.id,
      name: users.name,
      phone: users.phone,
      skills: sql<string[]>`coalesce(${technicianProfiles.skills}, '{}'::text[])`,
      homeLatitude: technicianProfiles.homeLatitude,
      homeLongitude: technicianProfiles.homeLongitude,
      openCalls: sql<number>`(select count(*)::int from service_calls c where c.tenant_id = "memberships"."tenant_id" and c.technician_id = "users"."id" and c.state in ('assigned','on_the_way','on_site','waiting_parts'))`,
    })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .leftJoin(technicianProfiles, and(eq(technicianProfiles.tenantId, memberships.tenantId), eq(technicianProfiles.userId, users.id)))
    .where(and(eq(memberships.tenantId, currentTenant), eq(memberships.role, 'technician')))
    .orderBy(users.name);
}

export async function isTechnician(tx: Tx, userId: string) {
  const [m] = await tx
    .select({ role: memberships.role })
    .from(memberships)
    .where(and(eq(memberships.tenantId, currentTenant), eq(memberships.userId, userId)));
  return m?.role === 'technician';
}

/** E-mail addresses of a venue's contacts (people linked to it, and the venue's own contact address). */
export async function venueContactEmails(tx: Tx, venueId: string): Promise<string[]> {
  const linked = await tx
    .select({ email: users.email })
    .from(venueContacts)
    .innerJoin(users, eq(users.id, venueContacts.userId))
    .where(and(eq(venueContacts.tenantId, currentTenant), eq(venueContacts.venueId, venueId)));
  const [v] = await tx
    .select({ email: venues.contactEmail })
    .from(venues)
    .where(and(eq(venues.tenantId, currentTenant), eq(venues.id, venueId)));
  return [...new Set([...linked.map((l) => l.email.toLowerCase()), ...(v?.email ? [v.email.toLowerCase()] : [])])];
}

export async function venueIdsOfContact(tx: Tx, userId: string): Promise<string[]> {
  const rows = await tx
    .select({ venueId: venueContacts.venueId })
    .from(venueContacts)
    .where(and(eq(venueContacts.tenantId, currentTenant), eq(venueContacts.userId, userId)));
  return rows.map((r) => r.venueId);
}

export async function insertPhoto(tx: Tx, p: Omit<typeof callPhotos.$inferInsert, 'tenantId'>) {
  const [row] = await tx
    .insert(callPhotos)
    .values({ ...p, tenantId: sql`${currentTenant}` })
    .returning({ id: callPhotos.id });
  return row!.id;
}

export async function listPhotos(tx: Tx, callId: string) {
  return tx
    .select({
      id: callPhotos.id,
      width: callPhotos.width,
      height: callPhotos.height,
      createdAt: callPhotos.createdAt,
      uploadedBy: callPhotos.uploadedBy,
    })
    .from(callPhotos)
    .where(and(eq(callPhotos.tenantId, currentTenant), eq(callPhotos.callId, callId)))
    .orderBy(asc(callPhotos.createdAt));
}

export async function getPhoto(tx: Tx, id: string) {
  const [p] = await tx
    .select()
    .from(callPhotos)
    .where(and(eq(callPhotos.tenantId, currentTenant), eq(callPhotos.id, id)));
  return p;
}
