import { allocate, dinero, toSnapshot, USD } from 'dinero.js';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { splitCollection } from './split.ts';

describe('splitCollection', () => {
  it('fees off the top, then the percentage, rounded so the parts sum to the gross (worked by hand)', () => {
    // Gross 100.01; fees 5.00 → net 95.01. Venue 40 %: 38.004 → 38.00; operator 60 %: 57.006 → 57.01.
    // 5.00 + 38.00 + 57.01 = 100.01.
    const split = splitCollection(10_001, { venuePercent: 40, feesOffTheTop: [{ label: 'music licence', cents: 500 }] });
    expect(split).toMatchObject({ feesCents: 500, netCents: 9_501, venueCents: 3_800, operatorCents: 5_701, minimumApplied: false });
    // The same net split by dinero.js allocate (reference) — here the answer is the same cent for cent.
    expect(allocate(dinero({ amount: 9_501, currency: USD }), [40, 60]).map((d) => toSnapshot(d).amount)).toEqual([3_800, 5_701]);
  });

  it('a tied cent goes to the venue, the first part, as the allocator rules (worked by hand)', () => {
    // 8.04 % of 12.50: 1250 × 804 / 10000 = 100.5 cents to the venue and 1149.5 to the operator, a tie. The
    // allocator gives ties to the earlier part, so the venue gets 101 and the operator 1149.
    expect(splitCollection(1_250, { venuePercent: 8.04 })).toMatchObject({ venueCents: 101, operatorCents: 1_149 });
    // dinero.js 2.0.2 allocate in the same basis points (reference) agrees on the whole cents, 100 and 1149; it hands
    // odd cents to the largest ratio, not to the largest remainder, so its odd cent goes to the operator instead.
    expect(allocate(dinero({ amount: 1_250, currency: USD }), [804, 9_196]).map((d) => toSnapshot(d).amount)).toEqual([100, 1_150]);
  });

  it('reads the percentage as basis points: more than two decimals is refused, not rounded', () => {
    expect(() => splitCollection(1_000, { venuePercent: 33.333 })).toThrow(
      expect.objectContaining({ code: 'out-of-range', field: 'venuePercent' }),
    );
    expect(splitCollection(1_000, { venuePercent: 33.33 })).toMatchObject({ venueCents: 333, operatorCents: 667 });
  });

  it('the operator keeps its minimum; the venue gets the rest (worked by hand)', () => {
    // Net 80.00 at 50 % would give the operator 40.00; its minimum is 50.00 → operator 50.00, venue 30.00.
    expect(splitCollection(8_000, { venuePercent: 50, operatorMinimumCents: 5_000 })).toMatchObject({
      venueCents: 3_000,
      operatorCents: 5_000,
      minimumApplied: true,
    });
    // Net 30.00 is below the minimum: the operator keeps all of it.
    expect(splitCollection(3_000, { venuePercent: 50, operatorMinimumCents: 5_000 })).toMatchObject({
      venueCents: 0,
      operatorCents: 3_000,
    });
  });

  it('fees larger than the takings: venue nothing, operator carries the shortfall, still summing to the gross', () => {
    const split = splitCollection(300, { venuePercent: 50, feesOffTheTop: [{ label: 'tax', cents: 500 }] });
    expect(split).toMatchObject({ netCents: -200, venueCents: 0, operatorCents: -200 });
    expect(split.notes[0]).toMatch(/shortfall/);
  });

  it('always sums exactly to the gross (property)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: 100_000_000 }),
        fc.double({ min: 0, max: 100, noNaN: true }).map((p) => Math.round(p * 100) / 100),
        fc.array(fc.integer({ min: 0, max: 5_000 }), { maxLength: 3 }),
        fc.integer({ min: 0, max: 100_000 }),
        (gross, venuePercent, fees, minimum) => {
          const s = splitCollection(gross, {
            venuePercent,
            feesOffTheTop: fees.map((cents, i) => ({ label: `fee ${i}`, cents })),
            operatorMinimumCents: minimum,
          });
          expect(s.feesCents + s.venueCents + s.operatorCents).toBe(gross);
          expect(Number.isInteger(s.venueCents) && Number.isInteger(s.operatorCents)).toBe(true);
          if (s.netCents >= 0) {
            expect(s.venueCents).toBeGreaterThanOrEqual(0);
            expect(s.operatorCents).toBeGreaterThanOrEqual(Math.min(minimum, s.netCents));
          }
        },
      ),
      { numRuns: 500 },
    );
  });

  it('refuses fractional cents, percentages out of range and negative fees', () => {
    expect(() => splitCollection(100.5, { venuePercent: 50 })).toThrow(
      expect.objectContaining({ code: 'not-an-integer', field: 'grossCents' }),
    );
    expect(() => splitCollection(100, { venuePercent: 120 })).toThrow(
      expect.objectContaining({ code: 'out-of-range', field: 'venuePercent' }),
    );
    expect(() => splitCollection(100, { venuePercent: 50, feesOffTheTop: [{ label: 'x', cents: -1 }] })).toThrow(
      expect.objectContaining({ code: 'negative', field: 'feesOffTheTop[0].cents' }),
    );
    expect(() => splitCollection(100, { venuePercent: 50, operatorMinimumCents: 0.5 })).toThrow(
      expect.objectContaining({ code: 'not-an-integer' }),
    );
  });
});
