// Route days: one technician's stops for a date, in driving order with arrival times, and what the office changes
// about them (the order kept, a stop moved to another technician or day). Times are the company's wall clock
// ("HH:MM") beside the instant (ISO 8601), so a phone in another zone still shows the venue's time.
import { z } from 'zod';
import { benchJobStates } from './bench-vocabulary.ts';
import { callStates, severities } from './call-vocabulary.ts';
import { stopItemKinds, workOrderStates } from './care-vocabulary.ts';
import { int4, isoDate, isoDateTime, uuid } from './common.ts';

export { stopItemKinds } from './care-vocabulary.ts';

/** Which order the stops are in: the planner's, or the one the dispatcher fixed (kept when the day re-plans). */
export const routeOrderKinds = ['planner', 'kept'] as const;
export type RouteOrderKind = (typeof routeOrderKinds)[number];

/** Where the day starts and ends: the technician's home, or nowhere recorded (the day starts at the first stop). */
export const startPointKinds = ['home', 'none'] as const;

/**
 * A route day's version: 0 until someone first changes the day (no row yet), then the row's version. Every change
 * sends the version it saw; a stale one is refused with the day as it is now.
 */
export const routeDayVersion = int4().min(0, { error: 'must be 0 or more' });

/** GET /api/route-days?day=, GET /api/my-day?day= — without a day, the company's today. */
export const routeDayDateQuery = z.strictObject({ day: isoDate.optional() });
export type RouteDayDateQuery = z.infer<typeof routeDayDateQuery>;

/** :day in the path (the technician's id in the path is looked up, never parsed: a wrong one is simply not found). */
export const routeDayPathDay = z.strictObject({ day: isoDate });

/** PUT /api/route-days/:technicianId/:day/order — the venues in the order to keep. */
export const routeDayOrderInput = z.strictObject({
  venueIds: z
    .array(uuid)
    .max(200, { error: 'must list at most 200 venues' })
    .refine((ids) => new Set(ids).size === ids.length, { error: 'lists a venue twice' }),
  version: routeDayVersion,
});
export type RouteDayOrderInput = z.infer<typeof routeDayOrderInput>;

/** POST /api/route-days/:technicianId/:day/reset-order — back to the planner's order. */
export const routeDayResetInput = z.strictObject({ version: routeDayVersion });
export type RouteDayResetInput = z.infer<typeof routeDayResetInput>;

/** POST /api/route-days/:technicianId/:day/stops/:venueId/move — every item of the stop to another technician or day. */
export const stopMoveInput = z.strictObject({ toTechnicianId: uuid, toDay: isoDate, version: routeDayVersion });
export type StopMoveInput = z.infer<typeof stopMoveInput>;

/** Local wall-clock time on the company's clock. */
const wallClock = z.string().regex(/^\d{2}:\d{2}$/);

export const routeVenue = z.strictObject({
  id: uuid,
  name: z.string(),
  address: z.string(),
  city: z.string(),
  lat: z.number(),
  lng: z.number(),
  /** That date's opening hours in words: "11:00–23:00", "11:00–14:00, 17:00–02:00", "Closed", "Hours not recorded". */
  openingHours: z.string(),
});
export type RouteVenue = z.infer<typeof routeVenue>;

export const routeStopItem = z.strictObject({
  kind: z.enum(stopItemKinds),
  id: uuid,
  title: z.string(),
  game: z.strictObject({ id: uuid, serial: z.string(), modelTitle: z.string() }),
  /** The item's own state (a call's, a work order's or a bench job's). */
  state: z.enum([...new Set([...callStates, ...workOrderStates, ...benchJobStates])] as [string, ...string[]]),
  /** A service call's severity; null for other kinds. */
  severity: z.enum(severities).nullable(),
  onSiteMinutes: z.number().int(),
  version: z.number().int(),
  /** Set when open work planned for an earlier day landed on today: the day it was planned for. */
  carriedOverFrom: isoDate.nullable(),
});
export type RouteStopItem = z.infer<typeof routeStopItem>;

export const routeStop = z.strictObject({
  venue: routeVenue,
  /** When the technician gets there; waits until `serviceStart` if the venue is not open yet. */
  arrival: wallClock,
  arrivalAt: isoDateTime,
  waitMinutes: z.number().int(),
  serviceStart: wallClock,
  serviceStartAt: isoDateTime,
  departure: wallClock,
  departureAt: isoDateTime,
  travelMinutesFromPrevious: z.number().int(),
  kmFromPrevious: z.number(),
  onSiteMinutes: z.number().int(),
  items: z.array(routeStopItem),
  /** Opens the phone's maps app with directions to the venue. */
  mapsUrl: z.string(),
});
export type RouteStop = z.infer<typeof routeStop>;

export const unscheduledStop = z.strictObject({
  venue: routeVenue,
  onSiteMinutes: z.number().int(),
  items: z.array(routeStopItem),
  /** Why it is not on the day, in plain words ("closed that day"). */
  reason: z.string(),
  mapsUrl: z.string(),
});
export type UnscheduledStop = z.infer<typeof unscheduledStop>;

export const routeDay = z.strictObject({
  technician: z.strictObject({
    id: uuid,
    name: z.string(),
    /** Home, where the day starts and ends; null when not recorded (the day then starts at the first stop). */
    startPoint: z.strictObject({ lat: z.number(), lng: z.number() }).nullable(),
    dayStart: wallClock,
    dayEnd: wallClock,
  }),
  day: isoDate,
  timeZone: z.string(),
  version: z.number().int(),
  orderKind: z.enum(routeOrderKinds),
  /** When to leave the start point: the day's start, or later when the first venue opens later. */
  leaveTime: wallClock,
  leaveAt: isoDateTime,
  stops: z.array(routeStop),
  unscheduled: z.array(unscheduledStop),
  /** Back at the start point. */
  returnTime: wallClock,
  returnAt: isoDateTime,
  totals: z.strictObject({ travelMinutes: z.number().int(), km: z.number(), onSiteMinutes: z.number().int() }),
});
export type RouteDay = z.infer<typeof routeDay>;

/** GET /api/route-days?day= — the office's view: every active technician's day (a technician sees only their own). */
export const routeDayBoard = z.strictObject({
  day: isoDate,
  /** The company's today, for the date picker's default and "carried over" wording. */
  today: isoDate,
  timeZone: z.string(),
  days: z.array(routeDay),
});
export type RouteDayBoard = z.infer<typeof routeDayBoard>;

/** POST …/stops/:venueId/move — both days as they now are: where the stop left and where it went. */
export const stopMoved = z.strictObject({ from: routeDay, to: routeDay });
export type StopMoved = z.infer<typeof stopMoved>;
