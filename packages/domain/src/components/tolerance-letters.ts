import { DomainError } from '../errors.ts';
import { describe } from '../input-checks.ts';
import type { Tolerance } from './tolerance.ts';

/**
 * Tolerance code letters of IEC 60062:2016, as printed after a value ("4K7J", "104K", "2n2Z"). Percentages of nominal;
 * for capacitors under 10 pF, B, C, D and F mean absolute amounts in picofarads (see capacitor-codes.ts).
 */
const LETTERS: ReadonlyArray<[string, number, number]> = [
  // letter, plus %, minus %
  ['L', 0.01, 0.01],
  ['P', 0.02, 0.02],
  ['W', 0.05, 0.05],
  ['B', 0.1, 0.1],
  ['C', 0.25, 0.25],
  ['D', 0.5, 0.5],
  ['F', 1, 1],
  ['G', 2, 2],
  ['H', 3, 3],
  ['J', 5, 5],
  ['K', 10, 10],
  ['M', 20, 20],
  ['N', 30, 30],
  // Asymmetric letters, used on electrolytic and ceramic capacitors.
  ['Q', 30, 10],
  ['T', 50, 10],
  ['S', 50, 20],
  ['Z', 80, 20],
];

export const TOLERANCE_LETTERS: readonly string[] = LETTERS.map(([letter]) => letter);

export function toleranceForLetter(letter: string): Tolerance {
  const key = typeof letter === 'string' ? letter.trim().toUpperCase() : '';
  const row = LETTERS.find(([l]) => l === key);
  if (!row) {
    throw new DomainError(
      'unknown-code',
      `${describe(letter)} is not a tolerance letter (IEC 60062 uses ${TOLERANCE_LETTERS.join(', ')})`,
      'tolerance',
    );
  }
  return { kind: 'percent', plus: row[1], minus: row[2] };
}

/** The letter for a percentage tolerance, or null when the standard has none for it. */
export function letterForTolerance(tolerance: Tolerance): string | null {
  if (tolerance.kind !== 'percent') return null;
  const row = LETTERS.find(([, plus, minus]) => plus === tolerance.plus && minus === tolerance.minus);
  return row ? row[0] : null;
}
