import { DomainError } from '../errors.ts';
import { requirePositive } from '../input-checks.ts';
import { type GeoPoint } from './haversine.ts';
import { openingWindow, type OpeningHours } from './opening-window.ts';
import { planRouteDay, scheduleInOrder, type RouteDayPlan, type RouteStop } from './route-day.ts';
import { distanceMatrixKm } from './travel-matrix.ts';

/**
 * A technician's route day from venues to visit: each venue's opening hours that date become its arrival window
 * (a venue closed that day, or open too briefly, is left out with the reason), distances are haversine times a
 * detour factor, travel is that over the company's average speed, rounded to whole minutes so every time adds up.
 * With an order the dispatcher kept, that order is walked (venues new to the day go in where they add least
 * driving; venues gone from the day drop out of it); otherwise the planner chooses, with a fixed seed so the same
 * day plans the same way every time.
 */

export interface VenueVisit {
  venueId: string;
  point: GeoPoint;
  openingHours: OpeningHours;
  onSiteMinutes: number;
}

export interface RouteDayStopsInput {
  /** YYYY-MM-DD, the venues' local date. */
  day: string;
  /** Minutes after local midnight: leave the start point, be back by. */
  dayStart: number;
  dayEnd: number;
  /** Home; null when not recorded: the day then starts at the first stop and ends at the last. */
  startPoint: GeoPoint | null;
  speedKmh: number;
  visits: readonly VenueVisit[];
  /** Venue ids in the order the dispatcher kept; empty for the planner's order. */
  keptOrder: readonly string[];
}

export interface PlannedVisit {
  venueId: string;
  arrival: number;
  waitMinutes: number;
  serviceStart: number;
  departure: number;
  travelMinutesFromPrevious: number;
  kmFromPrevious: number;
}

export interface RouteDayStops {
  orderKind: 'planner' | 'kept';
  /** When to leave the start point: the day's start, or later when the first venue opens later (no waiting at its door). */
  leaveAt: number;
  visits: PlannedVisit[];
  unscheduled: { venueId: string; reason: string }[];
  returnAt: number;
  totals: { travelMinutes: number; km: number; onSiteMinutes: number };
}

/** Road distance over straight-line distance in towns, about 1.2–1.4 (common practice); as travel-matrix.ts. */
export const DETOUR_FACTOR = 1.3;
const SEED = 1;
/**
 * The planner's search, capped for a day re-planned on every look: on 25-stop days with windows (three seeded
 * samples, tests/bench/route-day-plan.bench.ts) 150 rounds found the same plan as the default 290 in about half
 * the time; 80 or fewer sometimes drove further.
 */
export const SEARCH_ROUNDS = 150;

/** Each venue not in `order` goes where it adds least to the kept order's driving (cost matrix: 0 = start). */
export function insertNewStops(order: readonly number[], added: readonly number[], cost: readonly (readonly number[])[]): number[] {
  const result = [...order];
  const leg = (a: number, b: number) => cost[a]?.[b] ?? 0;
  for (const s of added) {
    let bestAt = result.length;
    let bestExtra = Infinity;
    for (let at = 0; at <= result.length; at++) {
      const before = at === 0 ? 0 : (result[at - 1] as number);
      const after = at === result.length ? 0 : (result[at] as number);
      const extra = leg(before, s) + leg(s, after) - leg(before, after);
      if (extra < bestExtra - 1e-9) {
        bestExtra = extra;
        bestAt = at;
      }
    }
    result.splice(bestAt, 0, s);
  }
  return result;
}

export function planRouteDayStops(input: RouteDayStopsInput): RouteDayStops {
  const speed = requirePositive(input.speedKmh, 'speedKmh');
  if (!Array.isArray(input.visits)) throw new DomainError('missing-input', 'visits must be a list', 'visits');
  const day = { start: input.dayStart, end: input.dayEnd };
  const unscheduled: RouteDayStops['unscheduled'] = [];
  const open: { visit: VenueVisit; stop: RouteStop }[] = [];
  for (const visit of input.visits) {
    const opening = openingWindow(visit.openingHours, input.day, visit.onSiteMinutes, day);
    if (opening.closedReason) {
      unscheduled.push({ venueId: visit.venueId, reason: opening.closedReason });
      continue;
    }
    open.push({
      visit,
      stop: {
        id: visit.venueId,
        serviceMinutes: visit.onSiteMinutes,
        ...(opening.window ? { earliestArrival: opening.window.earliest, latestArrival: opening.window.latest } : {}),
      },
    });
  }

  // Index 0 is the start point; without one, it sits nowhere: every leg to or from it is free.
  const points = [input.startPoint ?? open[0]?.visit.point ?? { lat: 0, lon: 0 }, ...open.map((o) => o.visit.point)];
  const km = distanceMatrixKm(points).map((row, i) =>
    row.map((d, j) => (input.startPoint === null && (i === 0 || j === 0) ? 0 : d * DETOUR_FACTOR)),
  );
  const minutes = km.map((row) => row.map((d) => Math.round((d / speed) * 60)));
  const problem = {
    stops: open.map((o) => o.stop),
    travelMinutes: minutes,
    cost: km,
    dayStart: input.dayStart,
    dayEnd: input.dayEnd,
    seed: SEED,
    searchRounds: Math.min(SEARCH_ROUNDS, 40 + 10 * open.length),
  };

  const indexOf = new Map(open.map((o, i) => [o.visit.venueId, i + 1]));
  const kept = input.keptOrder.flatMap((id) => indexOf.get(id) ?? []);
  let plan: RouteDayPlan;
  let orderKind: RouteDayStops['orderKind'] = 'planner';
  if (input.keptOrder.length > 0 && open.length > 0) {
    orderKind = 'kept';
    const added = open.map((_, i) => i + 1).filter((i) => !kept.includes(i));
    const order = insertNewStops(kept, added, km).map((i) => open[i - 1]?.visit.venueId as string);
    plan = scheduleInOrder(problem, order);
  } else {
    plan =
      open.length === 0
        ? { visits: [], unscheduled: [], returnAt: input.dayStart, totalTravelMinutes: 0, totalCost: 0 }
        : planRouteDay(problem);
  }

  let previous = 0;
  const visits = plan.visits.map((v) => {
    const at = indexOf.get(v.id) as number;
    const visit: PlannedVisit = {
      venueId: v.id,
      arrival: v.arrival,
      waitMinutes: v.waitMinutes,
      serviceStart: v.serviceStart,
      departure: v.departure,
      travelMinutesFromPrevious: minutes[previous]?.[at] ?? 0,
      kmFromPrevious: round1(km[previous]?.[at] ?? 0),
    };
    previous = at;
    return visit;
  });
  // Waiting at the first door is time better spent at home: leave later by that much (nothing after it moves).
  const first = visits[0];
  const leaveAt = input.dayStart + (first?.waitMinutes ?? 0);
  if (first) {
    first.arrival += first.waitMinutes;
    first.waitMinutes = 0;
  }
  const onSiteMinutes = visits.reduce((sum, v) => sum + (v.departure - v.serviceStart), 0);
  return {
    orderKind,
    leaveAt,
    visits,
    unscheduled: [...unscheduled, ...plan.unscheduled.map((u) => ({ venueId: u.id, reason: u.reason }))],
    returnAt: plan.returnAt,
    totals: { travelMinutes: plan.totalTravelMinutes, km: round1(plan.totalCost), onSiteMinutes },
  };
}

const round1 = (x: number) => Math.round(x * 10) / 10;
