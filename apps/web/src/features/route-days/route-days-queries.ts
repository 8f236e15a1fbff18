// What the Route days screen asks for, said once: the page's hooks and the route's prefetch use the same queries.
import { can, type Role } from '@bumperline/contracts/roles';
import type { FetchAhead } from '../../api/fetch-ahead.ts';
import { routeDayBoardQuery } from '../../api/route-days.ts';
import { settingsQuery } from '../../api/settings.ts';

/** The date in the address bar (?day=YYYY-MM-DD), or '' for the company's today. */
export function dayFromSearch(sp: URLSearchParams): string {
  const day = sp.get('day') ?? '';
  return /^\d{4}-\d{2}-\d{2}$/.test(day) ? day : '';
}

export function prefetchRouteDays(ahead: FetchAhead, role: Role, url: URL) {
  if (!can(role, 'route-days:plan')) return;
  ahead(routeDayBoardQuery(dayFromSearch(url.searchParams) || undefined));
  ahead(settingsQuery());
}
