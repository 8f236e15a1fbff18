import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { keepCost, labourCents, partLineCents } from './keep-cost.ts';

describe('keep cost, worked examples by hand', () => {
  it('two fuses at 45 ¢ and 45 minutes at $45.00 an hour: 90 ¢ + $33.75 = $34.65', () => {
    // 2 × 45 = 90; 45 × 4500 / 60 = 3375.
    expect(keepCost({ parts: [{ quantity: 2, unitCostCents: 45 }], labourMinutes: 45, hourlyRateCents: 4500 })).toEqual({
      partsCents: 90,
      labourCents: 3375,
      totalCents: 3465,
      lineCents: [90],
    });
  });

  it('rounds each fractional line half up to the cent', () => {
    // 0.5 × 25 = 12.5 → 13 (half up); 0.333 × 100 = 33.3 → 33; 1.125 × 2 = 2.25 → 2.
    expect(partLineCents({ quantity: 0.5, unitCostCents: 25 })).toBe(13);
    expect(partLineCents({ quantity: 0.333, unitCostCents: 100 })).toBe(33);
    expect(partLineCents({ quantity: 1.125, unitCostCents: 2 })).toBe(2);
    const cost = keepCost({
      parts: [
        { quantity: 0.5, unitCostCents: 25 },
        { quantity: 0.333, unitCostCents: 100 },
      ],
      labourMinutes: 0,
      hourlyRateCents: 4500,
    });
    expect(cost.lineCents).toEqual([13, 33]);
    expect(cost.partsCents).toBe(46);
  });

  it('rounds labour half up: 7 minutes at $45.50 an hour = 530.83 ¢ → $5.31; 1 minute at $0.30 = 0.5 ¢ → 1 ¢', () => {
    expect(labourCents(7, 4550)).toBe(531);
    expect(labourCents(1, 30)).toBe(1);
    expect(labourCents(90, 4500)).toBe(6750);
  });

  it('refuses what cannot be a cost, naming the field', () => {
    expect(() => labourCents(-5, 4500)).toThrow(expect.objectContaining({ field: 'labourMinutes' }));
    expect(() => labourCents(1.5, 4500)).toThrow(expect.objectContaining({ field: 'labourMinutes' }));
    expect(() => keepCost({ parts: [{ quantity: 0.0001, unitCostCents: 10 }], labourMinutes: 0, hourlyRateCents: 0 })).toThrow(
      expect.objectContaining({ field: 'parts.0.quantity' }),
    );
    expect(() => partLineCents({ quantity: 1, unitCostCents: 1.5 })).toThrow(expect.objectContaining({ field: 'unitCostCents' }));
  });

  it('the lines add up to the parts total and whole quantities cost exactly quantity × unit (property)', () => {
    let runs = 0;
    fc.assert(
      fc.property(
        fc.array(
          fc.record({
            quantity: fc.integer({ min: 1, max: 100_000 }).map((m) => m / 1000),
            unitCostCents: fc.integer({ min: 0, max: 500_000 }),
          }),
          {
            maxLength: 20,
          },
        ),
        fc.integer({ min: 0, max: 600 }),
        fc.integer({ min: 0, max: 20_000 }),
        (parts, minutes, rate) => {
          const cost = keepCost({ parts, labourMinutes: minutes, hourlyRateCents: rate });
          expect(cost.lineCents.reduce((a, b) => a + b, 0)).toBe(cost.partsCents);
          expect(cost.totalCents).toBe(cost.partsCents + cost.labourCents);
          parts.forEach((p, i) => {
            // Within half a cent of the exact product.
            expect(Math.abs(cost.lineCents[i]! - p.quantity * p.unitCostCents)).toBeLessThanOrEqual(0.5 + 1e-9);
            if (Number.isInteger(p.quantity)) expect(cost.lineCents[i]).toBe(p.quantity * p.unitCostCents);
          });
          runs++;
        },
      ),
    );
    expect(runs).toBeGreaterThan(0);
  });
});
