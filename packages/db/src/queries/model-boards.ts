// A game model's boards ("Power supply", "Sound board"), scoped by the caller's tenant transaction. The board's
// version guards its parts list (board-parts.ts): a save moves it on, so two editors cannot overwrite each other.
import { and, eq, isNull, ne, sql, type SQL } from 'drizzle-orm';
import type { Tx } from '../client.ts';
import { boardParts, modelBoards } from '../schema/index.ts';
import { currentTenant } from '../schema/rls.ts';
import { updateAtVersion } from './versioned-update.ts';

export interface ModelBoardFields {
  name: string;
  partNumber: string;
  notes: string;
}

/**
 * The boards matching `where`, each with the number of parts on its list now: one grouped pass over the parts of
 * the boards `partsOf` names (all of the company's when it names none).
 */
function boardsWithCounts(tx: Tx, where: SQL | undefined, partsOf?: SQL) {
  const counts = tx
    .select({ boardId: boardParts.boardId, n: sql<number>`count(*)::int`.as('n') })
    .from(boardParts)
    .where(and(eq(boardParts.tenantId, currentTenant), isNull(boardParts.removedAt), partsOf))
    .groupBy(boardParts.boardId)
    .as('counts');
  return tx
    .select({
      id: modelBoards.id,
      modelId: modelBoards.modelId,
      name: modelBoards.name,
      partNumber: modelBoards.partNumber,
      notes: modelBoards.notes,
      version: modelBoards.version,
      partCount: sql<number>`coalesce(${counts.n}, 0)`,
      updatedAt: modelBoards.updatedAt,
    })
    .from(modelBoards)
    .leftJoin(counts, eq(counts.boardId, modelBoards.id))
    .where(and(eq(modelBoards.tenantId, currentTenant), where))
    .orderBy(modelBoards.modelId, modelBoards.name);
}

export type ModelBoardRow = Awaited<ReturnType<typeof boardsWithCounts>>[number];

/** A model's boards by name, with their part counts. */
export function listModelBoards(tx: Tx, modelId: string): Promise<ModelBoardRow[]> {
  return boardsWithCounts(
    tx,
    eq(modelBoards.modelId, modelId),
    sql`${boardParts.boardId} in (select b.id from model_boards b where b.tenant_id = ${currentTenant} and b.model_id = ${modelId})`,
  );
}

/** Every board of the company (by model, then name), with their part counts: the parts-lists overview. */
export function listAllModelBoards(tx: Tx): Promise<ModelBoardRow[]> {
  return boardsWithCounts(tx, undefined);
}

export async function getModelBoard(tx: Tx, id: string): Promise<ModelBoardRow | undefined> {
  const [board] = await boardsWithCounts(tx, eq(modelBoards.id, id), eq(boardParts.boardId, id));
  return board;
}

/** Whether the model has another board of this name (a model's board names are unique). */
export async function boardNameTaken(tx: Tx, modelId: string, name: string, exceptId?: string): Promise<boolean> {
  const [row] = await tx
    .select({ id: modelBoards.id })
    .from(modelBoards)
    .where(
      and(
        eq(modelBoards.tenantId, currentTenant),
        eq(modelBoards.modelId, modelId),
        eq(modelBoards.name, name),
        exceptId ? ne(modelBoards.id, exceptId) : undefined,
      ),
    );
  return !!row;
}

/** A new board; undefined when the model already has a board of that name. */
export async function insertModelBoard(tx: Tx, values: ModelBoardFields & { modelId: string }): Promise<string | undefined> {
  const [row] = await tx
    .insert(modelBoards)
    .values({ ...values, tenantId: sql`${currentTenant}` })
    .onConflictDoNothing()
    .returning({ id: modelBoards.id });
  return row?.id;
}

/** Renames a board (or changes its part number or notes). Leaves the version alone: it guards the parts list. */
export async function updateModelBoard(tx: Tx, id: string, patch: Partial<ModelBoardFields>): Promise<boolean> {
  const rows = await tx
    .update(modelBoards)
    .set({ ...patch, updatedAt: new Date() })
    .where(and(eq(modelBoards.tenantId, currentTenant), eq(modelBoards.id, id)))
    .returning({ id: modelBoards.id });
  return rows.length > 0;
}

/**
 * Moves the parts list's version on from `version`, locking the board until the transaction ends, so saves of
 * one list run one after the other; undefined when someone else saved since (or the board is gone).
 */
export async function claimPartsListVersion(tx: Tx, id: string, version: number): Promise<number | undefined> {
  return (await updateAtVersion(tx, modelBoards, id, version, {}))?.version;
}
