import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { checkStockQuantity, isLow, lineCostCents, orderQuantity } from './quantity-rules.ts';

describe('checkStockQuantity', () => {
  it('takes whole numbers of a part counted each, and refuses a fraction or a negative naming quantity', () => {
    expect(() => checkStockQuantity('each', 3)).not.toThrow();
    expect(() => checkStockQuantity('each', 1.5)).toThrow(
      expect.objectContaining({ field: 'quantity', message: 'whole numbers only: this part is counted each' }),
    );
    expect(() => checkStockQuantity('each', -2)).toThrow(
      expect.objectContaining({ field: 'quantity', message: 'whole numbers only: this part is counted each' }),
    );
  });

  it('takes up to three decimals of metres, grams and millilitres', () => {
    expect(() => checkStockQuantity('m', 1.25)).not.toThrow();
    expect(() => checkStockQuantity('g', 0.125)).not.toThrow();
    expect(() => checkStockQuantity('ml', 0.0005)).toThrow(expect.objectContaining({ message: 'must have at most three decimals' }));
    expect(() => checkStockQuantity('m', -0.5)).toThrow(expect.objectContaining({ code: 'negative' }));
  });

  it('refuses moving nothing, but a count may be zero', () => {
    expect(() => checkStockQuantity('each', 0)).toThrow(expect.objectContaining({ message: 'must be more than 0' }));
    expect(() => checkStockQuantity('each', 0, 'countedQuantity', true)).not.toThrow();
    expect(() => checkStockQuantity('each', Number.NaN)).toThrow(expect.objectContaining({ code: 'not-a-number' }));
  });

  it('accepts every whole number for each and refuses every non-integer (property)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 1_000_000 }), fc.integer({ min: 1, max: 999 }), (whole, frac) => {
        expect(() => checkStockQuantity('each', whole)).not.toThrow();
        expect(() => checkStockQuantity('each', whole + frac / 1000)).toThrow();
        expect(() => checkStockQuantity('m', whole + frac / 1000)).not.toThrow();
      }),
    );
  });
});

describe('reorder', () => {
  it('is low at or below the reorder point, never without one', () => {
    expect(isLow(3, 3)).toBe(true);
    expect(isLow(4, 3)).toBe(false);
    expect(isLow(0, null)).toBe(false);
  });

  it('orders the reorder quantity, or enough to come back above the point', () => {
    expect(orderQuantity('each', 2, 5, 20)).toBe(20);
    // 5 − 2 + 1 = 4: four fuses bring the shelf to 6, one above the point.
    expect(orderQuantity('each', 2, 5, null)).toBe(4);
    expect(orderQuantity('m', 1.5, 4, null)).toBe(2.5);
  });
});

describe('lineCostCents', () => {
  it('rounds half a cent up (worked by hand: 0.1 m × 45 ¢ = 4.5 ¢ → 5 ¢; 3 × 12 ¢ = 36 ¢; 2.333 g × 3 ¢ = 6.999 ¢ → 7 ¢)', () => {
    expect(lineCostCents(0.1, 45)).toBe(5);
    expect(lineCostCents(3, 12)).toBe(36);
    expect(lineCostCents(2.333, 3)).toBe(7);
    expect(lineCostCents(0.001, 1)).toBe(0);
  });

  it('is exact for whole quantities (property)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 1_000_000 }), fc.integer({ min: 0, max: 100_000 }), (q, c) => {
        expect(lineCostCents(q, c)).toBe(q * c);
      }),
    );
  });
});
