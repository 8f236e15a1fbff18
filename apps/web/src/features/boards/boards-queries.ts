// What the board screens ask for, said once: the pages' hooks and the routes' prefetch use the same queries.
import type { Params } from 'react-router-dom';
import { recapStatuses, type RecapStatus } from '@bumperline/contracts/bench-vocabulary';
import { can, type Role } from '@bumperline/contracts/roles';
import { boardPageQuery, recapDueQuery } from '../../api/boards.ts';
import type { FetchAhead } from '../../api/fetch-ahead.ts';

/** The recap list's status filter from the address bar; anything else shows every board. */
export function recapStatusFilter(sp: URLSearchParams): RecapStatus | undefined {
  const raw = sp.get('status');
  return recapStatuses.find((s) => s === raw);
}

export function prefetchBoard(ahead: FetchAhead, role: Role, _url: URL, params: Params) {
  if (can(role, 'bench:read') && params.id) ahead(boardPageQuery(params.id));
}

export function prefetchRecapDue(ahead: FetchAhead, role: Role, url: URL) {
  if (can(role, 'bench:read')) ahead(recapDueQuery(recapStatusFilter(url.searchParams), url.searchParams.get('cursor') ?? undefined));
}
