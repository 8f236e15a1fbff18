import { allocate, dinero, toSnapshot, USD } from 'dinero.js';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { allocateCents } from './allocation.ts';

/** dinero.js v2 `allocate`, the reference: integer cents in, integer cents out. */
const dineroAllocate = (amount: number, ratios: number[]) =>
  allocate(dinero({ amount, currency: USD }), ratios).map((d) => toSnapshot(d).amount);

const sum = (xs: number[]) => xs.reduce((a, b) => a + b, 0);

describe('allocateCents (largest remainder)', () => {
  it('hand-worked examples', () => {
    // 100 in thirds: exact 33.33 each; 1 cent left goes to the first of the tied remainders → 34, 33, 33.
    expect(allocateCents(100, [1, 1, 1])).toEqual([34, 33, 33]);
    // 1001 at 40/60: exact 400.4 and 600.6; floors 400 + 600 = 1000; the larger fraction (.6) takes the cent.
    expect(allocateCents(1001, [40, 60])).toEqual([400, 601]);
    // 1000 at 42.5/57.5: exact 425 and 575, nothing left over.
    expect(allocateCents(1000, [42.5, 57.5])).toEqual([425, 575]);
    // 5 among 0/1/1: the zero ratio gets nothing; 2.5 and 2.5 → the earlier takes the odd cent.
    expect(allocateCents(5, [0, 1, 1])).toEqual([0, 3, 2]);
    // Negative amounts (a refund) mirror positive ones.
    expect(allocateCents(-100, [1, 1, 1])).toEqual([-34, -33, -33]);
  });

  it('agrees with dinero.js allocate where the choice of cent is forced (divisible totals, equal ratios)', () => {
    expect(allocateCents(1000, [40, 60])).toEqual(dineroAllocate(1000, [40, 60]));
    expect(allocateCents(12_345, [1, 2, 2])).toEqual(dineroAllocate(12_345, [1, 2, 2]));
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 10_000_000 }), fc.integer({ min: 1, max: 9 }), (amount, parts) => {
        const ratios = new Array<number>(parts).fill(1);
        expect([...allocateCents(amount, ratios)].sort((a, b) => a - b)).toEqual([...dineroAllocate(amount, ratios)].sort((a, b) => a - b));
      }),
    );
  });

  it('sums to the whole like dinero.js, with every part within a cent of dinero.js and of the exact share (property)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: 1_000_000_000 }),
        fc.array(fc.integer({ min: 0, max: 10_000 }), { minLength: 1, maxLength: 6 }).filter((r) => r.some((x) => x > 0)),
        (amount, ratios) => {
          const ours = allocateCents(amount, ratios);
          const reference = dineroAllocate(amount, ratios);
          expect(sum(ours)).toBe(amount);
          expect(sum(reference)).toBe(amount);
          const total = sum(ratios);
          ours.forEach((part, i) => {
            expect(Math.abs(part - (reference[i] ?? NaN))).toBeLessThanOrEqual(1);
            const exact = (amount * (ratios[i] ?? 0)) / total;
            expect(part === Math.floor(exact) || part === Math.ceil(exact)).toBe(true);
          });
        },
      ),
      { numRuns: 500 },
    );
  });

  it('gives the odd cents to the largest fractions (the Hamilton rule) (property)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: 1_000_000 }),
        fc.array(fc.integer({ min: 1, max: 1000 }), { minLength: 2, maxLength: 6 }),
        (amount, ratios) => {
          const parts = allocateCents(amount, ratios);
          const total = sum(ratios);
          const fraction = (i: number) => (amount * (ratios[i] ?? 0)) % total; // exact, in integers
          const rounded = parts.map((p, i) => p > Math.floor((amount * (ratios[i] ?? 0)) / total));
          for (let i = 0; i < parts.length; i++) {
            for (let j = 0; j < parts.length; j++) {
              if (rounded[i] && !rounded[j]) expect(fraction(i)).toBeGreaterThanOrEqual(fraction(j));
            }
          }
        },
      ),
    );
  });

  it('refuses fractional cents, negative ratios and all-zero ratios', () => {
    expect(() => allocateCents(10.5, [1, 1])).toThrow(expect.objectContaining({ code: 'not-an-integer', field: 'totalCents' }));
    expect(() => allocateCents(100, [1, -1])).toThrow(expect.objectContaining({ code: 'negative', field: 'ratios[1]' }));
    expect(() => allocateCents(100, [0, 0])).toThrow(expect.objectContaining({ code: 'out-of-range' }));
    expect(() => allocateCents(100, [])).toThrow(expect.objectContaining({ code: 'missing-input' }));
    expect(() => allocateCents(100, [NaN])).toThrow(expect.objectContaining({ code: 'not-a-number' }));
  });
});
