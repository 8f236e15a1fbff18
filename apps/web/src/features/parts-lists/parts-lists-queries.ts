// What the parts-list screens ask for, said once: the pages' hooks and the routes' prefetch use the same queries.
import type { Params } from 'react-router-dom';
import { can, type Role } from '@bumperline/contracts/roles';
import type { FetchAhead } from '../../api/fetch-ahead.ts';
import { boardPartsListQuery, partsListsOverviewQuery } from '../../api/parts-lists.ts';

export function prefetchPartsLists(ahead: FetchAhead, role: Role) {
  if (can(role, 'bench:read')) ahead(partsListsOverviewQuery());
}

export function prefetchPartsList(ahead: FetchAhead, role: Role, _url: URL, params: Params) {
  if (can(role, 'bench:read') && params.boardId) ahead(boardPartsListQuery(params.boardId));
}
