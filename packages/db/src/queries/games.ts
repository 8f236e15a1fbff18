// Game and game-model queries, scoped by the caller's tenant transaction.
import { and, eq, inArray, isNull, sql, type SQL } from 'drizzle-orm';
import type { Tx } from '../client.ts';
import { gameModels, games, venues } from '../schema/index.ts';
import { currentTenant } from '../schema/rls.ts';
import { escapeLike } from './venues.ts';
import { decodeCursor, keysetOrder, keysetWhere, toPage, type SortKey } from './keyset.ts';
import { newTagToken } from './game-tags.ts';
import { updateAtVersion } from './versioned-update.ts';

/** A game's venue name, looked up by key (null for a game in storage). */
const venueNameOfGame = sql<string | null>`(select v.name from venues v where v.tenant_id = ${games.tenantId} and v.id = ${games.venueId})`;

const sortKeys: Record<'title' | 'serial' | 'status' | 'venue' | 'createdAt', SortKey> = {
  title: { expr: sql`lower(${gameModels.title})`, type: 'text' },
  serial: { expr: sql`lower(${games.serial})`, type: 'text' },
  status: { expr: sql`${games.status}::text`, type: 'text' },
  venue: { expr: sql`lower(coalesce(${venueNameOfGame}, ''))`, type: 'text' },
  createdAt: { expr: sql`${games.createdAt}`, type: 'timestamptz' },
};

export const gameColumns = {
  id: games.id,
  modelId: games.modelId,
  venueId: games.venueId,
  serial: games.serial,
  status: games.status,
  installedOn: games.installedOn,
  pricePerPlayCents: games.pricePerPlayCents,
  notes: games.notes,
  version: games.version,
  createdAt: games.createdAt,
  updatedAt: games.updatedAt,
  retiredAt: games.retiredAt,
  venueName: venues.name,
  model: {
    id: gameModels.id,
    maker: gameModels.maker,
    title: gameModels.title,
    kind: gameModels.kind,
    year: gameModels.year,
  },
};

export interface GameListParams {
  q?: string;
  sort: keyof typeof sortKeys;
  order: 'asc' | 'desc';
  cursor?: string;
  limit: number;
  includeRetired?: boolean;
  venueId?: string;
  status?: (typeof games.$inferSelect)['status'];
  kind?: (typeof gameModels.$inferSelect)['kind'];
}

function fromGames(tx: Tx, columns: Record<string, unknown>) {
  return tx
    .select(columns as typeof gameColumns)
    .from(games)
    .innerJoin(gameModels, and(eq(gameModels.tenantId, games.tenantId), eq(gameModels.id, games.modelId)))
    .leftJoin(venues, and(eq(venues.tenantId, games.tenantId), eq(venues.id, games.venueId)));
}

export async function listGames(tx: Tx, p: GameListParams) {
  const key = sortKeys[p.sort];
  const like = p.q ? `%${escapeLike(p.q)}%` : undefined;
  const filters: (SQL | undefined)[] = [
    eq(games.tenantId, currentTenant),
    p.includeRetired ? undefined : isNull(games.retiredAt),
    p.venueId ? eq(games.venueId, p.venueId) : undefined,
    p.status ? eq(games.status, p.status) : undefined,
    p.kind ? eq(gameModels.kind, p.kind) : undefined,
    like
      ? sql`(${games.serial} ilike ${like} or ${gameModels.title} ilike ${like} or ${gameModels.maker} ilike ${like} or ${venueNameOfGame} ilike ${like})`
      : undefined,
    keysetWhere(key, games.id, p.order, decodeCursor(p.cursor)),
  ];
  // No join with venues: the name is a sub-select, which PostgreSQL runs for the page's rows only, after
  // the sort and limit (a join read every venue of a large company to keep fifty games).
  const rows = (await tx
    .select({ ...gameColumns, venueName: venueNameOfGame, sortValue: sql<string>`${key.expr}::text` } as unknown as typeof gameColumns)
    .from(games)
    .innerJoin(gameModels, and(eq(gameModels.tenantId, games.tenantId), eq(gameModels.id, games.modelId)))
    .where(and(...filters))
    .orderBy(...keysetOrder(key, games.id, p.order))
    .limit(p.limit + 1)) as unknown as (GameRow & { sortValue: string })[];
  return toPage(rows, p.limit);
}

export type GameRow = Awaited<ReturnType<typeof getGame>> & {};

export async function getGame(tx: Tx, id: string) {
  const [g] = await fromGames(tx, gameColumns).where(and(eq(games.tenantId, currentTenant), eq(games.id, id)));
  return g;
}

export async function insertGame(tx: Tx, values: Omit<typeof games.$inferInsert, 'tenantId' | 'tagToken'>) {
  const [g] = await tx
    .insert(games)
    .values({ ...values, tenantId: sql`${currentTenant}`, tagToken: newTagToken() })
    .returning({ id: games.id });
  return g!.id;
}

export async function updateGame(tx: Tx, id: string, version: number, patch: Partial<typeof games.$inferInsert>) {
  return (await updateAtVersion(tx, games, id, version, patch))?.id;
}

/** The venue a game stands at (null when in storage); undefined for no such game. */
export async function getGameVenueId(tx: Tx, id: string) {
  const [g] = await tx
    .select({ venueId: games.venueId })
    .from(games)
    .where(and(eq(games.tenantId, currentTenant), eq(games.id, id)));
  return g?.venueId;
}

/** The active games at these venues with their status, for a venue contact's view. */
export async function listGamesAtVenues(tx: Tx, venueIds: string[]) {
  if (venueIds.length === 0) return [];
  return tx
    .select({
      id: games.id,
      venueId: games.venueId,
      serial: games.serial,
      status: games.status,
      title: gameModels.title,
      kind: gameModels.kind,
    })
    .from(games)
    .innerJoin(gameModels, and(eq(gameModels.tenantId, games.tenantId), eq(gameModels.id, games.modelId)))
    .where(and(eq(games.tenantId, currentTenant), inArray(games.venueId, venueIds), isNull(games.retiredAt)))
    .orderBy(gameModels.title);
}

export async function listModels(tx: Tx) {
  return tx
    .select({ id: gameModels.id, maker: gameModels.maker, title: gameModels.title, kind: gameModels.kind, year: gameModels.year })
    .from(gameModels)
    .where(eq(gameModels.tenantId, currentTenant))
    .orderBy(gameModels.maker, gameModels.title);
}

export async function getModel(tx: Tx, id: string) {
  const [m] = await tx
    .select({ id: gameModels.id, maker: gameModels.maker, title: gameModels.title, kind: gameModels.kind, year: gameModels.year })
    .from(gameModels)
    .where(and(eq(gameModels.tenantId, currentTenant), eq(gameModels.id, id)));
  return m;
}

export async function insertModel(tx: Tx, values: Omit<typeof gameModels.$inferInsert, 'tenantId'>) {
  const [m] = await tx
    .insert(gameModels)
    .values({ ...values, tenantId: sql`${currentTenant}` })
    .onConflictDoNothing()
    .returning({ id: gameModels.id });
  return m?.id;
}

/** How many active games are in each status right now. */
export async function countGamesByStatus(tx: Tx) {
  const rows = await tx
    .select({ status: games.status, n: sql<number>`count(*)::int` })
    .from(games)
    .where(and(eq(games.tenantId, currentTenant), isNull(games.retiredAt)))
    .groupBy(games.status);
  return Object.fromEntries(rows.map((r) => [r.status, r.n])) as Partial<Record<(typeof games.$inferSelect)['status'], number>>;
}
