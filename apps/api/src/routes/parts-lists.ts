// Models' boards and their parts lists: the overview of every model's boards, a model's boards, a board with
// its parts list, saving the list, and the list as a CSV file.
import { Router } from 'express';
import Papa from 'papaparse';
import { modelBoardInput, modelBoardUpdate, partsListSave } from '@bumperline/contracts/parts-lists';
import { CSV_FORMULA_START, partsListFileName } from '@bumperline/contracts/parts-list-csv';
import { PARTS_LIST_COLUMNS, recordsFromRows } from '@bumperline/domain/components/parts-list-columns';
import { getModel, listModels } from '@bumperline/db/queries/games';
import { listAllModelBoards, listModelBoards } from '@bumperline/db/queries/model-boards';
import { NotFoundError } from '../http/errors.ts';
import { parse } from '../http/validate.ts';
import { idParam } from '../http/params.ts';
import type { makeScoped } from '../http/guards.ts';
import { createBoard, getPartsList, renameBoard, savePartsList } from '../services/parts-lists.ts';

export function partsListsRouter(scoped: ReturnType<typeof makeScoped>): Router {
  const r = Router();

  // Every model with its boards, for the parts-lists screen.
  r.get(
    '/parts-lists',
    scoped('bench:read', async ({ tx }) => {
      const [models, boards] = await Promise.all([listModels(tx), listAllModelBoards(tx)]);
      return { items: models.map((model) => ({ model, boards: boards.filter((b) => b.modelId === model.id) })) };
    }),
  );

  r.get(
    '/models/:modelId/boards',
    scoped('bench:read', async ({ tx, req }) => {
      const modelId = idParam(req, 'modelId');
      if (!(await getModel(tx, modelId))) throw new NotFoundError('model');
      return { items: await listModelBoards(tx, modelId) };
    }),
  );

  r.post(
    '/models/:modelId/boards',
    scoped(
      'parts-lists:write',
      ({ tx, req, actor }) => createBoard(tx, idParam(req, 'modelId'), parse(modelBoardInput, req.body), actor.userId),
      201,
    ),
  );

  r.get(
    '/boards/:boardId',
    scoped('bench:read', ({ tx, req }) => getPartsList(tx, idParam(req, 'boardId'))),
  );

  r.patch(
    '/boards/:boardId',
    scoped('parts-lists:write', ({ tx, req, actor }) =>
      renameBoard(tx, idParam(req, 'boardId'), parse(modelBoardUpdate, req.body), actor.userId),
    ),
  );

  r.put(
    '/boards/:boardId/parts',
    scoped('parts-lists:write', ({ tx, req, actor }) => {
      const boardId = idParam(req, 'boardId');
      const { version, parts } = parse(partsListSave, req.body);
      return savePartsList(tx, { boardId, version, parts, actorUserId: actor.userId });
    }),
  );

  r.get(
    '/boards/:boardId/parts.csv',
    scoped('bench:read', async ({ tx, req, res }) => {
      const list = await getPartsList(tx, idParam(req, 'boardId'));
      const csv = Papa.unparse(recordsFromRows(list.parts), {
        columns: [...PARTS_LIST_COLUMNS],
        escapeFormulae: CSV_FORMULA_START,
        newline: '\r\n',
      });
      // The byte-order mark tells spreadsheet programs the file is UTF-8 (µ, Ω, ±); papaparse skips it on import.
      res
        .status(200)
        .attachment(partsListFileName(list.model.title, list.board.name))
        .type('text/csv; charset=utf-8')
        .set('Cache-Control', 'no-store')
        .send(`\ufeff${csv}`);
      return undefined;
    }),
  );

  return r;
}
