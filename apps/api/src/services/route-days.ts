// Route days: a technician's stops for a date planned into a driving order with times (or walked in the order the
// dispatcher kept), for one technician or every active one at once, and the office's changes to them.
import { callStateGroups, callStateLabels, type CallState } from '@bumperline/contracts/call-vocabulary';
import type { RouteDay, RouteDayBoard, RouteStop, RouteVenue, UnscheduledStop } from '@bumperline/contracts/route-days';
import type { Tx } from '@bumperline/db/client';
import { updateCall } from '@bumperline/db/queries/calls';
import {
  getRouteDayContext,
  isActiveTechnician,
  listPlannedItems,
  listRouteTechnicians,
  moveBenchJobs,
  moveWorkOrders,
  saveRouteDay,
  touchRouteDay,
  type RouteTechnician,
} from '@bumperline/db/queries/route-days';
import { dayClockInstant, dayClockText } from '@bumperline/domain/travel/day-clock';
import { directionsUrl } from '@bumperline/domain/travel/maps-link';
import { clockMinutes, openingWindow } from '@bumperline/domain/travel/opening-window';
import { dateInZone } from './company-today.ts';
import { plannedStops } from './route-day-plans.ts';
import { gatherStops, type GatheredStop } from './route-day-stops.ts';
import { assignCall, type CallActor } from './service-calls.ts';
import { Conflict, InvalidInput, NotFound } from './workflow-errors.ts';

interface Clock {
  timeZone: string;
  averageSpeedKmh: number;
  today: string;
}

async function companyClock(tx: Tx, now: Date = new Date()): Promise<Clock> {
  const context = await getRouteDayContext(tx);
  return { ...context, today: dateInZone(context.timeZone, now) };
}

/** A technician's own clock for the day, read leniently: a malformed stored time falls back to the default day. */
function dayHours(t: RouteTechnician): { start: number; end: number; startText: string; endText: string } {
  try {
    const start = clockMinutes(t.dayStart, 'dayStart');
    const end = clockMinutes(t.dayEnd, 'dayEnd', true);
    if (end > start) return { start, end, startText: t.dayStart, endText: t.dayEnd };
  } catch {
    // fall through to the default day
  }
  return { start: 480, end: 1020, startText: '08:00', endText: '17:00' };
}

function venueOut(stop: GatheredStop, day: string, hours: { start: number; end: number }): RouteVenue {
  const { openingHours, ...venue } = stop.venue;
  return { ...venue, openingHours: openingWindow(openingHours, day, stop.onSiteMinutes, hours).hoursText };
}

/** Plans one technician's day from their gathered stops and turns the day clock into wall times and instants. */
function planDay(technician: RouteTechnician, stops: readonly GatheredStop[], day: string, clock: Clock): RouteDay {
  const hours = dayHours(technician);
  const startPoint =
    technician.homeLatitude !== null && technician.homeLongitude !== null
      ? { lat: technician.homeLatitude, lon: technician.homeLongitude }
      : null;
  const plan = plannedStops({
    day,
    dayStart: hours.start,
    dayEnd: hours.end,
    startPoint,
    speedKmh: clock.averageSpeedKmh,
    visits: stops.map((s) => ({
      venueId: s.venue.id,
      point: { lat: s.venue.lat, lon: s.venue.lng },
      openingHours: s.venue.openingHours,
      onSiteMinutes: s.onSiteMinutes,
    })),
    keptOrder: technician.stopOrder ?? [],
  });
  const byVenue = new Map(stops.map((s) => [s.venue.id, s]));
  const at = (minutes: number) => new Date(dayClockInstant(day, minutes, clock.timeZone)).toISOString();
  const mapsUrl = (s: GatheredStop) => directionsUrl({ lat: s.venue.lat, lon: s.venue.lng });
  const planned: RouteStop[] = plan.visits.map((v) => {
    const stop = byVenue.get(v.venueId) as GatheredStop;
    return {
      venue: venueOut(stop, day, hours),
      arrival: dayClockText(v.arrival),
      arrivalAt: at(v.arrival),
      waitMinutes: v.waitMinutes,
      serviceStart: dayClockText(v.serviceStart),
      serviceStartAt: at(v.serviceStart),
      departure: dayClockText(v.departure),
      departureAt: at(v.departure),
      travelMinutesFromPrevious: v.travelMinutesFromPrevious,
      kmFromPrevious: v.kmFromPrevious,
      onSiteMinutes: stop.onSiteMinutes,
      items: stop.items,
      mapsUrl: mapsUrl(stop),
    };
  });
  const unscheduled: UnscheduledStop[] = plan.unscheduled.map((u) => {
    const stop = byVenue.get(u.venueId) as GatheredStop;
    return {
      venue: venueOut(stop, day, hours),
      onSiteMinutes: stop.onSiteMinutes,
      items: stop.items,
      reason: u.reason,
      mapsUrl: mapsUrl(stop),
    };
  });
  return {
    technician: {
      id: technician.id,
      name: technician.name,
      startPoint: startPoint ? { lat: startPoint.lat, lng: startPoint.lon } : null,
      dayStart: hours.startText,
      dayEnd: hours.endText,
    },
    day,
    timeZone: clock.timeZone,
    version: technician.version ?? 0,
    orderKind: plan.orderKind,
    leaveTime: dayClockText(plan.leaveAt),
    leaveAt: at(plan.leaveAt),
    stops: planned,
    unscheduled,
    returnTime: dayClockText(plan.returnAt),
    returnAt: at(plan.returnAt),
    totals: plan.totals,
  };
}

/** The days of these technicians on `day`: one statement per item kind for all of them. */
async function planDays(tx: Tx, technicians: readonly RouteTechnician[], day: string, clock: Clock): Promise<RouteDay[]> {
  const items = await listPlannedItems(tx, { technicianIds: technicians.map((t) => t.id), day, isToday: day === clock.today });
  const stops = gatherStops(items, day);
  return technicians.map((t) => planDay(t, stops.get(t.id) ?? [], day, clock));
}

/** Every active technician's day (or only `onlyTechnicianId`'s: a technician's own view of the board). */
export async function routeDayBoard(tx: Tx, p: { day?: string; onlyTechnicianId?: string; now?: Date }): Promise<RouteDayBoard> {
  const clock = await companyClock(tx, p.now);
  const day = p.day ?? clock.today;
  const technicians = await listRouteTechnicians(tx, { day, onlyUserId: p.onlyTechnicianId });
  return { day, today: clock.today, timeZone: clock.timeZone, days: await planDays(tx, technicians, day, clock) };
}

/** One technician's day; not found unless they are an active technician of the company. */
export async function routeDayOf(tx: Tx, p: { technicianId: string; day?: string; now?: Date }): Promise<RouteDay> {
  const clock = await companyClock(tx, p.now);
  const day = p.day ?? clock.today;
  const [technician] = await listRouteTechnicians(tx, { day, onlyUserId: p.technicianId });
  if (!technician) throw new NotFound('technician’s day');
  const [planned] = await planDays(tx, [technician], day, clock);
  return planned as RouteDay;
}

const STALE = 'Someone changed this route day first. Here it is as it stands now.';

/** Keeps the dispatcher's order of the day's venues. */
export async function keepStopOrder(
  tx: Tx,
  p: { technicianId: string; day: string; venueIds: readonly string[]; version: number; userId: string },
): Promise<RouteDay> {
  const current = await routeDayOf(tx, p);
  const onDay = [...current.stops, ...current.unscheduled].map((s) => s.venue.id);
  // The venues named first, then the day's others where they stand now (those that could not be fitted last), so
  // the whole day's order is kept as seen; venues not on the day are dropped.
  const named = p.venueIds.filter((id) => onDay.includes(id));
  const stopOrder = [...named, ...onDay.filter((id) => !named.includes(id))];
  const saved = await saveRouteDay(tx, { ...p, stopOrder });
  if (saved === undefined) throw new Conflict(STALE, current, [{ field: 'version', message: 'is not the latest' }]);
  return routeDayOf(tx, p);
}

/** Back to the planner's order. */
export async function resetStopOrder(tx: Tx, p: { technicianId: string; day: string; version: number; userId: string }): Promise<RouteDay> {
  const saved = await saveRouteDay(tx, { ...p, stopOrder: [] });
  if (saved === undefined) throw new Conflict(STALE, await routeDayOf(tx, p), [{ field: 'version', message: 'is not the latest' }]);
  return routeDayOf(tx, p);
}

export interface StopMove {
  technicianId: string;
  day: string;
  venueId: string;
  toTechnicianId: string;
  toDay: string;
  version: number;
  actor: CallActor & { userId: string };
  appOrigin: string;
}

/**
 * Moves every item of a stop to another technician and/or day, in the caller's one transaction: calls changing
 * technician go through the call assignment (its timeline event and the technician's SMS, as when assigned from
 * the call), then every item gets the new day. Both days' versions move on. Answers what moved and both days now.
 */
export async function moveStop(tx: Tx, p: StopMove): Promise<{ from: RouteDay; to: RouteDay; moved: { kind: string; id: string }[] }> {
  const current = await routeDayOf(tx, p);
  if (current.version !== p.version) throw new Conflict(STALE, current, [{ field: 'version', message: 'is not the latest' }]);
  const stop = [...current.stops, ...current.unscheduled].find((s) => s.venue.id === p.venueId);
  if (!stop) throw new NotFound('stop');
  if (p.toTechnicianId === p.technicianId && p.toDay === p.day) {
    throw new InvalidInput([{ field: 'toDay', message: 'is the day the stop is already on: choose another technician or day' }]);
  }
  if (p.toTechnicianId !== p.technicianId && !(await isActiveTechnician(tx, p.toTechnicianId))) {
    throw new InvalidInput([{ field: 'toTechnicianId', message: 'is not an active technician of this company' }]);
  }
  const newTechnician = p.toTechnicianId !== p.technicianId;
  for (const item of stop.items) {
    if (item.kind === 'service_call' && newTechnician && !(callStateGroups.awaitingArrival as readonly string[]).includes(item.state)) {
      throw new Conflict(
        `A call that is "${callStateLabels[item.state as CallState]}" stays with its technician: move the stop to another day instead.`,
        current,
      );
    }
  }
  // The day's version first: of two changes from the same view, the second is turned away before it moves anything.
  if ((await saveRouteDay(tx, { technicianId: p.technicianId, day: p.day, version: p.version, userId: p.actor.userId })) === undefined) {
    throw new Conflict(STALE, current, [{ field: 'version', message: 'is not the latest' }]);
  }
  const to = { technicianId: p.toTechnicianId, day: p.toDay };
  for (const item of stop.items.filter((i) => i.kind === 'service_call')) {
    let version = item.version;
    if (newTechnician) {
      const assigned = await assignCall(tx, {
        callId: item.id,
        technicianId: p.toTechnicianId,
        version,
        actor: p.actor,
        appOrigin: p.appOrigin,
      });
      version = assigned.version;
    }
    if (!(await updateCall(tx, item.id, version, { plannedOn: p.toDay }))) throw new Conflict(STALE, current);
  }
  const orders = stop.items.filter((i) => i.kind === 'work_order').map((i) => i.id);
  const jobs = stop.items.filter((i) => i.kind === 'bench_job').map((i) => i.id);
  const movedOrders = await moveWorkOrders(tx, orders, to);
  const movedJobs = await moveBenchJobs(tx, jobs, to);
  if (movedOrders.length !== orders.length || movedJobs.length !== jobs.length) throw new Conflict(STALE, current);
  await touchRouteDay(tx, { ...to, userId: p.actor.userId });
  return {
    from: await routeDayOf(tx, p),
    to: await routeDayOf(tx, { technicianId: p.toTechnicianId, day: p.toDay }),
    moved: stop.items.map((i) => ({ kind: i.kind, id: i.id })),
  };
}
