import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { formatQuantity, formatRkm, parseQuantity, parseValueIn } from './values.ts';

describe('parseQuantity: SI prefixes', () => {
  // SI Brochure, 9th edition (BIPM 2019), Table 7: p 10⁻¹², n 10⁻⁹, µ 10⁻⁶, m 10⁻³, k 10³, M 10⁶, G 10⁹, T 10¹².
  it.each([
    ['4.7k', 4.7e3, null],
    ['4.7 kΩ', 4.7e3, 'Ω'],
    ['100nF', 100e-9, 'F'],
    ['100 nF', 100e-9, 'F'],
    ['0.1µF', 0.1e-6, 'F'],
    ['0.1uF', 0.1e-6, 'F'], // "u" for µ: common practice where µ cannot be typed
    ['0.1μF', 0.1e-6, 'F'], // U+03BC GREEK SMALL LETTER MU, which Unicode treats as the micro sign's equivalent
    ['1.5 mH', 1.5e-3, 'H'],
    ['250 mA', 0.25, 'A'],
    ['12 V', 12, 'V'],
    ['2.2 MΩ', 2.2e6, 'Ω'],
    ['1 GΩ', 1e9, 'Ω'],
    ['22pF', 22e-12, 'F'],
    ['5 W', 5, 'W'],
    ['3 kV', 3e3, 'V'],
  ])('%s = %d %s', (text, value, unit) => {
    expect(parseQuantity(text)).toEqual({ value, unit });
  });

  it('accepts ohm written as a word, as R, and as the OHM SIGN code point', () => {
    // Unicode: U+2126 OHM SIGN is canonically equivalent to U+03A9 GREEK CAPITAL LETTER OMEGA.
    expect(parseQuantity('600 Ω')).toEqual({ value: 600, unit: 'Ω' });
    expect(parseQuantity('600 \u2126')).toEqual({ value: 600, unit: 'Ω' });
    expect(parseQuantity('600ohm')).toEqual({ value: 600, unit: 'Ω' });
    expect(parseQuantity('600 ohms')).toEqual({ value: 600, unit: 'Ω' });
    expect(parseQuantity('10 kohm')).toEqual({ value: 10_000, unit: 'Ω' });
    expect(parseQuantity('470R')).toEqual({ value: 470, unit: 'Ω' });
  });
});

describe('parseQuantity: RKM code (IEC 60062:2016, examples from memory)', () => {
  it.each([
    ['R47', 0.47, 'Ω'],
    ['4R7', 4.7, 'Ω'],
    ['47R', 47, 'Ω'],
    ['4K7', 4.7e3, null],
    ['4k7', 4.7e3, null],
    ['47K', 47e3, null],
    ['1M0', 1e6, null],
    ['2M2', 2.2e6, null],
    ['4n7', 4.7e-9, null],
    ['2µ2', 2.2e-6, null],
    ['p47', 0.47e-12, null],
    ['4k7 Ω', 4.7e3, 'Ω'],
  ])('%s = %d', (text, value, unit) => {
    expect(parseQuantity(text)).toEqual({ value, unit });
  });
});

describe('parseQuantity: expected unit', () => {
  it('fills in the expected unit when none is written and refuses a different one', () => {
    expect(parseValueIn('4k7', 'Ω')).toBe(4700);
    expect(() => parseQuantity('100nF', { unit: 'Ω' })).toThrow(expect.objectContaining({ code: 'unit-mismatch' }));
  });
});

describe('parseQuantity: bad input is refused with a reason', () => {
  it.each([
    ['abc Ω', 'unparseable'],
    ['', 'missing-input'],
    ['Ω', 'unparseable'],
    ['10 kg', 'unknown-unit'],
    ['4k7k', 'unknown-unit'],
    ['K47', 'unparseable'],
    ['1,000 µF', 'ambiguous'], // a thousands separator or a decimal comma? (common practice differs by country)
    ['100 MFD', 'ambiguous'], // old US capacitors: MFD = microfarad (common practice)
    ['-5 V', 'negative'],
    ['1e400 Ω', 'out-of-range'],
  ])('%j → %s', (text, code) => {
    expect(() => parseQuantity(text)).toThrow(expect.objectContaining({ code }));
  });

  it('names the input at fault when asked', () => {
    expect(() => parseQuantity('abc Ω', { field: 'nominal' })).toThrow(expect.objectContaining({ code: 'unparseable', field: 'nominal' }));
    expect(() => parseQuantity('100 mF')).not.toThrow(); // SI millifarad, written exactly, is fine
  });

  it('reads a lone decimal comma ("4,7k", common in Europe) as a decimal point', () => {
    expect(parseQuantity('4,7k').value).toBe(4700);
  });

  it('allows a sign when asked (a negative rail)', () => {
    expect(parseQuantity('-5 V', { allowNegative: true })).toEqual({ value: -5, unit: 'V' });
  });
});

describe('formatQuantity', () => {
  it('uses the engineering prefix and a space before the unit (SI Brochure §5.4.3)', () => {
    expect(formatQuantity(4700, 'Ω')).toBe('4.7 kΩ');
    expect(formatQuantity(1e-7, 'F')).toBe('100 nF');
    expect(formatQuantity(0.25, 'A')).toBe('250 mA');
    expect(formatQuantity(2.2e6, 'Ω')).toBe('2.2 MΩ');
    expect(formatQuantity(0, 'V')).toBe('0 V');
    expect(formatQuantity(999.7, 'Ω')).toBe('1 kΩ'); // rounding to 3 figures crosses into the next prefix
  });

  it('round-trips: parsing the text gives the value rounded to the shown figures (JS toPrecision as oracle)', () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-12, max: 1e12, noNaN: true }), fc.integer({ min: 1, max: 6 }), (value, digits) => {
        const text = formatQuantity(value, 'Ω', { significantDigits: digits });
        const parsed = parseQuantity(text).value;
        const expected = Number(value.toPrecision(digits));
        expect(Math.abs(parsed - expected)).toBeLessThanOrEqual(1e-12 * expected);
      }),
    );
  });

  it('refuses NaN and Infinity', () => {
    expect(() => formatQuantity(NaN, 'Ω')).toThrow(expect.objectContaining({ code: 'not-a-number' }));
    expect(() => formatQuantity(Infinity, 'F')).toThrow(expect.objectContaining({ code: 'not-a-number' }));
  });
});

describe('formatRkm (IEC 60062 RKM, examples from memory)', () => {
  it.each([
    [0.47, 'Ω', 'R47'],
    [4.7, 'Ω', '4R7'],
    [100, 'Ω', '100R'],
    [4700, 'Ω', '4K7'],
    [10_000, 'Ω', '10K'],
    [1e6, 'Ω', '1M0'],
    [4.7e-9, 'F', '4n7'],
    [2.2e-6, 'F', '2µ2'],
  ] as const)('%d %s → %s', (value, unit, code) => {
    expect(formatRkm(value, unit)).toBe(code);
  });

  it('parses back to the same value', () => {
    fc.assert(
      fc.property(fc.integer({ min: 10, max: 999 }), fc.integer({ min: -2, max: 9 }), (digits, exponent) => {
        const ohms = Number(`${digits}e${exponent}`);
        expect(parseQuantity(formatRkm(ohms, 'Ω')).value).toBe(ohms);
      }),
    );
  });
});

describe('units must be units', () => {
  it('refuses an unknown expected unit and formatting in one', () => {
    expect(() => parseQuantity('5', { unit: 'Ohm' as never })).toThrow(expect.objectContaining({ code: 'unknown-unit' }));
    expect(() => formatQuantity(5, 'Hz' as never)).toThrow(expect.objectContaining({ code: 'unknown-unit' }));
    expect(() => formatRkm(5, 'H' as never)).toThrow(expect.objectContaining({ code: 'unknown-unit' }));
  });
});
