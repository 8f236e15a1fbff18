// Service-call queries, scoped by the caller's tenant transaction; and the status-link lookup, which finds a
// call's company from its token before any scope is known.
import { randomBytes } from 'node:crypto';
import { and, asc, desc, eq, inArray, isNull, lte, sql, type SQL } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import { withScope, type Db, type Tx } from '../client.ts';
import { gameModels, games, serviceCalls, users, venues } from '../schema/index.ts';
import { currentTenant } from '../schema/rls.ts';
import { callStateGroups } from '@bumperline/contracts/calls';
import { decodeCursor, keysetOrder, keysetWhere, toPage, type SortKey } from './keyset.ts';
import { escapeLike } from './venues.ts';
import { updateAtVersion } from './versioned-update.ts';

type CallRow = typeof serviceCalls.$inferSelect;
type CallState = CallRow['state'];

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
    p.state === 'open'
      ? inArray(serviceCalls.state, [...callStateGroups.open])
      : p.state === 'all'
        ? undefined
        : eq(serviceCalls.state, p.state),
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
      ? sql`(${serviceCalls.note} ilike ${like}
          or exists (select 1 from games g join game_models m on m.tenant_id = g.tenant_id and m.id = g.model_id
                     where g.tenant_id = ${serviceCalls.tenantId} and g.id = ${serviceCalls.gameId} and (m.title ilike ${like} or g.serial ilike ${like}))
          or exists (select 1 from venues v where v.tenant_id = ${serviceCalls.tenantId} and v.id = ${serviceCalls.venueId} and v.name ilike ${like}))`
      : undefined,
    keysetWhere(key, serviceCalls.id, p.order, decodeCursor(p.cursor)),
  ];
  // The page is chosen from the calls table alone (an index in list order, stopping at the page), then
  // only its rows are joined with their game, venue and technician. Joined first, PostgreSQL would read
  // every game and venue of a large company to show fifty calls.
  const page = tx
    .select({ id: serviceCalls.id })
    .from(serviceCalls)
    .where(and(...filters))
    .orderBy(...keysetOrder(key, serviceCalls.id, p.order))
    .limit(p.limit + 1);
  const rows = (await fromCalls(tx, { ...callColumns, sortValue: sql<string>`${key.expr}::text` })
    .where(and(eq(serviceCalls.tenantId, currentTenant), sql`${serviceCalls.id} = any(array(${page}))`))
    .orderBy(...keysetOrder(key, serviceCalls.id, p.order))) as unknown as (CallView & { sortValue: string })[];
  return toPage(rows, p.limit);
}

/** An unfixed call on this game, which a new report should join rather than open a second one. */
export async function findUnfixedCallForGame(tx: Tx, gameId: string) {
  const [c] = await tx
    .select({ id: serviceCalls.id })
    .from(serviceCalls)
    .where(
      and(
        eq(serviceCalls.tenantId, currentTenant),
        eq(serviceCalls.gameId, gameId),
        inArray(serviceCalls.state, [...callStateGroups.unfixed]),
      ),
    )
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
  return updateAtVersion(tx, serviceCalls, id, version, patch);
}

export async function countUnfixedCallsForGame(tx: Tx, gameId: string, severity?: CallRow['severity']) {
  const [r] = await tx
    .select({ n: sql<number>`count(*)::int` })
    .from(serviceCalls)
    .where(
      and(
        eq(serviceCalls.tenantId, currentTenant),
        eq(serviceCalls.gameId, gameId),
        inArray(serviceCalls.state, [...callStateGroups.unfixed]),
        severity ? eq(serviceCalls.severity, severity) : undefined,
      ),
    );
  return r?.n ?? 0;
}

/**
 * The call a status link belongs to, in whichever company: the token names no company, so a narrow
 * SECURITY DEFINER function (drizzle/0003_…) finds it.
 */
export async function findCallByStatusToken(db: Db, token: string): Promise<{ tenantId: string; callId: string } | undefined> {
  const r = await withScope(db, {}, (tx) =>
    tx.execute<{ tenant_id: string; call_id: string }>(sql`select * from call_by_status_token(${token})`),
  );
  const row = r.rows[0];
  return row && { tenantId: row.tenant_id, callId: row.call_id };
}

/** The technician's newest call still waiting for their answer to the assignment. */
export async function findNewestPendingAssignment(tx: Tx, technicianId: string) {
  const [c] = await tx
    .select({ id: serviceCalls.id, at: serviceCalls.updatedAt })
    .from(serviceCalls)
    .where(
      and(
        eq(serviceCalls.tenantId, currentTenant),
        eq(serviceCalls.technicianId, technicianId),
        eq(serviceCalls.state, 'assigned'),
        isNull(serviceCalls.acceptedAt),
      ),
    )
    .orderBy(desc(serviceCalls.updatedAt))
    .limit(1);
  return c;
}

/** Locks the call for the rest of the transaction and reads its assignment afresh. */
export async function lockAssignment(tx: Tx, id: string) {
  const [c] = await tx
    .select({ state: serviceCalls.state, technicianId: serviceCalls.technicianId, acceptedAt: serviceCalls.acceptedAt })
    .from(serviceCalls)
    .where(and(eq(serviceCalls.tenantId, currentTenant), eq(serviceCalls.id, id)))
    .for('update');
  return c;
}

/**
 * Calls in one of `states` whose target falls by `dueBy` and that nobody was warned about yet, locked with
 * SKIP LOCKED: a call another run is warning about right now is left to it (one warning per call).
 */
export async function lockCallsToWarn(tx: Tx, p: { states: readonly CallState[]; dueBy: Date }) {
  return tx
    .select({ id: serviceCalls.id, targetAt: serviceCalls.targetAt })
    .from(serviceCalls)
    .where(
      and(
        eq(serviceCalls.tenantId, currentTenant),
        inArray(serviceCalls.state, [...p.states]),
        isNull(serviceCalls.warnedAt),
        lte(serviceCalls.targetAt, p.dueBy),
      ),
    )
    .orderBy(serviceCalls.targetAt)
    .for('update', { skipLocked: true });
}

/** Bookkeeping only: the version stays, so a dispatcher editing the call meanwhile is not turned away. */
export async function markCallWarned(tx: Tx, id: string, at: Date): Promise<void> {
  await tx
    .update(serviceCalls)
    .set({ warnedAt: at })
    .where(and(eq(serviceCalls.tenantId, currentTenant), eq(serviceCalls.id, id)));
}
