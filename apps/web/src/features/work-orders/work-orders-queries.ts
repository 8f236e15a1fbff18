// What the work-order screens ask for, said once: the pages' hooks and the routes' prefetch use the same queries.
import type { Params } from 'react-router-dom';
import { dueStates, workOrderStates } from '@bumperline/contracts/care-vocabulary';
import { can, type Role } from '@bumperline/contracts/roles';
import type { WorkOrderListQuery } from '@bumperline/contracts/work-orders';
import type { FetchAhead } from '../../api/fetch-ahead.ts';
import { workOrderListQuery, workOrderQuery } from '../../api/work-orders.ts';
import { readListParams } from '../../components/use-list-params.ts';

export const workOrderFilterKeys = ['due', 'state', 'technicianId', 'venueId', 'gameId', 'carePlanId'] as const;

/** The list query the work-orders screen sends for the address bar's filters and page. */
export function workOrdersListQuery(sp: URLSearchParams): WorkOrderListQuery {
  const p = readListParams<'dueAt'>(sp, 'dueAt');
  const state = sp.get('state');
  const due = sp.get('due');
  return {
    q: p.q || undefined,
    state: (workOrderStates as readonly string[]).includes(state ?? '') ? (state as WorkOrderListQuery['state']) : 'open',
    due: (dueStates as readonly string[]).includes(due ?? '') ? (due as WorkOrderListQuery['due']) : undefined,
    technicianId: sp.get('technicianId') || undefined,
    venueId: sp.get('venueId') || undefined,
    gameId: sp.get('gameId') || undefined,
    carePlanId: sp.get('carePlanId') || undefined,
    order: p.order,
    cursor: p.cursor,
    limit: 25,
  };
}

export function prefetchWorkOrders(ahead: FetchAhead, role: Role, url: URL) {
  if (can(role, 'care-plans:read')) ahead(workOrderListQuery(workOrdersListQuery(url.searchParams)));
}

export function prefetchWorkOrder(ahead: FetchAhead, role: Role, _url: URL, params: Params) {
  if (can(role, 'care-plans:read') && params.id) ahead(workOrderQuery(params.id));
}
