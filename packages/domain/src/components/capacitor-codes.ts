import { DomainError } from '../errors.ts';
import { fromDecimal, nearlyEqual, toSignificantDigits } from '../decimal.ts';
import { describe, requireFinite } from '../input-checks.ts';
import type { Tolerance } from './tolerance.ts';
import { toleranceForLetter } from './tolerance-letters.ts';

/**
 * Capacitor value codes per EIA RS-198: three digits, two significant and a multiplier, in picofarads ("104" =
 * 10 × 10⁴ pF = 100 nF). A third digit of 8 means ×0.01 and 9 means ×0.1 ("109" = 1.0 pF); 7 is unused. One or two
 * digits alone are picofarads as written ("47" = 47 pF), and "4R7" is 4.7 pF. A trailing tolerance letter follows
 * IEC 60062 ("104K" = ±10 %); under 10 pF the letters B, C, D and F are absolute (±0.1, 0.25, 0.5, 1 pF).
 */

export interface CapacitorCode {
  farads: number;
  /** null when the code carried no tolerance letter. */
  tolerance: Tolerance | null;
}

const PICO = -12;

const MULTIPLIER_EXPONENTS: Readonly<Record<string, number>> = {
  '0': 0,
  '1': 1,
  '2': 2,
  '3': 3,
  '4': 4,
  '5': 5,
  '6': 6,
  '8': -2,
  '9': -1,
};

const SMALL_VALUE_ABSOLUTE_PF: Readonly<Record<string, number>> = { B: 0.1, C: 0.25, D: 0.5, F: 1 };

/** A tolerance letter on a capacitor of `farads`: under 10 pF, B, C, D and F are absolute picofarads. */
export function capacitorToleranceForLetter(letter: string, farads: number): Tolerance {
  const absolutePf = SMALL_VALUE_ABSOLUTE_PF[letter];
  if (absolutePf !== undefined && farads < 10e-12) {
    const amount = fromDecimal(absolutePf, PICO);
    return { kind: 'absolute', plus: amount, minus: amount };
  }
  return toleranceForLetter(letter);
}

export function parseCapacitorCode(code: string): CapacitorCode {
  if (typeof code !== 'string') {
    throw new DomainError('unparseable', `a capacitor code must be text such as "104" (got ${describe(code)})`, 'code');
  }
  const text = code.trim().toUpperCase();
  const match = /^(?:(\d{3})|(\d{1,2})|(\d)R(\d))([A-Z])?$/.exec(text);
  if (!match) {
    throw new DomainError(
      'unparseable',
      `"${code}" is not a capacitor code: expected three digits such as 104, optionally a tolerance letter`,
      'code',
    );
  }
  const [, threeDigits, plain, rWhole, rFraction, letter] = match;
  let picofarads: number;
  if (threeDigits) {
    const multiplierDigit = threeDigits[2] ?? '';
    const exponent = MULTIPLIER_EXPONENTS[multiplierDigit];
    if (exponent === undefined) {
      throw new DomainError('unknown-code', `"${code}": the multiplier digit 7 is not used in EIA RS-198`, 'code');
    }
    picofarads = fromDecimal(threeDigits.slice(0, 2), exponent);
  } else if (plain) {
    picofarads = Number(plain);
  } else {
    picofarads = Number(`${rWhole}.${rFraction}`);
  }
  const farads = fromDecimal(picofarads, PICO);
  return { farads, tolerance: letter ? capacitorToleranceForLetter(letter, farads) : null };
}

/** A capacitance to its three-digit code: 100 nF → "104", 1 pF → "109", 4.7 µF → "475". */
export function capacitorCodeFor(farads: number): string {
  const value = requireFinite(farads, 'farads');
  if (value <= 0) throw new DomainError('out-of-range', `a capacitance must be greater than zero (got ${value})`, 'farads');
  const picofarads = fromDecimal(value, -PICO);
  const { digits, exponent } = toSignificantDigits(picofarads, 2);
  if (!nearlyEqual(fromDecimal(digits, exponent), picofarads)) {
    throw new DomainError('not-representable', `${picofarads} pF needs more than two significant digits for a three-digit code`, 'farads');
  }
  const multiplierDigit = Object.keys(MULTIPLIER_EXPONENTS).find((d) => MULTIPLIER_EXPONENTS[d] === exponent);
  if (multiplierDigit === undefined) {
    throw new DomainError('not-representable', `${picofarads} pF is outside the range of three-digit codes`, 'farads');
  }
  return `${digits}${multiplierDigit}`;
}
