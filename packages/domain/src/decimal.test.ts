import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { fromDecimal, roundToSignificant, toSignificantDigits } from './decimal.ts';

describe('decimal helpers', () => {
  it('builds the double nearest the written decimal, where multiplication would not', () => {
    // 0.1 × 3 is 0.30000000000000004 in IEEE 754 binary64; the decimal 3e-1 is the double JavaScript reads for "0.3".
    expect(0.1 * 3).not.toBe(0.3);
    expect(fromDecimal(3, -1)).toBe(0.3);
    expect(fromDecimal('4.7', 3)).toBe(4700);
    expect(fromDecimal(1e-7, 9)).toBe(100);
  });

  it('agrees with parsing the literal "<digits>e<exponent>" (ECMAScript StringToNumber)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 999_999 }), fc.integer({ min: -15, max: 15 }), (digits, exponent) => {
        expect(fromDecimal(digits, exponent)).toBe(parseFloat(`${digits}E${exponent}`));
      }),
    );
  });

  it('splits into significant digits and a power of ten', () => {
    expect(toSignificantDigits(4700, 2)).toEqual({ digits: 47, exponent: 2 });
    expect(toSignificantDigits(0.47, 3)).toEqual({ digits: 470, exponent: -3 });
    expect(roundToSignificant(4.7449, 2)).toBe(4.7);
  });
});
