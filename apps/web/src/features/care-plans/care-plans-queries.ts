// What the care-plan screens ask for, said once: the pages' hooks and the routes' prefetch use the same queries.
import type { Params } from 'react-router-dom';
import type { CarePlanListQuery } from '@bumperline/contracts/care-plans';
import { can, type Role } from '@bumperline/contracts/roles';
import type { FetchAhead } from '../../api/fetch-ahead.ts';
import { carePlanListQuery, carePlanQuery } from '../../api/care-plans.ts';
import { readListExtras, readListParams } from '../../components/use-list-params.ts';

export type CarePlanSort = 'name';

export function carePlansListQuery(sp: URLSearchParams): CarePlanListQuery {
  const p = readListParams<CarePlanSort>(sp, 'name');
  const extras = readListExtras(sp, ['retired']);
  return {
    q: p.q || undefined,
    sort: 'name',
    order: p.order,
    cursor: p.cursor,
    limit: 25,
    includeRetired: extras.retired === 'yes' ? 'true' : undefined,
  };
}

export function prefetchCarePlans(ahead: FetchAhead, role: Role, url: URL) {
  if (can(role, 'care-plans:read')) ahead(carePlanListQuery(carePlansListQuery(url.searchParams)));
}

export function prefetchCarePlan(ahead: FetchAhead, role: Role, _url: URL, params: Params) {
  if (can(role, 'care-plans:read') && params.id) ahead(carePlanQuery(params.id));
}
