// What the Calls screen asks for, said once: the page's hooks and the route's prefetch use the same queries.
import type { CallListQuery, ServiceCall } from '@bumperline/contracts/calls';
import type { VenueListQuery } from '@bumperline/contracts/venues';
import { can, type Role } from '@bumperline/contracts/roles';
import { callListQuery, techniciansQuery } from '../../api/calls.ts';
import type { FetchAhead } from '../../api/fetch-ahead.ts';
import { settingsQuery } from '../../api/settings.ts';
import { venueListQuery } from '../../api/venues.ts';
import { readListExtras, readListParams, type ListParams } from '../../components/use-list-params.ts';

export type CallsSort = 'targetAt' | 'openedAt';
export const callsDefaultSort: CallsSort = 'targetAt';
export const callsFilterKeys = ['state', 'venueId', 'problem', 'technicianId'] as const;

/** The table's page of calls for the search, sort, page and filters in the address bar. */
export function callsTableQuery(params: ListParams<CallsSort>, extras: Record<string, string>): CallListQuery {
  return {
    q: params.q || undefined,
    sort: params.sort,
    order: params.order,
    cursor: params.cursor,
    limit: 50,
    state: (extras.state || 'open') as 'open',
    venueId: extras.venueId || undefined,
    problem: (extras.problem || undefined) as ServiceCall['problem'] | undefined,
    technicianId: extras.technicianId || undefined,
  };
}

/** The map shows every call matching the filters (up to 200), not only the table's page. */
export const callsMapQuery = (table: CallListQuery): CallListQuery => ({ ...table, cursor: undefined, limit: 200 });

/** The venue filter's choices. */
export const venueFilterQuery: VenueListQuery = { limit: 200, sort: 'name', order: 'asc' };

export function prefetchCalls(ahead: FetchAhead, role: Role, url: URL) {
  if (!can(role, 'calls:read')) return;
  const sp = url.searchParams;
  ahead(callListQuery(callsTableQuery(readListParams(sp, callsDefaultSort), readListExtras(sp, callsFilterKeys))));
  ahead(settingsQuery());
  ahead(venueListQuery(venueFilterQuery));
  if (can(role, 'calls:dispatch')) ahead(techniciansQuery());
}
