import { describe, expect, it } from 'vitest';
import { planRouteDay, scheduleInOrder, type RouteDayInput } from './route-day.ts';

/** Points on a line, 10 minutes apart per unit: times are easy to work by hand. */
function line(positions: number[]): number[][] {
  const all = [0, ...positions];
  return all.map((a) => all.map((b) => Math.abs(a - b) * 10));
}

describe('scheduleInOrder', () => {
  it('walks the given order, not the shortest: worked by hand', () => {
    // Stops at 1, 2, 3 (10 min apart). Order c, a, b from 08:00 (480): c at 510, leaves 540; a at 560, leaves 590;
    // b at 600, leaves 630; home at 650. Travel 30 + 20 + 10 + 20 = 80.
    const input: RouteDayInput = {
      stops: [
        { id: 'a', serviceMinutes: 30 },
        { id: 'b', serviceMinutes: 30 },
        { id: 'c', serviceMinutes: 30 },
      ],
      travelMinutes: line([1, 2, 3]),
      dayStart: 480,
    };
    const plan = scheduleInOrder(input, ['c', 'a', 'b']);
    expect(plan.visits.map((v) => [v.id, v.arrival, v.departure])).toEqual([
      ['c', 510, 540],
      ['a', 560, 590],
      ['b', 600, 630],
    ]);
    expect(plan.returnAt).toBe(650);
    expect(plan.totalTravelMinutes).toBe(80);
    expect(plan.unscheduled).toEqual([]);
    // The planner would take the shorter way round (a, b, c or its reverse: 60 min of travel).
    expect(planRouteDay(input).totalTravelMinutes).toBe(60);
  });

  it('waits for opening and reports a stop it reaches after its last arrival, keeping the others in order', () => {
    const input: RouteDayInput = {
      stops: [
        { id: 'a', serviceMinutes: 30, earliestArrival: 540 },
        { id: 'b', serviceMinutes: 30, latestArrival: 560 },
      ],
      travelMinutes: line([1, 2]),
      dayStart: 480,
    };
    // a: arrive 490, wait 50 until 540, leave 570; b: arrive 580 > 560 → left out, reason given.
    const plan = scheduleInOrder(input, ['a', 'b']);
    expect(plan.visits).toEqual([{ id: 'a', arrival: 490, waitMinutes: 50, serviceStart: 540, departure: 570 }]);
    expect(plan.unscheduled).toEqual([{ id: 'b', reason: 'in this order it would arrive at 09:40, after the last arrival at 09:20' }]);
    expect(plan.returnAt).toBe(580);
  });

  it('leaves out a stop that would make the day end late, then carries on with the next', () => {
    const input: RouteDayInput = {
      stops: [
        { id: 'far', serviceMinutes: 60 },
        { id: 'near', serviceMinutes: 10 },
      ],
      travelMinutes: line([10, 1]),
      dayStart: 480,
      dayEnd: 600,
    };
    // far: arrive 580, leave 640, home 740 > 600 → out; near: arrive 490, leave 500, home 510.
    const plan = scheduleInOrder(input, ['far', 'near']);
    expect(plan.visits.map((v) => v.id)).toEqual(['near']);
    expect(plan.unscheduled).toEqual([{ id: 'far', reason: 'in this order the day would end at 12:20, after 10:00' }]);
  });

  it('refuses an order that does not list every stop once', () => {
    const input: RouteDayInput = { stops: [{ id: 'a', serviceMinutes: 5 }], travelMinutes: line([1]), dayStart: 0 };
    expect(() => scheduleInOrder(input, [])).toThrow(/each of the 1 stops once/);
    expect(() => scheduleInOrder(input, ['x'])).toThrow(/not a stop/);
  });
});
