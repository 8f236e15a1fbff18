import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { capacitorCodeFor, parseCapacitorCode } from './capacitor-codes.ts';

describe('parseCapacitorCode (EIA RS-198)', () => {
  it('104 = 100 nF, 103 = 10 nF, third digit 9 = ×0.1 (EIA RS-198 three-digit capacitance code, in pF)', () => {
    expect(parseCapacitorCode('104').farads).toBe(100e-9);
    expect(parseCapacitorCode('103').farads).toBe(10e-9);
    expect(parseCapacitorCode('109').farads).toBe(1e-12);
    expect(parseCapacitorCode('479').farads).toBe(4.7e-12);
  });

  it('other codes on the board: 221 = 220 pF, 472 = 4.7 nF, 105 = 1 µF, 8 = ×0.01 (EIA RS-198, from memory)', () => {
    expect(parseCapacitorCode('221').farads).toBe(220e-12);
    expect(parseCapacitorCode('472').farads).toBe(4.7e-9);
    expect(parseCapacitorCode('105').farads).toBe(1e-6);
    expect(parseCapacitorCode('478').farads).toBe(0.47e-12);
  });

  it('one or two digits are picofarads as written; R marks the decimal point (common practice)', () => {
    expect(parseCapacitorCode('47').farads).toBe(47e-12);
    expect(parseCapacitorCode('4R7').farads).toBe(4.7e-12);
  });

  it('reads a trailing tolerance letter per IEC 60062, absolute in pF below 10 pF (from memory)', () => {
    expect(parseCapacitorCode('104K').tolerance).toEqual({ kind: 'percent', plus: 10, minus: 10 });
    expect(parseCapacitorCode('104Z').tolerance).toEqual({ kind: 'percent', plus: 80, minus: 20 });
    expect(parseCapacitorCode('4R7C').tolerance).toEqual({ kind: 'absolute', plus: 0.25e-12, minus: 0.25e-12 });
    expect(parseCapacitorCode('101').tolerance).toBeNull();
  });

  it.each([
    ['107', 'unknown-code'], // 7 is not a multiplier digit
    ['1a4', 'unparseable'],
    ['1044', 'unparseable'],
    ['104X', 'unknown-code'],
    ['', 'unparseable'],
  ])('%j → %s', (code, errorCode) => {
    expect(() => parseCapacitorCode(code)).toThrow(expect.objectContaining({ code: errorCode }));
  });
});

describe('capacitorCodeFor', () => {
  it('100 nF → 104, 1 pF → 109, 4.7 µF → 475', () => {
    expect(capacitorCodeFor(100e-9)).toBe('104');
    expect(capacitorCodeFor(1e-12)).toBe('109');
    expect(capacitorCodeFor(4.7e-6)).toBe('475');
  });

  it('refuses values with three significant digits or outside the code range', () => {
    expect(() => capacitorCodeFor(4.75e-9)).toThrow(expect.objectContaining({ code: 'not-representable' }));
    expect(() => capacitorCodeFor(1)).toThrow(expect.objectContaining({ code: 'not-representable' }));
    expect(() => capacitorCodeFor(0)).toThrow(expect.objectContaining({ code: 'out-of-range' }));
  });

  it('round-trips every two-digit code (property)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 10, max: 99 }), fc.constantFrom('0', '1', '2', '3', '4', '5', '6', '8', '9'), (digits, m) => {
        const code = `${digits}${m}`;
        expect(capacitorCodeFor(parseCapacitorCode(code).farads)).toBe(code);
      }),
    );
  });
});
