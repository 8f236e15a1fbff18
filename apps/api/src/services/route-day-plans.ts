// Route-day plans, remembered. Planning is pure and seeded: the same venues, opening hours, times on site, start
// point, hours and speed always give the same plan, so a day looked at again (the office board refreshing, a phone
// reloading My day) is not planned again. Anything that changes the day changes the key, so nothing goes stale.
import { LRUCache } from 'lru-cache';
import { planRouteDayStops, type RouteDayStops, type RouteDayStopsInput } from '@bumperline/domain/travel/route-day-stops';

/** Days remembered at most: a few kB each; a large company's technicians over a week of looking ahead and back. */
const REMEMBERED_DAYS = 2_000;
const remembered = new LRUCache<string, RouteDayStops>({ max: REMEMBERED_DAYS });

/** The plan for a day (shared: read it, never change it). */
export function plannedStops(input: RouteDayStopsInput): RouteDayStops {
  const key = JSON.stringify(input);
  const known = remembered.get(key);
  if (known) return known;
  const plan = planRouteDayStops(input);
  remembered.set(key, plan);
  return plan;
}
