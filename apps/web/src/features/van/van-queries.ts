// What the van screen asks for, said once: its hook and the route's prefetch use the same queries.
import { can, type Role } from '@bumperline/contracts/roles';
import type { FetchAhead } from '../../api/fetch-ahead.ts';
import { myVanQuery, stockLocationsQuery } from '../../api/stock.ts';

export function prefetchVan(ahead: FetchAhead, role: Role) {
  if (!can(role, 'stock:read')) return;
  ahead(myVanQuery());
  ahead(stockLocationsQuery());
}
