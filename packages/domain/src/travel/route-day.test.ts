import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { planRouteDay, type RouteDayInput, type RouteStop } from './route-day.ts';
import { planTour } from './tour-planner.ts';

/** Points on a line, 10 minutes apart per unit: easy to reason about by hand. */
function line(positions: number[]): number[][] {
  const all = [0, ...positions];
  return all.map((a) => all.map((b) => Math.abs(a - b) * 10));
}

/** Every feasible plan by brute force: each subset in each order. Oracle for small cases. */
function bruteForce(input: RouteDayInput): { visited: number; cost: number } {
  const n = input.stops.length;
  let best = { visited: 0, cost: 0 };
  const walk = (order: number[], used: Set<number>) => {
    // Evaluate this order.
    let time = input.dayStart;
    let previous = 0;
    let cost = 0;
    let ok = true;
    for (const s of order) {
      const stop = input.stops[s] as RouteStop;
      const arrival = time + (input.travelMinutes[previous]?.[s + 1] ?? 0);
      if (arrival > (stop.latestArrival ?? Infinity)) ok = false;
      time = Math.max(arrival, stop.earliestArrival ?? -Infinity) + stop.serviceMinutes;
      cost += (input.cost ?? input.travelMinutes)[previous]?.[s + 1] ?? 0;
      previous = s + 1;
    }
    cost += (input.cost ?? input.travelMinutes)[previous]?.[0] ?? 0;
    if (time + (input.travelMinutes[previous]?.[0] ?? 0) > (input.dayEnd ?? Infinity)) ok = false;
    if (!ok) return;
    if (order.length > best.visited || (order.length === best.visited && cost < best.cost)) best = { visited: order.length, cost };
    for (let s = 0; s < n; s++) {
      if (used.has(s)) continue;
      used.add(s);
      walk([...order, s], used);
      used.delete(s);
    }
  };
  walk([], new Set());
  return best;
}

describe('planRouteDay', () => {
  it('without windows it is the shortest tour', () => {
    const travel = line([3, 1, 4, 2]);
    const stops = ['a', 'b', 'c', 'd'].map((id) => ({ id, serviceMinutes: 15 }));
    const plan = planRouteDay({ stops, travelMinutes: travel, dayStart: 8 * 60 });
    expect(plan.unscheduled).toEqual([]);
    expect(plan.totalTravelMinutes).toBe(planTour(travel).length); // 0 → 4 → 0 on a line: 80 minutes
    expect(plan.totalTravelMinutes).toBe(80);
  });

  it('keeps arrival windows, waiting when early, even when that costs more travel', () => {
    // Going out along the line is shortest, but the far venue (c at 4) only takes visits before 08:45.
    const stops: RouteStop[] = [
      { id: 'near', serviceMinutes: 10 },
      { id: 'middle', serviceMinutes: 10, earliestArrival: 10 * 60 },
      { id: 'far', serviceMinutes: 10, latestArrival: 8 * 60 + 45 },
    ];
    const plan = planRouteDay({ stops, travelMinutes: line([1, 2, 4]), dayStart: 8 * 60 });
    expect(plan.unscheduled).toEqual([]);
    const far = plan.visits.find((v) => v.id === 'far');
    const middle = plan.visits.find((v) => v.id === 'middle');
    expect(far?.arrival).toBeLessThanOrEqual(8 * 60 + 45);
    expect(middle?.serviceStart).toBeGreaterThanOrEqual(10 * 60);
    expect(plan.visits[0]?.id).toBe('far');
    expect(middle?.waitMinutes).toBeGreaterThan(0);
  });

  it('reports stops it cannot fit, with the reason, instead of dropping them', () => {
    const stops: RouteStop[] = [
      { id: 'ok', serviceMinutes: 30 },
      { id: 'closed-by-then', serviceMinutes: 10, latestArrival: 8 * 60 + 5 }, // 40 minutes away
      { id: 'after-hours', serviceMinutes: 10, earliestArrival: 20 * 60 },
    ];
    const plan = planRouteDay({ stops, travelMinutes: line([1, 4, 2]), dayStart: 8 * 60, dayEnd: 17 * 60 });
    expect(plan.visits.map((v) => v.id)).toEqual(['ok']);
    expect(plan.unscheduled).toEqual([
      { id: 'closed-by-then', reason: expect.stringMatching(/cannot arrive by 08:05: .* earliest arrival is 08:40/) },
      { id: 'after-hours', reason: expect.stringMatching(/cannot be back by 17:00/) },
    ]);
  });

  it('when two stops compete for one slot, it visits one and says why the other was left', () => {
    const stops: RouteStop[] = [
      { id: 'x', serviceMinutes: 60, earliestArrival: 9 * 60, latestArrival: 9 * 60 },
      { id: 'y', serviceMinutes: 60, earliestArrival: 9 * 60, latestArrival: 9 * 60 },
    ];
    const plan = planRouteDay({ stops, travelMinutes: line([1, 1]), dayStart: 8 * 60 });
    expect(plan.visits).toHaveLength(1);
    expect(plan.unscheduled).toEqual([{ id: expect.any(String), reason: expect.stringMatching(/does not fit/) }]);
  });

  it('arriving exactly at the latest arrival time is in time; the time on site may run past it', () => {
    // The window bounds the start of the visit, ends included, as in the vehicle-routing literature's time windows
    // (Solomon, "Algorithms for the vehicle routing and scheduling problems with time window constraints",
    // Operations Research 35(2), 1987: service begins within [e, l]; from memory). Leaving at 08:00, 40 minutes
    // away: arrival 08:40 = the latest arrival; 30 minutes on site end at 09:10, after it.
    const stop = { id: 'arcade', serviceMinutes: 30, latestArrival: 8 * 60 + 40 };
    const plan = planRouteDay({ stops: [stop], travelMinutes: line([4]), dayStart: 8 * 60 });
    expect(plan.unscheduled).toEqual([]);
    expect(plan.visits).toEqual([{ id: 'arcade', arrival: 520, waitMinutes: 0, serviceStart: 520, departure: 550 }]);
    // A minute earlier closing and the visit cannot be made.
    const late = planRouteDay({ stops: [{ ...stop, latestArrival: 8 * 60 + 39 }], travelMinutes: line([4]), dayStart: 8 * 60 });
    expect(late.visits).toEqual([]);
    expect(late.unscheduled).toEqual([{ id: 'arcade', reason: expect.stringMatching(/cannot arrive by 08:39/) }]);
  });

  it('getting back exactly at the end of the day is in time; a minute later is not', () => {
    // 08:00 + 40 out + 30 on site + 40 back = 09:50 (worked by hand).
    const stops = [{ id: 'arcade', serviceMinutes: 30 }];
    expect(planRouteDay({ stops, travelMinutes: line([4]), dayStart: 480, dayEnd: 590 })).toMatchObject({ returnAt: 590, unscheduled: [] });
    expect(planRouteDay({ stops, travelMinutes: line([4]), dayStart: 480, dayEnd: 589 }).visits).toEqual([]);
  });

  it('two stops on a one-way matrix go round the cheaper way, though the other is the order given (worked by hand)', () => {
    // start → a → b → start = 30 + 30 + 30 = 90 minutes; start → b → a → start = 10 + 10 + 10 = 30.
    const travelMinutes = [
      [0, 30, 10],
      [10, 0, 30],
      [30, 10, 0],
    ];
    const stops = [
      { id: 'a', serviceMinutes: 15 },
      { id: 'b', serviceMinutes: 15 },
    ];
    const plan = planRouteDay({ stops, travelMinutes, dayStart: 480 });
    expect(plan.visits.map((v) => v.id)).toEqual(['b', 'a']);
    expect(plan.totalTravelMinutes).toBe(30);
  });

  it('matches brute force on small random days: as many stops as possible, then least travel (property)', () => {
    const day = fc.integer({ min: 1, max: 6 }).chain((n) =>
      fc.record({
        positions: fc.array(fc.tuple(fc.integer({ min: 0, max: 40 }), fc.integer({ min: 0, max: 40 })), {
          minLength: n + 1,
          maxLength: n + 1,
        }),
        stops: fc.array(
          fc.record({
            service: fc.integer({ min: 0, max: 60 }),
            open: fc.integer({ min: 480, max: 900 }),
            width: fc.option(fc.integer({ min: 0, max: 240 }), { nil: undefined }),
          }),
          { minLength: n, maxLength: n },
        ),
        dayEnd: fc.option(fc.integer({ min: 600, max: 1200 }), { nil: undefined }),
        seed: fc.nat(100),
      }),
    );
    fc.assert(
      fc.property(day, ({ positions, stops, dayEnd, seed }) => {
        const travelMinutes = positions.map(([x1, y1]) => positions.map(([x2, y2]) => Math.abs(x1 - x2) + Math.abs(y1 - y2)));
        const input: RouteDayInput = {
          stops: stops.map((s, i) => ({
            id: `s${i}`,
            serviceMinutes: s.service,
            ...(s.width === undefined ? {} : { earliestArrival: s.open, latestArrival: s.open + s.width }),
          })),
          travelMinutes,
          dayStart: 480,
          ...(dayEnd === undefined ? {} : { dayEnd }),
          seed,
        };
        const plan = planRouteDay(input);
        const oracle = bruteForce(input);
        // Every stop is either visited once or reported.
        expect([...plan.visits.map((v) => v.id), ...plan.unscheduled.map((u) => u.id)].sort()).toEqual(input.stops.map((s) => s.id).sort());
        for (const v of plan.visits) {
          const stop = input.stops.find((s) => s.id === v.id) as RouteStop;
          expect(v.arrival).toBeLessThanOrEqual(stop.latestArrival ?? Infinity);
          expect(v.serviceStart).toBeGreaterThanOrEqual(stop.earliestArrival ?? -Infinity);
        }
        expect(plan.returnAt).toBeLessThanOrEqual(dayEnd ?? Infinity);
        expect(plan.visits.length).toBe(oracle.visited);
        expect(plan.totalCost).toBe(oracle.cost);
      }),
      { numRuns: 150 },
    );
  }, 60_000);

  it('on larger days (beyond exhaustive search) every plan keeps every window and accounts for every stop (property)', () => {
    const day = fc.integer({ min: 13, max: 22 }).chain((n) =>
      fc.record({
        positions: fc.array(fc.tuple(fc.integer({ min: 0, max: 60 }), fc.integer({ min: 0, max: 60 })), {
          minLength: n + 1,
          maxLength: n + 1,
        }),
        stops: fc.array(
          fc.record({
            service: fc.integer({ min: 5, max: 45 }),
            open: fc.integer({ min: 480, max: 960 }),
            width: fc.option(fc.integer({ min: 30, max: 300 }), { nil: undefined }),
          }),
          { minLength: n, maxLength: n },
        ),
        seed: fc.nat(100),
      }),
    );
    fc.assert(
      fc.property(day, ({ positions, stops, seed }) => {
        const travelMinutes = positions.map(([x1, y1]) => positions.map(([x2, y2]) => Math.abs(x1 - x2) + Math.abs(y1 - y2)));
        const input: RouteDayInput = {
          stops: stops.map((s, i) => ({
            id: `s${i}`,
            serviceMinutes: s.service,
            ...(s.width === undefined ? {} : { earliestArrival: s.open, latestArrival: s.open + s.width }),
          })),
          travelMinutes,
          dayStart: 480,
          dayEnd: 1200,
          seed,
        };
        const plan = planRouteDay(input);
        expect([...plan.visits.map((v) => v.id), ...plan.unscheduled.map((u) => u.id)].sort()).toEqual(input.stops.map((s) => s.id).sort());
        let time = 480;
        let previous = 0;
        for (const v of plan.visits) {
          const index = Number(v.id.slice(1));
          const stop = input.stops[index] as RouteStop;
          expect(v.arrival).toBe(time + (travelMinutes[previous]?.[index + 1] ?? NaN));
          expect(v.arrival).toBeLessThanOrEqual(stop.latestArrival ?? Infinity);
          expect(v.serviceStart).toBe(Math.max(v.arrival, stop.earliestArrival ?? -Infinity));
          time = v.departure;
          previous = index + 1;
        }
        expect(plan.returnAt).toBeLessThanOrEqual(1200);
        expect(planRouteDay(input)).toEqual(plan); // deterministic for a seed
      }),
      { numRuns: 25 },
    );
  }, 120_000);

  it('refuses bad input', () => {
    const travel = line([1]);
    const base = { travelMinutes: travel, dayStart: 480 };
    expect(() => planRouteDay({ ...base, stops: [{ id: 'a', serviceMinutes: -5 }] })).toThrow(
      expect.objectContaining({ code: 'negative' }),
    );
    expect(() => planRouteDay({ ...base, stops: [{ id: 'a', serviceMinutes: 5, earliestArrival: 600, latestArrival: 540 }] })).toThrow(
      expect.objectContaining({ code: 'inverted-period' }),
    );
    expect(() =>
      planRouteDay({
        ...base,
        stops: [
          { id: 'a', serviceMinutes: 5 },
          { id: 'a', serviceMinutes: 5 },
        ],
      }),
    ).toThrow(expect.objectContaining({ code: 'invalid-matrix' }));
    expect(() =>
      planRouteDay({
        stops: [
          { id: 'a', serviceMinutes: 5 },
          { id: 'a', serviceMinutes: 5 },
        ],
        travelMinutes: line([1, 2]),
        dayStart: 480,
      }),
    ).toThrow(expect.objectContaining({ code: 'duplicate-id' }));
    expect(() => planRouteDay({ ...base, stops: [{ id: 'a', serviceMinutes: 5 }], dayEnd: 400 })).toThrow(
      expect.objectContaining({ code: 'inverted-period' }),
    );
  });
});
