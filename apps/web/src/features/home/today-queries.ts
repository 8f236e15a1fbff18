// What Today asks for, said once: the page's hooks and the route's prefetch use the same queries.
import type { CallListQuery } from '@bumperline/contracts/calls';
import type { GameListQuery } from '@bumperline/contracts/games';
import { can, type Role } from '@bumperline/contracts/roles';
import { callListQuery } from '../../api/calls.ts';
import type { FetchAhead } from '../../api/fetch-ahead.ts';
import { gameListQuery, gameSummaryQuery } from '../../api/games.ts';

export const downGamesQuery: GameListQuery = { status: 'down', sort: 'venue', order: 'asc', limit: 50 };

/** Dispatchers see the calls closest to their target; a technician sees their own. */
export const openCallsQuery = (canDispatch: boolean): CallListQuery => ({
  state: 'open',
  sort: 'targetAt',
  order: 'asc',
  limit: 8,
  technicianId: canDispatch ? undefined : 'me',
});

export function prefetchToday(ahead: FetchAhead, role: Role) {
  ahead(gameSummaryQuery());
  ahead(gameListQuery(downGamesQuery));
  if (can(role, 'calls:read')) ahead(callListQuery(openCallsQuery(can(role, 'calls:dispatch'))));
}
