// Models' boards and their parts lists: adding and renaming a board, and saving a whole parts list at the
// version its editor opened. Every row is judged by the domain's checkPartsList (the same code the editor runs
// live), and a list with any problem saves nothing.
import { checkPartsList, readPartEntry, type PartEntryInput } from '@bumperline/domain/components/parts-list-entry';
import { PARTS_LIST_CONFLICT, type ModelBoardInput, type ModelBoardUpdate, type partRowInput } from '@bumperline/contracts/parts-lists';
import type { z } from 'zod';
import type { Tx } from '@bumperline/db/client';
import { recordAudit } from '@bumperline/db/queries/audit';
import { listBoardParts, replaceBoardParts, type BoardPartFields } from '@bumperline/db/queries/board-parts';
import { getModel } from '@bumperline/db/queries/games';
import {
  boardNameTaken,
  claimPartsListVersion,
  getModelBoard,
  insertModelBoard,
  updateModelBoard,
} from '@bumperline/db/queries/model-boards';
import { Conflict, InvalidInput, NotFound } from './workflow-errors.ts';

type PartRowParsed = z.output<typeof partRowInput>;

const NAME_TAKEN = 'is already the name of a board of this model';

/** The board with its model and the parts on its list now (the contract's BoardPartsList once sent as JSON). */
export async function getPartsList(tx: Tx, boardId: string) {
  const board = await getModelBoard(tx, boardId);
  if (!board) throw new NotFound('board');
  const model = (await getModel(tx, board.modelId))!;
  const parts = await listBoardParts(tx, boardId);
  return { board, model, parts, version: board.version };
}

export async function createBoard(tx: Tx, modelId: string, input: Required<ModelBoardInput>, actorUserId: string) {
  if (!(await getModel(tx, modelId))) throw new NotFound('model');
  const id = await insertModelBoard(tx, { modelId, ...input });
  if (!id) throw new InvalidInput([{ field: 'name', message: NAME_TAKEN }]);
  const board = (await getModelBoard(tx, id))!;
  await recordAudit(tx, { actorUserId, action: 'create', entity: 'model_board', entityId: id, after: board });
  return board;
}

export async function renameBoard(tx: Tx, boardId: string, patch: ModelBoardUpdate, actorUserId: string) {
  const before = await getModelBoard(tx, boardId);
  if (!before) throw new NotFound('board');
  if (patch.name !== undefined && (await boardNameTaken(tx, before.modelId, patch.name, boardId))) {
    throw new InvalidInput([{ field: 'name', message: NAME_TAKEN }]);
  }
  await updateModelBoard(tx, boardId, patch);
  const after = (await getModelBoard(tx, boardId))!;
  await recordAudit(tx, { actorUserId, action: 'update', entity: 'model_board', entityId: boardId, before, after });
  return after;
}

/** A request row as the domain reads it. */
export function toPartEntry(row: Omit<PartRowParsed, 'id'>): PartEntryInput {
  return {
    designator: row.designator,
    kind: row.kind,
    value: row.value,
    tolerance: row.tolerance,
    rating: row.rating,
    ratedTemperatureC: row.ratedTemperatureC,
    ratedLifeHours: row.ratedLifeHours,
    notes: row.notes,
  };
}

/**
 * Saves the whole list at `version`: every row problem is answered at once as `parts.<row>.<column>`, nothing
 * saved; a list saved by someone else since `version` is a conflict carrying the list as it now stands.
 */
export async function savePartsList(tx: Tx, p: { boardId: string; version: number; parts: PartRowParsed[]; actorUserId: string }) {
  const board = await getModelBoard(tx, p.boardId);
  if (!board) throw new NotFound('board');
  const problems = checkPartsList(p.parts.map(toPartEntry));
  if (problems.length) {
    throw new InvalidInput(
      problems.map((problem) => ({
        field: problem.field && problem.field !== 'row' ? `parts.${problem.row}.${problem.field}` : `parts.${problem.row}`,
        message: problem.message,
      })),
    );
  }
  if ((await claimPartsListVersion(tx, p.boardId, p.version)) === undefined) {
    throw new Conflict(PARTS_LIST_CONFLICT, await getPartsList(tx, p.boardId), [
      { field: 'version', message: 'someone else saved this parts list since you opened it' },
    ]);
  }
  // Stored as the domain reads them ("r12" → "R12"), so a save matches a designator however it was typed.
  const rows: BoardPartFields[] = p.parts.map(({ id: _id, ...fields }) => ({
    ...fields,
    designator: readPartEntry(toPartEntry(fields)).designator,
  }));
  const changes = await replaceBoardParts(tx, p.boardId, rows);
  const saved = await getPartsList(tx, p.boardId);
  // The activity log shows "changed parts list" with the count before and after and the designators that moved.
  await recordAudit(tx, {
    actorUserId: p.actorUserId,
    action: 'update',
    entity: 'parts_list',
    entityId: p.boardId,
    before: { parts: board.partCount },
    after: { parts: saved.parts.length, ...changes },
  });
  return saved;
}
