import { describe, expect, it } from 'vitest';
import { insertNewStops, planRouteDayStops, type VenueVisit } from './route-day-stops.ts';

// Venues due east of home along the equator: 0.1° of longitude is 11.1195 km (haversine on R1 = 6371.0088 km,
// 2πR/3600), × 1.3 detour = 14.455 km, at 60 km/h = 14.455 min → 14 whole minutes. Worked by hand.
const home = { lat: 0, lon: 0 };
const at = (tenths: number) => ({ lat: 0, lon: tenths / 10 });
const THURSDAY = '2026-12-03';

function venue(id: string, tenths: number, extra: Partial<VenueVisit> = {}): VenueVisit {
  return { venueId: id, point: at(tenths), openingHours: {}, onSiteMinutes: 30, ...extra };
}

describe('planRouteDayStops', () => {
  it('plans in driving order with times, legs and totals that add up', () => {
    const result = planRouteDayStops({
      day: THURSDAY,
      dayStart: 480,
      dayEnd: 1020,
      startPoint: home,
      speedKmh: 60,
      // Either way round drives the same; near closes at 09:30, so it must come first.
      visits: [venue('far', 2), venue('near', 1, { openingHours: { '4': [{ open: '06:00', close: '09:30' }] } })],
      keptOrder: [],
    });
    expect(result.orderKind).toBe('planner');
    expect(result.visits.map((v) => [v.venueId, v.arrival, v.departure, v.travelMinutesFromPrevious, v.kmFromPrevious])).toEqual([
      ['near', 494, 524, 14, 14.5],
      ['far', 538, 568, 14, 14.5],
    ]);
    // Home from 0.2°: 28.9 km → 29 min (rounded once, from the distance): back at 597.
    expect(result.returnAt).toBe(597);
    expect(result.totals).toEqual({ travelMinutes: 57, km: 57.8, onSiteMinutes: 60 });
  });

  it('a venue closed that day is left out with the reason; for one open later the technician leaves later', () => {
    const result = planRouteDayStops({
      day: THURSDAY,
      dayStart: 480,
      dayEnd: 1020,
      startPoint: home,
      speedKmh: 60,
      visits: [
        venue('closed', 1, { openingHours: { '1': [{ open: '10:00', close: '22:00' }] } }),
        venue('late', 1, { openingHours: { '4': [{ open: '11:00', close: '22:00' }] } }),
      ],
      keptOrder: [],
    });
    expect(result.unscheduled).toEqual([{ venueId: 'closed', reason: 'closed that day' }]);
    // Leaving at 08:00 would mean 166 min at a closed door: leave at 10:46 (646) and arrive as it opens at 11:00.
    expect(result.leaveAt).toBe(646);
    expect(result.visits).toEqual([
      {
        venueId: 'late',
        arrival: 660,
        waitMinutes: 0,
        serviceStart: 660,
        departure: 690,
        travelMinutesFromPrevious: 14,
        kmFromPrevious: 14.5,
      },
    ]);
  });

  it("keeps the dispatcher's order, drops venues gone from the day and fits new ones in where they add least", () => {
    const result = planRouteDayStops({
      day: THURSDAY,
      dayStart: 480,
      dayEnd: 1020,
      startPoint: home,
      speedKmh: 60,
      visits: [venue('a', 1), { ...venue('b', 0), point: { lat: 0.1, lon: 0 } }, venue('c', 3)],
      keptOrder: ['c', 'gone', 'a'],
    });
    expect(result.orderKind).toBe('kept');
    // c then a kept. b, 0.1° north of home, adds least first (in degrees: 0.1 + 0.316 − 0.3 = 0.116, against
    // 0.316 + 0.141 − 0.2 = 0.257 between c and a and 0.141 + 0.1 − 0.1 = 0.141 after a).
    expect(result.visits.map((v) => v.venueId)).toEqual(['b', 'c', 'a']);
  });

  it('without a start point the day starts at the first stop', () => {
    const result = planRouteDayStops({
      day: THURSDAY,
      dayStart: 480,
      dayEnd: 1020,
      startPoint: null,
      speedKmh: 60,
      visits: [venue('a', 1)],
      keptOrder: [],
    });
    expect(result.visits[0]).toMatchObject({ arrival: 480, travelMinutesFromPrevious: 0, kmFromPrevious: 0 });
    expect(result.returnAt).toBe(510);
  });
});

describe('insertNewStops', () => {
  it('puts each new stop where it adds least (1 → 3 with 2 added goes 1, 2, 3 on a line)', () => {
    const line = [0, 1, 3, 2].map((a) => [0, 1, 3, 2].map((b) => Math.abs(a - b)));
    expect(insertNewStops([1, 2], [3], line)).toEqual([1, 3, 2]);
  });
});
