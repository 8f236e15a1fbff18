import { DomainError } from '../errors.ts';
import { decimalExponent, fromDecimal, roundToSignificant } from '../decimal.ts';
import { describe, requireFinite, requireInRange } from '../input-checks.ts';

/**
 * Component values as people write them: SI prefixes and units ("4.7 kΩ", "100nF", "250 mA", "600 ohm"), and the
 * RKM code of IEC 60062 where the multiplier letter stands in for the decimal point ("4K7", "R47", "4n7", "2M2").
 */

export type Unit = 'Ω' | 'F' | 'H' | 'V' | 'A' | 'W';

export const UNITS: readonly Unit[] = ['Ω', 'F', 'H', 'V', 'A', 'W'];

function requireUnit(unit: unknown, field = 'unit'): Unit {
  if (!UNITS.includes(unit as Unit)) {
    throw new DomainError('unknown-unit', `${describe(unit)} is not one of the units ${UNITS.join(', ')}`, field);
  }
  return unit as Unit;
}

export interface Quantity {
  /** In the base unit (ohms, farads, henries, volts, amperes, watts). */
  value: number;
  /** null when the text gave no unit (e.g. "4.7k"). */
  unit: Unit | null;
}

export interface ParseOptions {
  /** The unit the caller expects: a different unit is an error; no unit in the text means this one. */
  unit?: Unit;
  /** Component values are magnitudes; allow a sign only where it means something (a rail voltage). */
  allowNegative?: boolean;
  /** The input's name, reported in errors (default "value"). */
  field?: string;
}

const PREFIX_EXPONENTS: Readonly<Record<string, number>> = {
  p: -12,
  n: -9,
  µ: -6,
  m: -3,
  k: 3,
  K: 3, // "10K" and "4K7": IEC 60062's RKM letter for kilo, and everyday shorthand
  M: 6,
  G: 9,
  T: 12,
};

const RKM_LETTER_EXPONENTS: Readonly<Record<string, number>> = { ...PREFIX_EXPONENTS, R: 0 };

// Word and symbol spellings of each unit, compared lower-cased.
const UNIT_ALIASES: ReadonlyArray<[string, Unit]> = [
  ['ω', 'Ω'],
  ['ohm', 'Ω'],
  ['ohms', 'Ω'],
  ['r', 'Ω'],
  ['f', 'F'],
  ['farad', 'F'],
  ['farads', 'F'],
  ['h', 'H'],
  ['henry', 'H'],
  ['henries', 'H'],
  ['henrys', 'H'],
  ['v', 'V'],
  ['volt', 'V'],
  ['volts', 'V'],
  ['a', 'A'],
  ['amp', 'A'],
  ['amps', 'A'],
  ['ampere', 'A'],
  ['amperes', 'A'],
  ['w', 'W'],
  ['watt', 'W'],
  ['watts', 'W'],
];

const UNIT_BY_ALIAS = new Map(UNIT_ALIASES);

function normalise(text: string): string {
  return text
    .normalize('NFC')
    .replace(/\u2126/g, 'Ω') // OHM SIGN → GREEK CAPITAL OMEGA
    .replace(/[\u03bc]/g, 'µ') // GREEK SMALL MU → MICRO SIGN
    .replace(/[\u2212\u2013]/g, '-') // minus sign, en dash
    .replace(/[\u00a0\u2009\u202f]/g, ' ') // no-break and thin spaces
    .trim();
}

function unitFromAlias(text: string): Unit | undefined {
  if (text === '') return undefined;
  return UNIT_BY_ALIAS.get(text.toLowerCase());
}

/** Reads "k", "kΩ", "kohm", "uF", "mA", "" into a power of ten and a unit. */
function readPrefixAndUnit(rest: string, original: string, field: string): { exponent: number; unit: Unit | null } {
  const compact = rest.replace(/\s+/g, '');
  if (compact === '') return { exponent: 0, unit: null };
  // Old capacitors marked "MF" or "MFD" meant microfarads, modern SI "MF" would be megafarads: refuse to guess.
  if (/^mfd?$/i.test(compact) && compact !== 'mF') {
    throw new DomainError(
      'ambiguous',
      `"${original}": "${compact}" meant microfarads on old capacitors but reads as milli- or megafarads today; write µF or mF`,
      field,
    );
  }
  const whole = unitFromAlias(compact);
  // "m" alone is milli with no unit, but "R", "F", "H", "V", "A", "W" alone are units.
  if (whole && !(compact in PREFIX_EXPONENTS)) return { exponent: 0, unit: whole };
  const first = compact[0] === 'u' ? 'µ' : (compact[0] ?? '');
  const exponent = PREFIX_EXPONENTS[first];
  if (exponent === undefined) {
    throw new DomainError('unknown-unit', `"${original}": unknown unit or prefix "${compact}"`, field);
  }
  const unitText = compact.slice(1);
  if (unitText === '') return { exponent, unit: null };
  const unit = unitFromAlias(unitText);
  if (!unit) throw new DomainError('unknown-unit', `"${original}": unknown unit "${unitText}"`, field);
  return { exponent, unit };
}

/** Parses a component value. Throws DomainError for anything it cannot read exactly. */
export function parseQuantity(text: string, options: ParseOptions = {}): Quantity {
  const field = options.field ?? 'value';
  if (typeof text !== 'string') {
    throw new DomainError('unparseable', `a value must be text such as "4.7k" (got ${describe(text)})`, field);
  }
  const original = text;
  let s = normalise(text);
  if (s === '') throw new DomainError('missing-input', 'the value is empty', field);

  let sign = 1;
  if (s[0] === '+' || s[0] === '-') {
    sign = s[0] === '-' ? -1 : 1;
    s = s.slice(1).trimStart();
  }

  // A comma followed by exactly three digits could be a thousands separator ("1,000 µF") or a decimal comma.
  if (/,\d{3}(?!\d)/.test(s)) {
    throw new DomainError('ambiguous', `"${original}": is the comma a decimal point or a thousands separator? Write it without`, field);
  }
  s = s.replace(',', '.');

  let magnitude: number;
  let unit: Unit | null;

  const rkm = /^(\d*)([RKkMGTpnµum])(\d+)\s*(.*)$/.exec(s);
  const plain = /^(\d+(?:\.\d*)?|\.\d+)(?:[eE]([+-]?\d+))?(?![\d.])\s*(.*)$/.exec(s);

  // Only R and the small-value letters may lead an RKM code ("R47", "p47"): "K47" is not a value.
  if (rkm && (rkm[1] !== '' || ['R', 'p', 'n', 'µ', 'u'].includes(rkm[2] ?? ''))) {
    // RKM: "4K7" = 4.7 k, "R47" = 0.47 (Ω), "4n7" = 4.7 n. The letter is the decimal point.
    const [, whole = '', letterRaw = '', fraction = '', rest = ''] = rkm;
    const letter = letterRaw === 'u' ? 'µ' : letterRaw;
    const exponent = RKM_LETTER_EXPONENTS[letter] ?? 0;
    const digits = `${whole === '' ? '0' : whole}.${fraction}`;
    magnitude = fromDecimal(digits, exponent);
    const stated = rest.trim() === '' ? null : unitFromAlias(rest.replace(/\s+/g, ''));
    if (stated === undefined) throw new DomainError('unknown-unit', `"${original}": unknown unit "${rest.trim()}"`, field);
    if (letter === 'R' && stated !== null && stated !== 'Ω') {
      throw new DomainError('unit-mismatch', `"${original}": R marks ohms but the unit says ${stated}`, field);
    }
    unit = letter === 'R' ? 'Ω' : stated;
  } else if (plain) {
    const [, digits = '', exp = '0', rest = ''] = plain;
    const read = readPrefixAndUnit(rest, original, field);
    magnitude = fromDecimal(digits, Number(exp) + read.exponent);
    unit = read.unit;
  } else {
    throw new DomainError(
      'unparseable',
      `"${original}" is not a value: expected a number with an optional prefix and unit, such as 4.7k, 4K7, R47 or 100 nF`,
      field,
    );
  }

  if (!Number.isFinite(magnitude)) {
    throw new DomainError('out-of-range', `"${original}" is too large to be a component value`, field);
  }
  if (sign < 0 && !options.allowNegative && magnitude !== 0) {
    throw new DomainError('negative', `"${original}": a component value cannot be negative`, field);
  }

  if (options.unit !== undefined) {
    requireUnit(options.unit);
    if (unit !== null && unit !== options.unit) {
      throw new DomainError('unit-mismatch', `"${original}" is in ${unit} but ${options.unit} was expected`, field);
    }
    unit = options.unit;
  }
  return { value: sign * magnitude || 0, unit };
}

/** Parses and insists on a unit: "600" means 600 Ω when the caller asks for ohms. */
export function parseValueIn(text: string, unit: Unit): number {
  return parseQuantity(text, { unit }).value;
}

const FORMAT_PREFIXES: ReadonlyArray<[number, string]> = [
  [-12, 'p'],
  [-9, 'n'],
  [-6, 'µ'],
  [-3, 'm'],
  [0, ''],
  [3, 'k'],
  [6, 'M'],
  [9, 'G'],
  [12, 'T'],
];

/** Rounds first, then picks the engineering prefix that puts the mantissa in [1, 1000): 999.7 → 1.00 k. */
function engineering(value: number, significantDigits: number): { mantissa: number; exponent: number } {
  const rounded = roundToSignificant(value, significantDigits);
  const exponent = Math.max(-12, Math.min(12, Math.floor(decimalExponent(rounded) / 3) * 3));
  return { mantissa: fromDecimal(rounded, -exponent), exponent };
}

/** "4.7 kΩ", "100 nF", "250 mA": SI style, a space before the unit (SI Brochure §5.4.3). */
export function formatQuantity(value: number, unit: Unit | null, options: { significantDigits?: number } = {}): string {
  requireFinite(value, 'value');
  if (unit !== null) requireUnit(unit);
  const significant = requireInRange(options.significantDigits ?? 3, 1, 15, 'significantDigits');
  if (value === 0) return unit ? `0 ${unit}` : '0';
  const { mantissa, exponent } = engineering(value, significant);
  const prefix = FORMAT_PREFIXES.find(([e]) => e === exponent)?.[1] ?? '';
  const number = String(mantissa);
  if (unit === null) return `${number}${prefix}`;
  return `${number} ${prefix}${unit}`;
}

const RKM_RESISTANCE_LETTERS: Readonly<Record<number, string>> = { 0: 'R', 3: 'K', 6: 'M', 9: 'G', 12: 'T' };
const RKM_SMALL_LETTERS: Readonly<Record<number, string>> = { [-12]: 'p', [-9]: 'n', [-6]: 'µ', [-3]: 'm', 0: 'F' };

/**
 * RKM code per IEC 60062: resistance letters R, K, M, G, T ("4K7", "R47", "1M0"); capacitance letters p, n, µ, m
 * ("4n7", "2µ2"). A single-digit whole mantissa gets a trailing 0 ("1K0") so the letter never ends the code.
 */
export function formatRkm(value: number, unit: 'Ω' | 'F', options: { significantDigits?: number } = {}): string {
  const magnitude = requireFinite(value, 'value');
  if (unit !== 'Ω' && unit !== 'F') throw new DomainError('unknown-unit', `RKM codes are for Ω and F (got ${describe(unit)})`, 'unit');
  if (magnitude < 0) throw new DomainError('negative', `an RKM code cannot show a negative value (got ${value})`, 'value');
  const significant = requireInRange(options.significantDigits ?? 3, 1, 6, 'significantDigits');
  const letters = unit === 'Ω' ? RKM_RESISTANCE_LETTERS : RKM_SMALL_LETTERS;
  const exponents = Object.keys(letters)
    .map(Number)
    .sort((a, b) => a - b);
  if (magnitude === 0) return unit === 'Ω' ? '0R' : '0F';
  const lowest = exponents[0] ?? 0;
  const highest = exponents[exponents.length - 1] ?? 0;
  const rounded = roundToSignificant(magnitude, significant);
  const exponent = Math.max(lowest, Math.min(highest, Math.floor(decimalExponent(rounded) / 3) * 3));
  const mantissa = fromDecimal(rounded, -exponent);
  if (mantissa >= 1000 || mantissa < 0.001) {
    throw new DomainError('not-representable', `${value} ${unit} is outside the range an RKM code can show`, 'value');
  }
  const letter = letters[exponent] ?? '';
  const [whole = '0', fraction = ''] = String(mantissa).split('.');
  if (fraction !== '') return `${whole === '0' ? '' : whole}${letter}${fraction}`;
  return whole.length === 1 ? `${whole}${letter}0` : `${whole}${letter}`;
}
