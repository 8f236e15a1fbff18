// Game tags: the unguessable token a QR sticker on a cabinet carries. Staff read and print tags inside
// their company; a public report page starts from the token alone and finds the game's company through
// a narrow SECURITY DEFINER function (drizzle/0003_…), then works inside that company's scope.
import { randomBytes } from 'node:crypto';
import { and, asc, eq, isNull, sql } from 'drizzle-orm';
import { withScope, type Db, type Tx } from '../client.ts';
import { gameModels, games } from '../schema/index.ts';
import { currentTenant } from '../schema/rls.ts';

export function newTagToken(): string {
  return randomBytes(18).toString('base64url');
}

/** The game tag's token: for staff screens only, never in lists. */
export async function getTagToken(tx: Tx, id: string) {
  const [g] = await tx
    .select({ tagToken: games.tagToken })
    .from(games)
    .where(and(eq(games.tenantId, currentTenant), eq(games.id, id)));
  return g?.tagToken;
}

/** What replacing a game's tag needs to know: its current token, version, and whether it is retired. */
export async function getTagState(tx: Tx, id: string) {
  const [g] = await tx
    .select({ tagToken: games.tagToken, version: games.version, retiredAt: games.retiredAt })
    .from(games)
    .where(and(eq(games.tenantId, currentTenant), eq(games.id, id)));
  return g;
}

/** The tags of a venue's active games, for its printable sheet. */
export async function listVenueTags(tx: Tx, venueId: string) {
  return tx
    .select({ title: gameModels.title, serial: games.serial, tagToken: games.tagToken })
    .from(games)
    .innerJoin(gameModels, and(eq(gameModels.tenantId, games.tenantId), eq(gameModels.id, games.modelId)))
    .where(and(eq(games.tenantId, currentTenant), eq(games.venueId, venueId), isNull(games.retiredAt)))
    .orderBy(asc(gameModels.title), asc(games.serial));
}

export interface TaggedGame {
  tenantId: string;
  gameId: string;
  title: string;
  venueName: string | null;
  retired: boolean;
}

/** The game a tag token belongs to, in whichever company; undefined for an unknown token. */
export async function findGameByTag(db: Db, token: string): Promise<TaggedGame | undefined> {
  const r = await withScope(db, {}, (tx) =>
    tx.execute<{ tenant_id: string; game_id: string; title: string; venue_name: string | null; retired: boolean }>(
      sql`select * from game_by_tag(${token})`,
    ),
  );
  const row = r.rows[0];
  return row && { tenantId: row.tenant_id, gameId: row.game_id, title: row.title, venueName: row.venue_name, retired: row.retired };
}
