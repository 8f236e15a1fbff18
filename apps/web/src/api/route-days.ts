// Route-day endpoints: fetchers, query-option factories (the only place their keys live) and hooks. The office's
// board and the technician's My day share them. Changes are optimistic: the stops move in the cache at once, the
// server's re-planned day replaces them, an error puts them back, and a 409 brings the day as it is now.
import { queryOptions, useMutation, useQuery, useQueryClient, type QueryClient } from '@tanstack/react-query';
import type {
  RouteDay,
  RouteDayBoard,
  RouteDayOrderInput,
  RouteDayResetInput,
  StopMoveInput,
  StopMoved,
} from '@bumperline/contracts/route-days';
import { ApiError, get, post, put } from '../lib/api-client.ts';

/**
 * Keys: everything under ['route-days']; the technician's own day under ['route-days', 'my-day', day] (day '' =
 * the company's today), so a persister can keep exactly that prefix for working without signal.
 */
export const routeDayKeys = {
  all: ['route-days'] as const,
  boards: ['route-days', 'board'] as const,
  board: (day: string) => ['route-days', 'board', day] as const,
  days: ['route-days', 'day'] as const,
  day: (technicianId: string, day: string) => ['route-days', 'day', technicianId, day] as const,
  myDays: ['route-days', 'my-day'] as const,
  myDay: (day?: string) => ['route-days', 'my-day', day ?? ''] as const,
};

export const fetchRouteDayBoard = (day?: string) => get<RouteDayBoard>('/api/route-days', { day });
export const fetchRouteDay = (technicianId: string, day: string) => get<RouteDay>(`/api/route-days/${technicianId}/${day}`);
export const fetchMyDay = (day?: string) => get<RouteDay>('/api/my-day', { day });

/** Every active technician's day for a date ('' or undefined: the company's today). */
export const routeDayBoardQuery = (day?: string) =>
  queryOptions({ queryKey: routeDayKeys.board(day ?? ''), queryFn: () => fetchRouteDayBoard(day || undefined) });
export const routeDayQuery = (technicianId: string, day: string) =>
  queryOptions({ queryKey: routeDayKeys.day(technicianId, day), queryFn: () => fetchRouteDay(technicianId, day) });
/** The signed-in technician's day (undefined: the company's today). */
export const myDayQuery = (day?: string) => queryOptions({ queryKey: routeDayKeys.myDay(day), queryFn: () => fetchMyDay(day) });

export const useRouteDayBoard = (day?: string) => useQuery(routeDayBoardQuery(day));
export const useRouteDay = (technicianId: string, day: string) => useQuery(routeDayQuery(technicianId, day));
export const useMyDay = (day?: string) => useQuery(myDayQuery(day));

const dayPath = (technicianId: string, day: string) => `/api/route-days/${technicianId}/${day}`;
export const keepRouteOrder = (technicianId: string, day: string, body: RouteDayOrderInput) =>
  put<RouteDay>(`${dayPath(technicianId, day)}/order`, body);
export const resetRouteOrder = (technicianId: string, day: string, body: RouteDayResetInput) =>
  post<RouteDay>(`${dayPath(technicianId, day)}/reset-order`, body);
/** Answers both days as they now are: where the stop left and where it went. */
export const moveStop = (technicianId: string, day: string, venueId: string, body: StopMoveInput) =>
  post<StopMoved>(`${dayPath(technicianId, day)}/stops/${venueId}/move`, body);

/** Puts a day into every cached view of it: the board for its date, its own query, and My day when it is the reader's. */
export function putRouteDay(qc: QueryClient, day: RouteDay) {
  qc.setQueryData(routeDayKeys.day(day.technician.id, day.day), day);
  for (const [key] of qc.getQueriesData<RouteDayBoard>({ queryKey: routeDayKeys.boards })) {
    qc.setQueryData<RouteDayBoard>(key, (board) =>
      board && board.day === day.day ? { ...board, days: board.days.map((d) => (d.technician.id === day.technician.id ? day : d)) } : board,
    );
  }
  for (const [key] of qc.getQueriesData<RouteDay>({ queryKey: routeDayKeys.myDays })) {
    qc.setQueryData<RouteDay>(key, (mine) => (mine && mine.technician.id === day.technician.id && mine.day === day.day ? day : mine));
  }
}

/** The stops of a cached day in a new order (for the optimistic update; times come from the server's answer). */
function reordered(day: RouteDay, venueIds: readonly string[]): RouteDay {
  const byVenue = new Map(day.stops.map((s) => [s.venue.id, s]));
  const stops = venueIds.flatMap((id) => byVenue.get(id) ?? []);
  return { ...day, orderKind: 'kept', stops: [...stops, ...day.stops.filter((s) => !venueIds.includes(s.venue.id))] };
}

type Snapshot = Array<[readonly unknown[], unknown]>;

async function snapshot(qc: QueryClient): Promise<Snapshot> {
  await qc.cancelQueries({ queryKey: routeDayKeys.all });
  return qc.getQueriesData({ queryKey: routeDayKeys.all });
}

function restore(qc: QueryClient, saved: Snapshot | undefined, error: unknown) {
  for (const [key, data] of saved ?? []) qc.setQueryData(key, data);
  // A 409 carries the day as it is now: show that rather than what was tried.
  const current = error instanceof ApiError && error.status === 409 ? (error.problem.current as RouteDay | undefined) : undefined;
  if (current?.technician) putRouteDay(qc, current);
}

function findDay(qc: QueryClient, technicianId: string, day: string): RouteDay | undefined {
  const own = qc.getQueryData<RouteDay>(routeDayKeys.day(technicianId, day));
  if (own) return own;
  for (const [, board] of qc.getQueriesData<RouteDayBoard>({ queryKey: routeDayKeys.boards })) {
    const found = board?.day === day ? board.days.find((d) => d.technician.id === technicianId) : undefined;
    if (found) return found;
  }
  return undefined;
}

/** Keeps the order the dispatcher dragged the stops into; the day re-plans its times around it. */
export function useKeepRouteOrder() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (v: { technicianId: string; day: string } & RouteDayOrderInput) =>
      keepRouteOrder(v.technicianId, v.day, { venueIds: v.venueIds, version: v.version }),
    onMutate: async (v) => {
      const saved = await snapshot(qc);
      const cached = findDay(qc, v.technicianId, v.day);
      if (cached) putRouteDay(qc, reordered(cached, v.venueIds));
      return { saved };
    },
    onError: (error, _v, context) => restore(qc, context?.saved, error),
    onSuccess: (day) => putRouteDay(qc, day),
  });
}

/** Back to the planner's order. */
export function useResetRouteOrder() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (v: { technicianId: string; day: string } & RouteDayResetInput) =>
      resetRouteOrder(v.technicianId, v.day, { version: v.version }),
    onError: (error) => restore(qc, undefined, error),
    onSuccess: (day) => putRouteDay(qc, day),
  });
}

/** Moves every item of a stop to another technician and/or day; both days come back re-planned. */
export function useMoveStop() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (v: { technicianId: string; day: string; venueId: string } & StopMoveInput) =>
      moveStop(v.technicianId, v.day, v.venueId, { toTechnicianId: v.toTechnicianId, toDay: v.toDay, version: v.version }),
    onMutate: async (v) => {
      const saved = await snapshot(qc);
      const from = findDay(qc, v.technicianId, v.day);
      const stop = from?.stops.find((s) => s.venue.id === v.venueId);
      if (from && stop) {
        putRouteDay(qc, { ...from, stops: from.stops.filter((s) => s !== stop) });
        const to = findDay(qc, v.toTechnicianId, v.toDay);
        if (to) putRouteDay(qc, { ...to, stops: [...to.stops, stop] });
      }
      return { saved };
    },
    onError: (error, _v, context) => restore(qc, context?.saved, error),
    onSuccess: ({ from, to }) => {
      putRouteDay(qc, from);
      putRouteDay(qc, to);
      // The stop's calls and work orders changed technician or day: their own lists show it.
      return Promise.all([qc.invalidateQueries({ queryKey: ['calls'] }), qc.invalidateQueries({ queryKey: ['work-orders'] })]);
    },
  });
}
