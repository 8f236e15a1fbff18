import { DomainError } from '../errors.ts';
import { requireFinite, requireNonNegative, requireNonNegativeInteger } from '../input-checks.ts';
import { randomInt, seededRandom, type Random } from './seeded-random.ts';
import { planTour } from './tour-planner.ts';
import { validateMatrix, type Matrix } from './travel-matrix.ts';

/**
 * One technician's route day: the order to visit stops from a start point and back, least total cost (distance or
 * time), arriving at each venue inside its window (earliest to latest arrival; arriving early means waiting) and
 * staying its time on site. Without windows this is the plain tour. When that tour misses a window, a small day is
 * searched exhaustively (every order of every subset, with pruning, within a fixed budget); otherwise tightest-window-
 * first insertion, feasible-only relocation and 2-opt, seeded ruin-and-recreate, and swaps of left-out stops. Most stops visited comes first, then
 * least cost. Stops that cannot be fitted are listed with the reason, never dropped silently. Times are minutes on
 * one clock (minutes after local midnight).
 */

export interface RouteStop {
  id: string;
  serviceMinutes: number;
  /** Arriving before this means waiting until it. */
  earliestArrival?: number;
  /** The last moment to arrive, itself included; the time on site may run past it (the window bounds the arrival). */
  latestArrival?: number;
}

export interface RouteDayInput {
  stops: readonly RouteStop[];
  /** Travel minutes; row and column 0 are the start point, i + 1 is stops[i]. */
  travelMinutes: Matrix;
  /** What to minimise, same shape (e.g. km); default: travel minutes. */
  cost?: Matrix;
  dayStart: number;
  /** Back at the start point by this time, if given. */
  dayEnd?: number;
  seed?: number;
  /**
   * Ruin-and-recreate rounds when the plain tour misses a window (default min(400, 40 + 10 per stop)): fewer answer
   * sooner for a screen that re-plans on every look, at some cost in driving.
   */
  searchRounds?: number;
}

export interface Visit {
  id: string;
  arrival: number;
  waitMinutes: number;
  serviceStart: number;
  departure: number;
}

export interface UnscheduledStop {
  id: string;
  reason: string;
}

export interface RouteDayPlan {
  visits: Visit[];
  unscheduled: UnscheduledStop[];
  returnAt: number;
  totalTravelMinutes: number;
  totalCost: number;
}

interface Problem {
  stops: Array<Required<Omit<RouteStop, 'earliestArrival' | 'latestArrival'>> & { earliest: number; latest: number }>;
  travel: Matrix;
  cost: Matrix;
  dayStart: number;
  dayEnd: number;
}

interface Evaluation {
  feasible: boolean;
  cost: number;
}

const EPS = 1e-9;
/** Small days are searched exhaustively, within this many prefixes; the heuristics take over beyond it. */
const EXACT_SEARCH_MAX_STOPS = 12;
const EXACT_SEARCH_NODE_BUDGET = 200_000;

export function clock(minutes: number): string {
  const whole = Math.round(minutes);
  const sign = whole < 0 ? '-' : '';
  const m = Math.abs(whole);
  return `${sign}${String(Math.floor(m / 60)).padStart(2, '0')}:${String(m % 60).padStart(2, '0')}`;
}

function prepare(input: RouteDayInput): Problem {
  if (input === null || typeof input !== 'object' || !Array.isArray(input.stops)) {
    throw new DomainError('missing-input', 'a route day needs stops and a travel-time matrix', 'stops');
  }
  const n = input.stops.length;
  const travel = validateMatrix(input.travelMinutes, 'travelMinutes');
  const cost = input.cost === undefined ? travel : validateMatrix(input.cost, 'cost');
  for (const [matrix, field] of [
    [travel, 'travelMinutes'],
    [cost, 'cost'],
  ] as const) {
    if (matrix.length !== n + 1) {
      throw new DomainError('invalid-matrix', `${field} must be ${n + 1}×${n + 1}: the start point, then each stop`, field);
    }
  }
  const dayStart = requireFinite(input.dayStart, 'dayStart');
  const dayEnd = input.dayEnd === undefined ? Infinity : requireFinite(input.dayEnd, 'dayEnd');
  if (dayEnd < dayStart)
    throw new DomainError('inverted-period', `the day ends (${clock(dayEnd)}) before it starts (${clock(dayStart)})`, 'dayEnd');
  const seen = new Set<string>();
  const stops = input.stops.map((stop, i) => {
    const field = `stops[${i}]`;
    if (typeof stop?.id !== 'string' || stop.id === '') throw new DomainError('missing-input', `${field} needs an id`, `${field}.id`);
    if (seen.has(stop.id)) throw new DomainError('duplicate-id', `stop ${stop.id} appears twice`, `${field}.id`);
    seen.add(stop.id);
    const earliest = stop.earliestArrival === undefined ? -Infinity : requireFinite(stop.earliestArrival, `${field}.earliestArrival`);
    const latest = stop.latestArrival === undefined ? Infinity : requireFinite(stop.latestArrival, `${field}.latestArrival`);
    if (latest < earliest) {
      throw new DomainError(
        'inverted-period',
        `stop ${stop.id}: latest arrival ${clock(latest)} is before earliest ${clock(earliest)}`,
        `${field}.latestArrival`,
      );
    }
    return { id: stop.id, serviceMinutes: requireNonNegative(stop.serviceMinutes, `${field}.serviceMinutes`), earliest, latest };
  });
  return { stops, travel, cost, dayStart, dayEnd };
}

/** Walks a visiting order (stop indices, 0-based) and reports whether every window and the day's end are kept. */
function evaluate(problem: Problem, order: readonly number[]): Evaluation {
  let time = problem.dayStart;
  let previous = 0;
  let cost = 0;
  for (const s of order) {
    const stop = problem.stops[s];
    if (!stop) return { feasible: false, cost: Infinity };
    const arrival = time + (problem.travel[previous]?.[s + 1] ?? 0);
    if (arrival > stop.latest + EPS) return { feasible: false, cost: Infinity };
    time = Math.max(arrival, stop.earliest) + stop.serviceMinutes;
    cost += problem.cost[previous]?.[s + 1] ?? 0;
    previous = s + 1;
  }
  const back = time + (problem.travel[previous]?.[0] ?? 0);
  cost += problem.cost[previous]?.[0] ?? 0;
  return { feasible: back <= problem.dayEnd + EPS, cost };
}

function schedule(problem: Problem, order: readonly number[]): { visits: Visit[]; returnAt: number; travel: number; cost: number } {
  let time = problem.dayStart;
  let previous = 0;
  let travel = 0;
  let cost = 0;
  const visits: Visit[] = [];
  for (const s of order) {
    const stop = problem.stops[s] as Problem['stops'][number];
    const leg = problem.travel[previous]?.[s + 1] ?? 0;
    const arrival = time + leg;
    const serviceStart = Math.max(arrival, stop.earliest);
    time = serviceStart + stop.serviceMinutes;
    travel += leg;
    cost += problem.cost[previous]?.[s + 1] ?? 0;
    visits.push({ id: stop.id, arrival, waitMinutes: serviceStart - arrival, serviceStart, departure: time });
    previous = s + 1;
  }
  const back = problem.travel[previous]?.[0] ?? 0;
  return { visits, returnAt: time + back, travel: travel + back, cost: cost + (problem.cost[previous]?.[0] ?? 0) };
}

/** Why a stop cannot be visited even on its own, or null if it can. */
function aloneReason(problem: Problem, s: number): string | null {
  const stop = problem.stops[s] as Problem['stops'][number];
  const arrival = problem.dayStart + (problem.travel[0]?.[s + 1] ?? 0);
  if (arrival > stop.latest + EPS) {
    return `cannot arrive by ${clock(stop.latest)}: leaving at ${clock(problem.dayStart)} the earliest arrival is ${clock(arrival)}`;
  }
  const back = Math.max(arrival, stop.earliest) + stop.serviceMinutes + (problem.travel[s + 1]?.[0] ?? 0);
  if (back > problem.dayEnd + EPS) {
    return `cannot be back by ${clock(problem.dayEnd)}: a visit on its own returns at ${clock(back)}`;
  }
  return null;
}

/** Lexicographic: more stops visited first, then lower cost. */
function better(a: { order: number[]; cost: number }, b: { order: number[]; cost: number }): boolean {
  return a.order.length > b.order.length || (a.order.length === b.order.length && a.cost < b.cost - EPS);
}

/** Cheapest feasible place for stop s in order, or null. */
function cheapestInsertion(problem: Problem, order: number[], s: number): { order: number[]; cost: number } | null {
  let best: { order: number[]; cost: number } | null = null;
  for (let at = 0; at <= order.length; at++) {
    const candidate = [...order.slice(0, at), s, ...order.slice(at)];
    const e = evaluate(problem, candidate);
    if (e.feasible && (!best || e.cost < best.cost - EPS)) best = { order: candidate, cost: e.cost };
  }
  return best;
}

function insertAll(problem: Problem, order: number[], pending: readonly number[]): { order: number[]; cost: number } {
  let current = { order, cost: evaluate(problem, order).cost };
  for (const s of pending) {
    const next = cheapestInsertion(problem, current.order, s);
    if (next) current = next;
  }
  return current;
}

type MoveKind = 'relocate' | 'swap' | 'reverse';

/** The stop at position k after a move: a run of `length` from i moved to start at j; i and j swapped; i..j reversed. */
function stopAfterMove(order: readonly number[], kind: MoveKind, i: number, j: number, length: number, k: number): number {
  if (kind === 'swap') return (k === i ? order[j] : k === j ? order[i] : order[k]) as number;
  if (kind === 'reverse') return (k >= i && k <= j ? order[i + j - k] : order[k]) as number;
  if (k >= j && k < j + length) return order[i + k - j] as number;
  const r = k < j ? k : k - length; // position in the order with the run lifted out
  return (r < i ? order[r] : order[r + length]) as number;
}

/**
 * Feasible-only moves until none lowers the cost: relocate a run of 1–3 stops, swap two stops, reverse a stretch.
 * A move is scored without building the new order: the schedule before the first changed position is kept from the
 * current order and only the rest is walked again. (No closures in the loop: this is the planner's hot path.)
 */
function improve(problem: Problem, start: { order: number[]; cost: number }): { order: number[]; cost: number } {
  let order = start.order;
  let cost = start.cost;
  const n = order.length;
  const departAt = new Float64Array(n);
  const costTo = new Float64Array(n);

  const index = () => {
    let time = problem.dayStart;
    let previous = 0;
    let total = 0;
    for (let k = 0; k < n; k++) {
      const s = order[k] as number;
      const stop = problem.stops[s] as Problem['stops'][number];
      time = Math.max(time + (problem.travel[previous]?.[s + 1] ?? 0), stop.earliest) + stop.serviceMinutes;
      total += problem.cost[previous]?.[s + 1] ?? 0;
      departAt[k] = time;
      costTo[k] = total;
      previous = s + 1;
    }
  };

  /** Applies the move if it keeps every window and lowers the cost. */
  const tryMove = (kind: MoveKind, i: number, j: number, length: number): boolean => {
    const from = kind === 'relocate' ? Math.min(i, j) : i;
    let time = from === 0 ? problem.dayStart : (departAt[from - 1] as number);
    let previous = from === 0 ? 0 : (order[from - 1] as number) + 1;
    let total = from === 0 ? 0 : (costTo[from - 1] as number);
    for (let k = from; k < n; k++) {
      const s = stopAfterMove(order, kind, i, j, length, k);
      const stop = problem.stops[s] as Problem['stops'][number];
      const arrival = time + (problem.travel[previous]?.[s + 1] ?? 0);
      if (arrival > stop.latest + EPS) return false;
      time = Math.max(arrival, stop.earliest) + stop.serviceMinutes;
      total += problem.cost[previous]?.[s + 1] ?? 0;
      if (total >= cost - EPS) return false; // costs never fall, so this move cannot win
      previous = s + 1;
    }
    if (time + (problem.travel[previous]?.[0] ?? 0) > problem.dayEnd + EPS) return false;
    total += problem.cost[previous]?.[0] ?? 0;
    if (total >= cost - EPS) return false;
    const next = new Array<number>(n);
    for (let k = 0; k < n; k++) next[k] = stopAfterMove(order, kind, i, j, length, k);
    order = next;
    cost = total;
    index();
    return true;
  };

  index();
  let improved = true;
  while (improved) {
    improved = false;
    for (let length = 1; length <= 3 && !improved; length++) {
      for (let i = 0; i + length <= n && !improved; i++) {
        for (let j = 0; j + length <= n && !improved; j++) {
          if (j !== i) improved = tryMove('relocate', i, j, length);
        }
      }
    }
    for (let i = 0; i < n - 1 && !improved; i++) {
      for (let j = i + 1; j < n && !improved; j++) improved = tryMove('swap', i, j, 0);
    }
    for (let i = 0; i < n - 1 && !improved; i++) {
      for (let j = i + 2; j < n && !improved; j++) improved = tryMove('reverse', i, j, 0);
    }
  }
  return { order, cost };
}

/** Swaps a visited stop for one left out when that lowers the cost: which stops to leave out matters as much as order. */
function exchange(
  problem: Problem,
  start: { order: number[]; cost: number },
  candidates: readonly number[],
): { order: number[]; cost: number } {
  let current = start;
  let improved = true;
  while (improved) {
    improved = false;
    const outside = candidates.filter((s) => !current.order.includes(s));
    for (const u of outside) {
      for (let i = 0; i < current.order.length && !improved; i++) {
        const without = [...current.order.slice(0, i), ...current.order.slice(i + 1)];
        const attempt = cheapestInsertion(problem, without, u);
        if (attempt && attempt.cost < current.cost - EPS) {
          current = improve(problem, attempt);
          improved = true;
        }
      }
      if (improved) break;
    }
  }
  return current;
}

/**
 * Every order of every subset, depth first: a prefix that misses a window can only get later, so it is cut off with
 * everything after it, and so is a prefix that can no longer beat the best found. Stops after `nodeBudget` prefixes
 * (deterministically) and says whether the search was complete, i.e. whether its answer is the optimum.
 */
function exactSearch(
  problem: Problem,
  candidates: readonly number[],
  nodeBudget: number,
): { best: { order: number[]; cost: number }; complete: boolean } {
  let best = { order: [] as number[], cost: evaluate(problem, []).cost };
  let nodes = 0;
  const order: number[] = [];
  const used = new Set<number>();
  const visit = (time: number, previous: number, cost: number): boolean => {
    if (++nodes > nodeBudget) return false;
    const back = time + (problem.travel[previous]?.[0] ?? 0);
    const total = cost + (problem.cost[previous]?.[0] ?? 0);
    if (back <= problem.dayEnd + EPS && better({ order, cost: total }, best)) best = { order: [...order], cost: total };
    let reachable = 0;
    for (const s of candidates) {
      if (!used.has(s) && time + (problem.travel[previous]?.[s + 1] ?? 0) <= (problem.stops[s]?.latest ?? Infinity) + EPS) reachable++;
    }
    // Bound: no way to visit more stops than the best, or as many but already no cheaper (costs are never negative).
    if (order.length + reachable < best.order.length) return true;
    if (order.length + reachable === best.order.length && cost >= best.cost - EPS) return true;
    for (const s of candidates) {
      if (used.has(s)) continue;
      const stop = problem.stops[s] as Problem['stops'][number];
      const arrival = time + (problem.travel[previous]?.[s + 1] ?? 0);
      if (arrival > stop.latest + EPS) continue;
      used.add(s);
      order.push(s);
      const finished = visit(Math.max(arrival, stop.earliest) + stop.serviceMinutes, s + 1, cost + (problem.cost[previous]?.[s + 1] ?? 0));
      order.pop();
      used.delete(s);
      if (!finished) return false;
    }
    return true;
  };
  const complete = visit(problem.dayStart, 0, 0);
  return { best, complete };
}

function byTightness(problem: Problem, stops: readonly number[]): number[] {
  return [...stops].sort((a, b) => {
    const sa = problem.stops[a] as Problem['stops'][number];
    const sb = problem.stops[b] as Problem['stops'][number];
    return sa.latest - sb.latest || sa.earliest - sb.earliest || a - b;
  });
}

function shuffled<T>(items: readonly T[], random: Random): T[] {
  const out = [...items];
  for (let i = out.length - 1; i > 0; i--) {
    const j = randomInt(random, i + 1);
    [out[i], out[j]] = [out[j] as T, out[i] as T];
  }
  return out;
}

export function planRouteDay(input: RouteDayInput): RouteDayPlan {
  const problem = prepare(input);
  const seed = input.seed === undefined ? 1 : requireNonNegativeInteger(input.seed, 'seed');
  const random = seededRandom(seed);
  const unscheduled: UnscheduledStop[] = [];
  const candidates: number[] = [];
  problem.stops.forEach((stop, s) => {
    const reason = aloneReason(problem, s);
    if (reason) unscheduled.push({ id: stop.id, reason });
    else candidates.push(s);
  });

  // First the shortest tour ignoring windows: if it keeps them all, the windows cost nothing.
  const sub = [0, ...candidates.map((s) => s + 1)];
  const tour = planTour(
    sub.map((i) => sub.map((j) => problem.cost[i]?.[j] ?? 0)),
    { seed },
  )
    .order.slice(1)
    .map((k) => (sub[k] as number) - 1);
  // A symmetric tour costs the same either way round, but the windows may only suit one direction.
  const reversedTour = [...tour].reverse();
  const forward = evaluate(problem, tour);
  const backward = evaluate(problem, reversedTour);
  let best = forward.feasible || !backward.feasible ? { order: tour, cost: forward.cost } : { order: reversedTour, cost: backward.cost };

  const exact =
    !forward.feasible && !backward.feasible && candidates.length <= EXACT_SEARCH_MAX_STOPS
      ? exactSearch(problem, candidates, EXACT_SEARCH_NODE_BUDGET)
      : null;
  if (exact?.complete) {
    best = exact.best;
  } else if (!forward.feasible && !backward.feasible) {
    // Repair the tour by dropping stops that arrive late, then build by tightest window first; keep the better.
    const kept: number[] = [];
    for (const s of tour) if (evaluate(problem, [...kept, s]).feasible) kept.push(s);
    const repaired = improve(
      problem,
      insertAll(
        problem,
        kept,
        tour.filter((s) => !kept.includes(s)),
      ),
    );
    const built = improve(problem, insertAll(problem, [], byTightness(problem, candidates)));
    best = better(built, repaired) ? built : repaired;

    // Ruin and recreate: lift a few stops out and put them and any left-over stops back in a new order.
    const rounds =
      input.searchRounds === undefined
        ? Math.min(400, 40 + 10 * candidates.length)
        : requireNonNegativeInteger(input.searchRounds, 'searchRounds');
    for (let r = 0; r < rounds && candidates.length > 1; r++) {
      const lift = 1 + randomInt(random, Math.max(1, Math.ceil(best.order.length * 0.3)));
      const removed = new Set(shuffled(best.order, random).slice(0, lift));
      const remaining = best.order.filter((s) => !removed.has(s));
      const pending = candidates.filter((s) => !remaining.includes(s));
      const order = r % 2 === 0 ? byTightness(problem, pending) : shuffled(pending, random);
      const attempt = improve(problem, insertAll(problem, remaining, order));
      if (better(attempt, best)) best = attempt;
    }
    best = exchange(problem, best, candidates);
    if (exact && better(exact.best, best)) best = exact.best;
  }

  const placed = new Set(best.order);
  for (const s of candidates) {
    if (!placed.has(s)) {
      unscheduled.push({
        id: problem.stops[s]?.id ?? '',
        reason: 'does not fit alongside the other stops within their arrival windows and the day',
      });
    }
  }
  const plan = schedule(problem, best.order);
  return { visits: plan.visits, unscheduled, returnAt: plan.returnAt, totalTravelMinutes: plan.travel, totalCost: plan.cost };
}

/**
 * Times for stops visited in a given order (the one a dispatcher fixed), without reordering. A stop that cannot be
 * reached inside its window, or after which the technician could not be back by the day's end, is left out and
 * reported with the reason — the order of the others is kept and their times are walked on without it. `order`
 * lists every stop's id exactly once.
 */
export function scheduleInOrder(input: RouteDayInput, order: readonly string[]): RouteDayPlan {
  const problem = prepare(input);
  const indexOf = new Map(problem.stops.map((stop, s) => [stop.id, s]));
  if (!Array.isArray(order) || order.length !== problem.stops.length || new Set(order).size !== order.length) {
    throw new DomainError('conflicting-input', `the order must list each of the ${problem.stops.length} stops once`, 'order');
  }
  const unscheduled: UnscheduledStop[] = [];
  const kept: number[] = [];
  let time = problem.dayStart;
  let previous = 0;
  for (const id of order) {
    const s = indexOf.get(id);
    if (s === undefined) throw new DomainError('conflicting-input', `the order names ${id}, which is not a stop of the day`, 'order');
    const stop = problem.stops[s] as Problem['stops'][number];
    const arrival = time + (problem.travel[previous]?.[s + 1] ?? 0);
    if (arrival > stop.latest + EPS) {
      unscheduled.push({
        id,
        reason: `in this order it would arrive at ${clock(arrival)}, after the last arrival at ${clock(stop.latest)}`,
      });
      continue;
    }
    const departure = Math.max(arrival, stop.earliest) + stop.serviceMinutes;
    const back = departure + (problem.travel[s + 1]?.[0] ?? 0);
    if (back > problem.dayEnd + EPS) {
      unscheduled.push({ id, reason: `in this order the day would end at ${clock(back)}, after ${clock(problem.dayEnd)}` });
      continue;
    }
    kept.push(s);
    time = departure;
    previous = s + 1;
  }
  const plan = schedule(problem, kept);
  return { visits: plan.visits, unscheduled, returnAt: plan.returnAt, totalTravelMinutes: plan.travel, totalCost: plan.cost };
}
