import { DomainError } from '../errors.ts';
import { fromDecimal, nearlyEqual, toSignificantDigits } from '../decimal.ts';
import { describe, requireFinite } from '../input-checks.ts';
import type { Tolerance } from './tolerance.ts';
import { letterForTolerance } from './tolerance-letters.ts';

/**
 * Resistor colour bands per IEC 60062:2016: 3 bands (two digits, multiplier, no tolerance band = ±20 %), 4 bands
 * (two digits, multiplier, tolerance), 5 bands (three digits, multiplier, tolerance) and 6 bands (as 5, plus the
 * temperature coefficient). A single black band is a zero-ohm link. The 2016 edition adds pink for ×0.001.
 */

export type BandColour =
  'pink' | 'silver' | 'gold' | 'black' | 'brown' | 'red' | 'orange' | 'yellow' | 'green' | 'blue' | 'violet' | 'grey' | 'white';

interface ColourMeaning {
  digit?: number;
  multiplierExponent: number;
  tolerancePercent?: number;
  temperatureCoefficientPpmPerK?: number;
}

const COLOURS: Readonly<Record<BandColour, ColourMeaning>> = {
  pink: { multiplierExponent: -3 },
  silver: { multiplierExponent: -2, tolerancePercent: 10 },
  gold: { multiplierExponent: -1, tolerancePercent: 5 },
  black: { digit: 0, multiplierExponent: 0, temperatureCoefficientPpmPerK: 250 },
  brown: { digit: 1, multiplierExponent: 1, tolerancePercent: 1, temperatureCoefficientPpmPerK: 100 },
  red: { digit: 2, multiplierExponent: 2, tolerancePercent: 2, temperatureCoefficientPpmPerK: 50 },
  orange: { digit: 3, multiplierExponent: 3, tolerancePercent: 0.05, temperatureCoefficientPpmPerK: 15 },
  yellow: { digit: 4, multiplierExponent: 4, tolerancePercent: 0.02, temperatureCoefficientPpmPerK: 25 },
  green: { digit: 5, multiplierExponent: 5, tolerancePercent: 0.5, temperatureCoefficientPpmPerK: 20 },
  blue: { digit: 6, multiplierExponent: 6, tolerancePercent: 0.25, temperatureCoefficientPpmPerK: 10 },
  violet: { digit: 7, multiplierExponent: 7, tolerancePercent: 0.1, temperatureCoefficientPpmPerK: 5 },
  grey: { digit: 8, multiplierExponent: 8, tolerancePercent: 0.01, temperatureCoefficientPpmPerK: 1 },
  white: { digit: 9, multiplierExponent: 9 },
};

const ALIASES: Readonly<Record<string, BandColour>> = { gray: 'grey', purple: 'violet' };

/** A missing tolerance band means ±20 % (IEC 60062). */
const NO_BAND_TOLERANCE_PERCENT = 20;

export interface ResistorMarking {
  ohms: number;
  tolerance: Tolerance;
  /** The IEC 60062 tolerance letter for the band's tolerance (J for ±5 %). */
  toleranceLetter: string | null;
  temperatureCoefficientPpmPerK: number | null;
}

function colourAt(bands: readonly string[], index: number): BandColour {
  const raw = bands[index];
  const name = typeof raw === 'string' ? raw.trim().toLowerCase() : '';
  const colour = (ALIASES[name] ?? name) as BandColour;
  if (!(colour in COLOURS)) {
    throw new DomainError('unknown-colour', `band ${index + 1}: ${describe(raw)} is not a resistor band colour`, `bands[${index}]`);
  }
  return colour;
}

function digitAt(bands: readonly string[], index: number): number {
  const colour = colourAt(bands, index);
  const digit = COLOURS[colour].digit;
  if (digit === undefined) {
    throw new DomainError(
      'invalid-bands',
      `band ${index + 1} is ${colour}, which is not a digit colour — is the resistor read from the wrong end?`,
      `bands[${index}]`,
    );
  }
  return digit;
}

function percentTolerance(percent: number): Tolerance {
  return { kind: 'percent', plus: percent, minus: percent };
}

/** Bands, read from the end away from the tolerance band, to the resistor's value and tolerance. */
export function bandsToResistance(bands: readonly string[]): ResistorMarking {
  if (!Array.isArray(bands)) throw new DomainError('missing-input', 'bands must be a list of colours', 'bands');
  const count = bands.length;

  if (count === 1) {
    if (colourAt(bands, 0) !== 'black') {
      throw new DomainError('invalid-bands', 'a single band is only meaningful in black (a zero-ohm link)', 'bands');
    }
    return { ohms: 0, tolerance: { kind: 'absolute', plus: 0, minus: 0 }, toleranceLetter: null, temperatureCoefficientPpmPerK: null };
  }
  if (count < 3 || count > 6) {
    throw new DomainError('invalid-bands', `a resistor has 3, 4, 5 or 6 bands (got ${count})`, 'bands');
  }

  const digitCount = count >= 5 ? 3 : 2;
  let digits = '';
  for (let i = 0; i < digitCount; i++) digits += String(digitAt(bands, i));
  const multiplier = COLOURS[colourAt(bands, digitCount)].multiplierExponent;

  let tolerancePercent = NO_BAND_TOLERANCE_PERCENT;
  if (count >= 4) {
    const colour = colourAt(bands, digitCount + 1);
    const percent = COLOURS[colour].tolerancePercent;
    if (percent === undefined) {
      throw new DomainError(
        'invalid-bands',
        `band ${digitCount + 2} is ${colour}, which is not a tolerance colour`,
        `bands[${digitCount + 1}]`,
      );
    }
    tolerancePercent = percent;
  }

  let temperatureCoefficient: number | null = null;
  if (count === 6) {
    const colour = colourAt(bands, 5);
    const ppm = COLOURS[colour].temperatureCoefficientPpmPerK;
    if (ppm === undefined) {
      throw new DomainError('invalid-bands', `band 6 is ${colour}, which is not a temperature-coefficient colour`, 'bands[5]');
    }
    temperatureCoefficient = ppm;
  }

  const tolerance = percentTolerance(tolerancePercent);
  return {
    ohms: fromDecimal(digits, multiplier),
    tolerance,
    toleranceLetter: letterForTolerance(tolerance),
    temperatureCoefficientPpmPerK: temperatureCoefficient,
  };
}

export interface BandOptions {
  /** 4 bands carry two significant digits, 5 and 6 bands three. */
  bands: 4 | 5 | 6;
  tolerancePercent: number;
  /** Required for 6 bands. */
  temperatureCoefficientPpmPerK?: number;
}

function colourFor(predicate: (meaning: ColourMeaning) => boolean): BandColour | undefined {
  return (Object.keys(COLOURS) as BandColour[]).find((colour) => predicate(COLOURS[colour]));
}

/**
 * A value and tolerance to its bands. ±20 % has no tolerance band, so a "4-band" ±20 % resistor has three.
 * Values the band count cannot express exactly (4.75 kΩ on 4 bands) are refused rather than rounded.
 */
export function resistanceToBands(ohms: number, options: BandOptions): BandColour[] {
  const value = requireFinite(ohms, 'ohms');
  if (value < 0) throw new DomainError('negative', `a resistance cannot be negative (got ${value})`, 'ohms');
  if (![4, 5, 6].includes(options?.bands)) {
    throw new DomainError('out-of-range', `band count must be 4, 5 or 6 (got ${describe(options?.bands)})`, 'bands');
  }
  if (value === 0) return ['black'];

  const significant = options.bands === 4 ? 2 : 3;
  const { digits, exponent } = toSignificantDigits(value, significant);
  if (!nearlyEqual(fromDecimal(digits, exponent), value)) {
    throw new DomainError(
      'not-representable',
      `${value} Ω needs more than ${significant} significant digits for ${options.bands} bands`,
      'ohms',
    );
  }
  const multiplier = colourFor((m) => m.multiplierExponent === exponent);
  if (!multiplier) {
    throw new DomainError('not-representable', `${value} Ω is outside the range colour bands can mark`, 'ohms');
  }

  const colours: BandColour[] = String(digits)
    .split('')
    .map((d) => colourFor((m) => m.digit === Number(d)) as BandColour);
  colours.push(multiplier);

  const percent = requireFinite(options.tolerancePercent, 'tolerancePercent');
  if (percent !== NO_BAND_TOLERANCE_PERCENT || options.bands !== 4) {
    const toleranceColour = colourFor((m) => m.tolerancePercent === percent);
    if (!toleranceColour) {
      throw new DomainError('not-representable', `no band colour means ±${percent} %`, 'tolerancePercent');
    }
    colours.push(toleranceColour);
  }

  if (options.bands === 6) {
    const ppm = requireFinite(options.temperatureCoefficientPpmPerK, 'temperatureCoefficientPpmPerK');
    const tcColour = colourFor((m) => m.temperatureCoefficientPpmPerK === ppm);
    if (!tcColour) {
      throw new DomainError('not-representable', `no band colour means ${ppm} ppm/K`, 'temperatureCoefficientPpmPerK');
    }
    colours.push(tcColour);
  }
  return colours;
}
