// The parts catalogue: list, one part with where it is kept and what it fits, add, edit (version → 409), retire,
// link to and unlink from parts-list entries; and, for a model board, the catalogue parts fitting its entries.
import { Router } from 'express';
import { catalogueListQuery, cataloguePartInput, cataloguePartUpdate, partFitInput } from '@bumperline/contracts/parts-catalogue';
import { listCatalogueFitsOfBoard, listCatalogueParts, modelBoardExists } from '@bumperline/db/queries/catalogue-parts';
import { findVanOf } from '@bumperline/db/queries/stock-locations';
import { NotFoundError } from '../http/errors.ts';
import { parse } from '../http/validate.ts';
import { idParam } from '../http/params.ts';
import type { makeScoped } from '../http/guards.ts';
import {
  cataloguePartDetail,
  createCataloguePart,
  linkFit,
  retireCataloguePart,
  unlinkFit,
  updateCataloguePartAtVersion,
} from '../services/parts-catalogue.ts';

export function partsCatalogueRouter(scoped: ReturnType<typeof makeScoped>): Router {
  const r = Router();

  r.get(
    '/parts',
    scoped('stock:read', ({ tx, req }) => listCatalogueParts(tx, parse(catalogueListQuery, req.query))),
  );

  r.get(
    '/parts/:id',
    scoped('stock:read', ({ tx, req }) => cataloguePartDetail(tx, idParam(req))),
  );

  r.post(
    '/parts',
    scoped('stock:manage', ({ tx, req, actor }) => createCataloguePart(tx, parse(cataloguePartInput, req.body), actor.userId), 201),
  );

  r.patch(
    '/parts/:id',
    scoped('stock:manage', ({ tx, req, actor }) =>
      updateCataloguePartAtVersion(tx, idParam(req), parse(cataloguePartUpdate, req.body), actor.userId),
    ),
  );

  r.post(
    '/parts/:id/retire',
    scoped('stock:manage', ({ tx, req, actor }) => retireCataloguePart(tx, idParam(req), actor.userId)),
  );

  r.post(
    '/parts/:id/fits',
    scoped('stock:manage', ({ tx, req }) => linkFit(tx, idParam(req), parse(partFitInput, req.body).boardPartId), 201),
  );

  r.delete(
    '/parts/:id/fits/:boardPartId',
    scoped('stock:manage', ({ tx, req }) => unlinkFit(tx, idParam(req), idParam(req, 'boardPartId'))),
  );

  // What fits a board's parts list, with the quantity on the signed-in person's van (the stop and bench screens).
  r.get(
    '/boards/:boardId/catalogue-fits',
    scoped('stock:read', async ({ tx, req, actor }) => {
      const boardId = idParam(req, 'boardId');
      if (!(await modelBoardExists(tx, boardId))) throw new NotFoundError('board');
      const van = await findVanOf(tx, actor.userId);
      return { items: await listCatalogueFitsOfBoard(tx, boardId, van && !van.retiredAt ? van.id : null) };
    }),
  );

  return r;
}
