import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { availabilityFromMeans, gameReliability, groupReliability } from './availability.ts';

const H = 3_600_000;
const t0 = Date.UTC(2024, 0, 1);
const at = (hours: number) => t0 + hours * H;

describe('availability (IEC 61703 / IEC 60050-192: A = MUT / (MUT + MDT))', () => {
  it('MTBF 600 h with MTTR 24 h gives A = 0.9615 (IEC 61703:2016 steady-state availability; by hand: 600 / 624)', () => {
    expect(availabilityFromMeans(600, 24)).toBeCloseTo(0.9615, 4);
  });

  it('merges overlaps and clips at both ends (worked by hand)', () => {
    // Period: 240 h. Down: 10–14 h and 12–16 h overlap → 6 h; −5 to 2 h straddles the start → 2 h;
    // from 236 h, still down → 4 h. Down 12 h in 3 spells; up 228 h.
    // A = 228 / 240 = 0.95; MTBF = 228 / 3 = 76 h; MTTR = 12 / 3 = 4 h; 76 / (76 + 4) = 0.95.
    const r = gameReliability({ start: at(0), end: at(240) }, [
      { start: at(10), end: at(14) },
      { start: at(12), end: at(16) },
      { start: at(-5), end: at(2) },
      { start: at(236), end: null },
      { start: at(300), end: at(310) }, // after the period: ignored
      { start: at(300), end: null }, // down since after the period: ignored too
    ]);
    expect(r).toEqual({ periodHours: 240, upHours: 228, downHours: 12, failures: 3, availability: 0.95, mtbfHours: 76, mttrHours: 4 });
    expect(availabilityFromMeans(r.mtbfHours ?? NaN, r.mttrHours ?? NaN)).toBeCloseTo(r.availability, 12);
  });

  it('no downtime: A = 1, and MTBF and MTTR are not defined (null, not Infinity or NaN)', () => {
    expect(gameReliability({ start: at(0), end: at(24) }, [])).toMatchObject({
      availability: 1,
      failures: 0,
      mtbfHours: null,
      mttrHours: null,
    });
  });

  it('agrees with counting minute by minute (property)', () => {
    const minutes = 600;
    const interval = fc
      .tuple(fc.integer({ min: -100, max: minutes + 100 }), fc.integer({ min: 0, max: 200 }), fc.boolean())
      .map(([start, length, open]) => ({ start, end: open ? null : start + length }));
    fc.assert(
      fc.property(fc.array(interval, { maxLength: 12 }), (intervals) => {
        const down = new Array<boolean>(minutes).fill(false);
        for (const { start, end } of intervals) for (let m = Math.max(0, start); m < Math.min(minutes, end ?? minutes); m++) down[m] = true;
        const downMinutes = down.filter(Boolean).length;
        const spells = down.filter((d, m) => d && (m === 0 || !down[m - 1])).length;
        const r = gameReliability(
          { start: 0, end: minutes * 60_000 },
          intervals.map(({ start, end }) => ({ start: start * 60_000, end: end === null ? null : end * 60_000 })),
        );
        expect(r.downHours * 60).toBeCloseTo(downMinutes, 9);
        expect(r.failures).toBe(spells);
        expect(r.availability).toBeCloseTo(1 - downMinutes / minutes, 12);
        expect(r.upHours + r.downHours).toBeCloseTo(10, 12);
      }),
      { numRuns: 500 },
    );
  });

  it('refuses an inverted or empty period and an interval that ends before it starts', () => {
    expect(() => gameReliability({ start: at(10), end: at(0) }, [])).toThrow(
      expect.objectContaining({ code: 'inverted-period', field: 'period' }),
    );
    expect(() => gameReliability({ start: at(0), end: at(0) }, [])).toThrow(expect.objectContaining({ code: 'empty-period' }));
    expect(() => gameReliability({ start: at(0), end: at(10) }, [{ start: at(5), end: at(4) }])).toThrow(
      expect.objectContaining({ code: 'inverted-period', field: 'downtime[0]' }),
    );
    expect(() => gameReliability({ start: NaN, end: at(10) }, [])).toThrow(expect.objectContaining({ code: 'invalid-date' }));
    expect(() => availabilityFromMeans(0, 5)).toThrow(expect.objectContaining({ field: 'mtbfHours' }));
  });
});

describe("groupReliability (venue or model: over all member games' time)", () => {
  it('weighs each game by its time on location (worked by hand)', () => {
    // 100 h period. Game a: whole period, down 10 h in 1 spell. Game b: on location from 50 h, down 5 h in 1 spell.
    // Σ time = 150 h, Σ down = 15 h → A = 135 / 150 = 0.9; MTBF = 135 / 2 = 67.5 h; MTTR = 15 / 2 = 7.5 h.
    // Game c left before the period and does not count.
    const r = groupReliability({ start: at(0), end: at(100) }, [
      { id: 'a', downtime: [{ start: at(20), end: at(30) }] },
      { id: 'b', inService: { start: at(50), end: null }, downtime: [{ start: at(40), end: at(55) }] },
      { id: 'c', inService: { start: at(-50), end: at(-10) }, downtime: [] },
    ]);
    expect(r).toMatchObject({ periodHours: 150, downHours: 15, failures: 2, availability: 0.9, mtbfHours: 67.5, mttrHours: 7.5 });
    expect(r.members.map((m) => m.id)).toEqual(['a', 'b']);
  });

  it('equals the single-game figures for a group of one (property)', () => {
    fc.assert(
      fc.property(fc.array(fc.tuple(fc.integer({ min: 0, max: 1000 }), fc.integer({ min: 0, max: 100 })), { maxLength: 10 }), (spells) => {
        const downtime = spells.map(([s, l]) => ({ start: at(s), end: at(s + l) }));
        const period = { start: at(0), end: at(1000) };
        const { members: _members, ...group } = groupReliability(period, [{ id: 'g', downtime }]);
        expect(group).toEqual(gameReliability(period, downtime));
      }),
    );
  });

  it('refuses duplicate games and a service period that ends before it starts', () => {
    expect(() =>
      groupReliability({ start: at(0), end: at(1) }, [
        { id: 'a', downtime: [] },
        { id: 'a', downtime: [] },
      ]),
    ).toThrow(expect.objectContaining({ code: 'duplicate-id' }));
    expect(() =>
      groupReliability({ start: at(0), end: at(1) }, [{ id: 'a', downtime: [], inService: { start: at(1), end: at(0) } }]),
    ).toThrow(expect.objectContaining({ code: 'inverted-period' }));
  });
});
