/**
 * Decimal helpers for values that people write in base ten ("4.7k", "10 % of 4.7k"). Building a number from its
 * decimal digits and a power of ten through the string form gives the double nearest the written value, where
 * 4.7 * 1000 or 4700 * 0.1 would carry binary rounding error into comparisons at tolerance edges.
 */

/** digits × 10^exponent, as the double nearest that exact decimal value. */
export function fromDecimal(digits: string | number, exponent: number): number {
  // A number is taken at its shortest round-trip decimal form (4700 → "4.7e+3"), so 1e-7 scales as "1e-7", not "1e-7e9".
  const text = typeof digits === 'number' ? digits.toExponential() : digits;
  const [mantissa = '', ownExponent = '0'] = text.toLowerCase().split('e');
  return Number(`${mantissa}e${Number(ownExponent) + exponent}`);
}

/** Rounds to `significant` significant figures (decimal), as the nearest double. */
export function roundToSignificant(value: number, significant: number): number {
  if (value === 0) return 0;
  return Number(value.toPrecision(significant));
}

/**
 * Splits a positive value into an integer of exactly `significant` digits and a power of ten, after rounding
 * to that many significant figures: 4700 with 2 → { digits: 47, exponent: 2 }.
 */
export function toSignificantDigits(value: number, significant: number): { digits: number; exponent: number } {
  const [mantissa = '0', exp = '0'] = value.toExponential(significant - 1).split('e');
  return { digits: Number(mantissa.replace('.', '')), exponent: Number(exp) - (significant - 1) };
}

/** True when two values agree to within a relative 1e-9: equal as written decimals, whatever the binary noise. */
export function nearlyEqual(a: number, b: number): boolean {
  return Math.abs(a - b) <= 1e-9 * Math.max(Math.abs(a), Math.abs(b));
}

/** The power of ten of the leading digit, read from the decimal form (Math.log10 can land a hair below an integer). */
export function decimalExponent(value: number): number {
  return Number(Math.abs(value).toExponential().split('e')[1]);
}
