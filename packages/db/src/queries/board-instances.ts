// Boards fitted in games: one game's boards, one board, the company's whole fleet (for the recap list), and the
// electrolytics on their parts lists that set each board's recap date.
import { and, asc, eq, inArray, isNull, sql } from 'drizzle-orm';
import type { Tx } from '../client.ts';
import { boardInstances, boardParts, cabinetProfiles, gameModels, games, modelBoards, venues, type CabinetSlice } from '../schema/index.ts';
import { currentTenant } from '../schema/rls.ts';
import { updateAtVersion } from './versioned-update.ts';

const instanceColumns = {
  id: boardInstances.id,
  boardId: boardInstances.boardId,
  boardName: modelBoards.name,
  boardPartNumber: modelBoards.partNumber,
  model: { id: gameModels.id, maker: gameModels.maker, title: gameModels.title },
  gameId: boardInstances.gameId,
  gameSerial: games.serial,
  serial: boardInstances.serial,
  dateCode: boardInstances.dateCode,
  madeOn: boardInstances.madeOn,
  dateCodeFlag: boardInstances.dateCodeFlag,
  lastRecapOn: boardInstances.lastRecapOn,
  notes: boardInstances.notes,
  version: boardInstances.version,
  createdAt: boardInstances.createdAt,
  updatedAt: boardInstances.updatedAt,
};

/** Instances with their board and model (a board belongs to one model) and the game they are in, if any. */
function fromInstances(tx: Tx) {
  return tx
    .select(instanceColumns)
    .from(boardInstances)
    .innerJoin(modelBoards, and(eq(modelBoards.tenantId, boardInstances.tenantId), eq(modelBoards.id, boardInstances.boardId)))
    .innerJoin(gameModels, and(eq(gameModels.tenantId, modelBoards.tenantId), eq(gameModels.id, modelBoards.modelId)))
    .leftJoin(games, and(eq(games.tenantId, boardInstances.tenantId), eq(games.id, boardInstances.gameId)));
}

export type BoardInstanceRow = Awaited<ReturnType<typeof getBoardInstance>> & {};

/** The boards in one game (board_instances_tenant_game_idx), by board name then serial. */
export async function listBoardInstancesOfGame(tx: Tx, gameId: string) {
  return fromInstances(tx)
    .where(and(eq(boardInstances.tenantId, currentTenant), eq(boardInstances.gameId, gameId)))
    .orderBy(asc(modelBoards.name), asc(boardInstances.serial), asc(boardInstances.id));
}

export async function getBoardInstance(tx: Tx, id: string) {
  const [row] = await fromInstances(tx).where(and(eq(boardInstances.tenantId, currentTenant), eq(boardInstances.id, id)));
  return row;
}

export async function insertBoardInstance(
  tx: Tx,
  values: Omit<typeof boardInstances.$inferInsert, 'tenantId' | 'id' | 'version' | 'createdAt' | 'updatedAt'>,
) {
  const [row] = await tx
    .insert(boardInstances)
    .values({ ...values, tenantId: sql`${currentTenant}` })
    .returning({ id: boardInstances.id });
  return row!.id;
}

export async function updateBoardInstance(tx: Tx, id: string, version: number, patch: Partial<typeof boardInstances.$inferInsert>) {
  return (await updateAtVersion(tx, boardInstances, id, version, patch))?.id;
}

/**
 * Every board of the company with its game, venue and the game's cabinet day (null without a profile), for the
 * recap list: one pass over the company's boards (they are judged in the service, so every one is read; a few
 * thousand rows). The venue's name and the cabinet day are sub-selects by key: joined, or read on their own, a large
 * company's venues and profiles are a big enough share of all that the planner reads every company's rows.
 */
export async function listFleetBoardInstances(tx: Tx) {
  return tx
    .select({
      id: boardInstances.id,
      boardId: boardInstances.boardId,
      boardName: modelBoards.name,
      boardPartNumber: modelBoards.partNumber,
      modelTitle: gameModels.title,
      gameId: boardInstances.gameId,
      gameSerial: games.serial,
      venueId: games.venueId,
      venueName: sql<
        string | null
      >`(select ${venues.name} from ${venues} where ${venues.tenantId} = ${games.tenantId} and ${venues.id} = ${games.venueId})`,
      serial: boardInstances.serial,
      dateCode: boardInstances.dateCode,
      madeOn: boardInstances.madeOn,
      dateCodeFlag: boardInstances.dateCodeFlag,
      lastRecapOn: boardInstances.lastRecapOn,
      cabinetSlices: sql<
        CabinetSlice[] | null
      >`(select ${cabinetProfiles.slices} from ${cabinetProfiles} where ${cabinetProfiles.tenantId} = ${boardInstances.tenantId} and ${cabinetProfiles.gameId} = ${boardInstances.gameId})`,
    })
    .from(boardInstances)
    .innerJoin(modelBoards, and(eq(modelBoards.tenantId, boardInstances.tenantId), eq(modelBoards.id, boardInstances.boardId)))
    .innerJoin(gameModels, and(eq(gameModels.tenantId, modelBoards.tenantId), eq(gameModels.id, modelBoards.modelId)))
    .leftJoin(games, and(eq(games.tenantId, boardInstances.tenantId), eq(games.id, boardInstances.gameId)))
    .where(eq(boardInstances.tenantId, currentTenant));
}

/** The electrolytics on these boards' parts lists (still on the list), by board: what a recap replaces. */
export async function listElectrolyticsOfBoards(tx: Tx, boardIds: readonly string[]) {
  if (boardIds.length === 0) return [];
  return tx
    .select({
      boardId: boardParts.boardId,
      designator: boardParts.designator,
      value: boardParts.value,
      rating: boardParts.rating,
      ratedTemperatureC: boardParts.ratedTemperatureC,
      ratedLifeHours: boardParts.ratedLifeHours,
    })
    .from(boardParts)
    .where(
      and(
        eq(boardParts.tenantId, currentTenant),
        inArray(boardParts.boardId, [...new Set(boardIds)]),
        eq(boardParts.kind, 'electrolytic'),
        isNull(boardParts.removedAt),
      ),
    )
    .orderBy(asc(boardParts.boardId), asc(boardParts.position));
}

/**
 * A board's parts list for its history page: every part still on the list, and any taken off since on which
 * this board has readings (their history stays). By position.
 */
export async function listPartsForBoardHistory(tx: Tx, boardId: string, boardInstanceId: string) {
  return tx
    .select({
      partId: boardParts.id,
      designator: boardParts.designator,
      kind: boardParts.kind,
      value: boardParts.value,
      tolerance: boardParts.tolerance,
      rating: boardParts.rating,
      ratedTemperatureC: boardParts.ratedTemperatureC,
      ratedLifeHours: boardParts.ratedLifeHours,
      removedAt: boardParts.removedAt,
    })
    .from(boardParts)
    .where(
      and(
        eq(boardParts.tenantId, currentTenant),
        eq(boardParts.boardId, boardId),
        sql`(${boardParts.removedAt} is null or exists (select 1 from part_readings r where r.tenant_id = ${boardParts.tenantId} and r.board_instance_id = ${boardInstanceId} and r.part_id = ${boardParts.id}))`,
      ),
    )
    .orderBy(asc(boardParts.position), asc(boardParts.designator));
}
