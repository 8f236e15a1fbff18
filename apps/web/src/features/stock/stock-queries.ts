// What the stock screens ask for, said once: the pages' hooks and the routes' prefetch use the same queries.
import type { Params } from 'react-router-dom';
import { can, type Role } from '@bumperline/contracts/roles';
import type { FetchAhead } from '../../api/fetch-ahead.ts';
import { reorderQuery, stockLevelsQuery, stockLocationQuery, stockLocationsQuery } from '../../api/stock.ts';

/** A stock's levels as its screen first asks for them. */
export const firstLevelsPage = { limit: 50 } as const;

export function prefetchStock(ahead: FetchAhead, role: Role) {
  if (can(role, 'stock:read')) ahead(stockLocationsQuery());
}

export function prefetchStockLocation(ahead: FetchAhead, role: Role, _url: URL, params: Params) {
  if (!can(role, 'stock:read') || !params.id) return;
  ahead(stockLocationQuery(params.id));
  ahead(stockLevelsQuery(params.id, firstLevelsPage));
}

export function prefetchReorder(ahead: FetchAhead, role: Role) {
  if (can(role, 'stock:manage')) ahead(reorderQuery());
}
