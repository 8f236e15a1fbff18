import { Router } from 'express';
import { gameInput, gameListQuery, gameModelInput, gameUpdate } from '@bumperline/contracts/games';
import {
  countGamesByStatus,
  getGame,
  getModel,
  insertGame,
  insertModel,
  listGames,
  listModels,
  updateGame,
} from '@bumperline/db/queries/games';
import { getVenue } from '@bumperline/db/queries/venues';
import { recordAudit } from '@bumperline/db/queries/audit';
import type { Tx } from '@bumperline/db/client';
import { listDowntime } from '@bumperline/db/queries/downtime';
import { getTagToken } from '@bumperline/db/queries/game-tags';
import { ConflictError, NotFoundError, ValidationError } from '../http/errors.ts';
import { parse } from '../http/validate.ts';
import { idParam } from '../http/params.ts';
import type { makeScoped } from '../http/guards.ts';

/** A game may only point at a model and a venue of the same company. */
async function checkReferences(tx: Tx, refs: { modelId?: string; venueId?: string | null }) {
  const errors: { field: string; message: string }[] = [];
  if (refs.modelId && !(await getModel(tx, refs.modelId))) errors.push({ field: 'modelId', message: 'is not a known game model' });
  if (refs.venueId) {
    const venue = await getVenue(tx, refs.venueId);
    if (!venue) errors.push({ field: 'venueId', message: 'is not a known venue' });
    else if (venue.retiredAt) errors.push({ field: 'venueId', message: 'is a retired venue' });
  }
  if (errors.length) throw new ValidationError(errors);
}

export function gamesRouter(scoped: ReturnType<typeof makeScoped>): Router {
  const r = Router();

  r.get(
    '/',
    scoped('games:read', ({ tx, req }) => listGames(tx, parse(gameListQuery, req.query))),
  );

  r.get(
    '/summary',
    scoped('games:read', async ({ tx }) => {
      const byStatus = await countGamesByStatus(tx);
      return { byStatus, total: Object.values(byStatus).reduce((a, b) => a + (b ?? 0), 0) };
    }),
  );

  r.get(
    '/:id',
    scoped('games:read', async ({ tx, req }) => {
      const id = idParam(req);
      const game = await getGame(tx, id);
      if (!game) throw new NotFoundError('game');
      return { ...game, tagToken: await getTagToken(tx, id) };
    }),
  );

  // When the game was down: one row per interval (an open one has no end yet).
  r.get(
    '/:id/downtime',
    scoped('games:read', async ({ tx, req }) => {
      const id = idParam(req);
      if (!(await getGame(tx, id))) throw new NotFoundError('game');
      return { items: await listDowntime(tx, id) };
    }),
  );

  r.post(
    '/',
    scoped(
      'games:write',
      async ({ tx, req, actor }) => {
        const input = parse(gameInput, req.body);
        await checkReferences(tx, input);
        const id = await insertGame(tx, input);
        const game = await getGame(tx, id);
        await recordAudit(tx, { actorUserId: actor.userId, action: 'create', entity: 'game', entityId: id, after: game });
        return game;
      },
      201,
    ),
  );

  r.patch(
    '/:id',
    scoped('games:write', async ({ tx, req, actor }) => {
      const id = idParam(req);
      const { version, ...patch } = parse(gameUpdate, req.body);
      const before = await getGame(tx, id);
      if (!before) throw new NotFoundError('game');
      await checkReferences(tx, patch);
      if (!(await updateGame(tx, id, version, patch))) {
        throw new ConflictError('Someone else changed this game since you opened it. Review the current values and try again.', before);
      }
      const after = await getGame(tx, id);
      await recordAudit(tx, { actorUserId: actor.userId, action: 'update', entity: 'game', entityId: id, before, after });
      return after;
    }),
  );

  r.post(
    '/:id/retire',
    scoped('games:write', async ({ tx, req, actor }) => {
      const id = idParam(req);
      const before = await getGame(tx, id);
      if (!before) throw new NotFoundError('game');
      if (before.retiredAt) return before;
      await updateGame(tx, id, before.version, { retiredAt: new Date(), venueId: null });
      const after = await getGame(tx, id);
      await recordAudit(tx, { actorUserId: actor.userId, action: 'retire', entity: 'game', entityId: id, before, after });
      return after;
    }),
  );

  return r;
}

export function modelsRouter(scoped: ReturnType<typeof makeScoped>): Router {
  const r = Router();
  r.get(
    '/',
    scoped('games:read', async ({ tx }) => ({ items: await listModels(tx) })),
  );
  r.post(
    '/',
    scoped(
      'models:write',
      async ({ tx, req, actor }) => {
        const input = parse(gameModelInput, req.body);
        const id = await insertModel(tx, input);
        if (!id) throw new ConflictError(`A model "${input.title}" by ${input.maker} already exists.`);
        const model = await getModel(tx, id);
        await recordAudit(tx, { actorUserId: actor.userId, action: 'create', entity: 'game_model', entityId: id, after: model });
        return model;
      },
      201,
    ),
  );
  return r;
}
