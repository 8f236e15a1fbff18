// Stocks: warehouses and vans, what each holds (reorder points editable), receiving, transfers, counts, movements,
// the signed-in person's van, and what to order.
import { Router } from 'express';
import {
  stockCountInput,
  stockLevelListQuery,
  stockLevelSettings,
  stockLocationInput,
  stockLocationUpdate,
  stockMovementListQuery,
  stockReceiveInput,
  stockTransferInput,
} from '@bumperline/contracts/stock';
import { getStockLocation, listStockLocations } from '@bumperline/db/queries/stock-locations';
import { getLevelsOfPart, listStockLevels, setLevelReorder } from '@bumperline/db/queries/stock-levels';
import { listStockMovements } from '@bumperline/db/queries/stock-movements';
import { ConflictError, NotFoundError } from '../http/errors.ts';
import { parse } from '../http/validate.ts';
import { idParam } from '../http/params.ts';
import type { makeScoped } from '../http/guards.ts';
import { createStockLocation, myVan, renameStockLocation, retireStockLocation } from '../services/stock-locations.ts';
import { countStock, partForMove, receiveStock, transferStock } from '../services/stock-moves.ts';
import { reorderList } from '../services/stock-reorder.ts';
import { ensureVan } from '../services/vans.ts';

export function stockRouter(scoped: ReturnType<typeof makeScoped>): Router {
  const r = Router();

  r.get(
    '/locations',
    scoped('stock:read', async ({ tx }) => ({ items: await listStockLocations(tx) })),
  );

  r.post(
    '/locations',
    scoped('stock:manage', ({ tx, req, actor }) => createStockLocation(tx, parse(stockLocationInput, req.body), actor.userId), 201),
  );

  r.get(
    '/locations/:id',
    scoped('stock:read', async ({ tx, req }) => {
      const location = await getStockLocation(tx, idParam(req));
      if (!location) throw new NotFoundError('stock');
      return location;
    }),
  );

  r.patch(
    '/locations/:id',
    scoped('stock:manage', ({ tx, req, actor }) =>
      renameStockLocation(tx, idParam(req), parse(stockLocationUpdate, req.body).name, actor.userId),
    ),
  );

  r.post(
    '/locations/:id/retire',
    scoped('stock:manage', ({ tx, req, actor }) => retireStockLocation(tx, idParam(req), actor.userId)),
  );

  r.get(
    '/locations/:id/levels',
    scoped('stock:read', async ({ tx, req }) => {
      const id = idParam(req);
      const query = parse(stockLevelListQuery, req.query);
      if (!(await getStockLocation(tx, id))) throw new NotFoundError('stock');
      return listStockLevels(tx, id, query);
    }),
  );

  // A part's reorder point and quantity at a stock (the level is made at 0 when the part is not kept there yet).
  r.put(
    '/locations/:id/levels/:partId',
    scoped('stock:manage', async ({ tx, req }) => {
      const id = idParam(req);
      const partId = idParam(req, 'partId');
      const { version, ...settings } = parse(stockLevelSettings, req.body);
      if (!(await getStockLocation(tx, id))) throw new NotFoundError('stock');
      await partForMove(tx, partId, 'partId', true);
      if (!(await setLevelReorder(tx, id, partId, settings, version))) {
        const [current] = await getLevelsOfPart(tx, partId, [id]);
        throw new ConflictError(
          current
            ? 'Someone else changed this stock level since you opened it. Review it and try again.'
            : 'This part is not kept here yet.',
          current ?? null,
          [{ field: 'version', message: current ? 'is not the level’s current version' : 'must be left out for a part not kept here yet' }],
        );
      }
      return (await getLevelsOfPart(tx, partId, [id]))[0];
    }),
  );

  r.post(
    '/receive',
    scoped('stock:manage', ({ tx, req, actor }) => receiveStock(tx, actor, parse(stockReceiveInput, req.body)), 201),
  );

  r.post(
    '/transfer',
    scoped('stock:move', ({ tx, req, actor }) => transferStock(tx, actor, parse(stockTransferInput, req.body)), 201),
  );

  r.post(
    '/count',
    scoped('stock:move', ({ tx, req, actor }) => countStock(tx, actor, parse(stockCountInput, req.body)), 201),
  );

  r.get(
    '/movements',
    scoped('stock:read', ({ tx, req }) => listStockMovements(tx, parse(stockMovementListQuery, req.query))),
  );

  r.get(
    '/my-van',
    scoped('stock:read', ({ tx, actor }) => myVan(tx, actor.userId)),
  );

  // Makes the signed-in person's van if they have none (the van screen's first transfer needs a stock to go to).
  r.post(
    '/my-van',
    scoped('stock:move', async ({ tx, actor }) => {
      await ensureVan(tx, actor.userId);
      return myVan(tx, actor.userId);
    }),
  );

  r.get(
    '/reorder',
    scoped('stock:manage', ({ tx }) => reorderList(tx)),
  );

  return r;
}
