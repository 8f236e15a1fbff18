// Boards fitted in games, their pages (every reading per part), a game's cabinet profile and the company's recap
// list. Thin: parse, call the service (services/boards.ts) with the company's today, record the audit, return.
import { Router } from 'express';
import {
  boardInstanceInput,
  boardInstanceUpdate,
  cabinetProfileInput,
  recapFleetQuery,
  type BoardInstance,
} from '@bumperline/contracts/boards';
import { recordAudit } from '@bumperline/db/queries/audit';
import { parse } from '../http/validate.ts';
import { idParam } from '../http/params.ts';
import type { makeScoped } from '../http/guards.ts';
import { boardPage, cabinetProfileOf, editBoard, fitBoard, gameBoards, recapFleet, setCabinetProfile } from '../services/boards.ts';
import { companyToday } from '../services/company-today.ts';

/** What the audit log keeps of a board: its stored fields, not the recap estimate worked out from them. */
const stored = ({ recap: _recap, ...fields }: BoardInstance) => fields;

export function boardsRouter(scoped: ReturnType<typeof makeScoped>): Router {
  const r = Router();

  r.get(
    '/games/:gameId/boards',
    scoped('bench:read', async ({ tx, req, actor }) => gameBoards(tx, idParam(req, 'gameId'), await companyToday(tx, actor.tenantId))),
  );

  r.post(
    '/games/:gameId/boards',
    scoped(
      'boards:write',
      async ({ tx, req, actor }) => {
        const gameId = idParam(req, 'gameId');
        const input = parse(boardInstanceInput, req.body);
        const board = await fitBoard(tx, gameId, input, await companyToday(tx, actor.tenantId));
        await recordAudit(tx, {
          actorUserId: actor.userId,
          action: 'create',
          entity: 'board_instance',
          entityId: board.id,
          after: stored(board),
        });
        return board;
      },
      201,
    ),
  );

  r.get(
    '/board-instances/:id',
    scoped('bench:read', async ({ tx, req, actor }) => boardPage(tx, idParam(req), await companyToday(tx, actor.tenantId))),
  );

  r.patch(
    '/board-instances/:id',
    scoped('boards:write', async ({ tx, req, actor }) => {
      const id = idParam(req);
      const update = parse(boardInstanceUpdate, req.body);
      const { before, after } = await editBoard(tx, id, update, await companyToday(tx, actor.tenantId));
      await recordAudit(tx, {
        actorUserId: actor.userId,
        action: 'update',
        entity: 'board_instance',
        entityId: id,
        before: stored(before),
        after: stored(after),
      });
      return after;
    }),
  );

  r.get(
    '/games/:gameId/cabinet-profile',
    scoped('bench:read', async ({ tx, req }) => cabinetProfileOf(tx, idParam(req, 'gameId'))),
  );

  r.put(
    '/games/:gameId/cabinet-profile',
    scoped('boards:write', async ({ tx, req, actor }) => {
      const gameId = idParam(req, 'gameId');
      const { slices } = parse(cabinetProfileInput, req.body);
      const before = await cabinetProfileOf(tx, gameId);
      const after = await setCabinetProfile(tx, gameId, slices);
      await recordAudit(tx, {
        actorUserId: actor.userId,
        action: 'update',
        entity: 'cabinet_profile',
        entityId: gameId,
        before: before.isDefault ? null : { slices: before.slices },
        after: { slices: after.slices },
      });
      return after;
    }),
  );

  r.get(
    '/recap-due',
    scoped('bench:read', async ({ tx, req, actor }) => {
      const query = parse(recapFleetQuery, req.query);
      return recapFleet(tx, await companyToday(tx, actor.tenantId), query);
    }),
  );

  return r;
}
