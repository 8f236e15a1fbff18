import { DomainError } from '../errors.ts';
import { decimalExponent, fromDecimal } from '../decimal.ts';
import { describe, requirePositive } from '../input-checks.ts';

/**
 * Preferred number series of IEC 60063. E6, E12 and E24 are tabulated from the standard because they are not the
 * rounded geometric series: E24 keeps the historical 2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7 and 8.2 (the formula would give
 * 2.6, 2.9, 3.2, 3.5, 3.8, 4.2, 4.6 and 8.3). E48 and E96 are round(10^(i/n), 2), which matches the standard's table.
 */

export type ESeries = 'E6' | 'E12' | 'E24' | 'E48' | 'E96';

const E6 = [1.0, 1.5, 2.2, 3.3, 4.7, 6.8];
const E12 = [1.0, 1.2, 1.5, 1.8, 2.2, 2.7, 3.3, 3.9, 4.7, 5.6, 6.8, 8.2];
const E24 = [1.0, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2.0, 2.2, 2.4, 2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 5.1, 5.6, 6.2, 6.8, 7.5, 8.2, 9.1];

function geometricSeries(steps: number): number[] {
  return Array.from({ length: steps }, (_, i) => Math.round(10 ** (i / steps) * 100) / 100);
}

const SERIES: Readonly<Record<ESeries, readonly number[]>> = {
  E6,
  E12,
  E24,
  E48: geometricSeries(48),
  E96: geometricSeries(96),
};

export const E_SERIES: readonly ESeries[] = ['E6', 'E12', 'E24', 'E48', 'E96'];

function requireSeries(series: ESeries): readonly number[] {
  const values = SERIES[series];
  if (!values) throw new DomainError('unknown-code', `${describe(series)} is not one of ${E_SERIES.join(', ')}`, 'series');
  return values;
}

/** The values of one decade, 1.0 up to (not including) 10. */
export function seriesValues(series: ESeries): readonly number[] {
  return [...requireSeries(series)];
}

export type Rounding = 'nearest' | 'up' | 'down';

/**
 * The preferred value nearest to `value`. "Nearest" is measured as a ratio, because the series are geometric: in E12,
 * 2.44 is nearer 2.7 by ratio (2.7/2.44 < 2.44/2.2) though nearer 2.2 by difference. "up" gives the smallest
 * preferred value at or above `value`, "down" the largest at or below.
 *
 * A tie is a value at the geometric mean of two neighbours, √(1.5 × 2.2) in E6: as far from each by ratio. IEC 60063
 * lists the values but sets no rule for ties; ours gives the lower neighbour, and counts ratios within 1e-12 as
 * equal so that the answer does not hang on the last bit of a logarithm.
 */
export function nearestPreferredValue(value: number, series: ESeries, rounding: Rounding = 'nearest'): number {
  const target = requirePositive(value, 'value');
  const decade = requireSeries(series);
  if (!['nearest', 'up', 'down'].includes(rounding)) {
    throw new DomainError('unknown-code', `rounding must be nearest, up or down (got ${describe(rounding)})`, 'rounding');
  }
  const exponent = decimalExponent(target);
  // Candidates from the decade below to the decade above cover values that sit at a decade's edge after rounding.
  const candidates: number[] = [];
  for (const e of [exponent - 1, exponent, exponent + 1]) {
    for (const mantissa of decade) candidates.push(fromDecimal(mantissa, e));
  }
  if (rounding === 'up') return candidates.find((c) => c >= target) ?? fromDecimal(1, exponent + 2);
  if (rounding === 'down') return [...candidates].reverse().find((c) => c <= target) ?? fromDecimal(decade.at(-1) ?? 1, exponent - 2);

  let best = candidates[0] ?? target;
  let bestDistance = Infinity;
  for (const candidate of candidates) {
    const distance = Math.abs(Math.log(candidate / target));
    // Candidates rise, so only a clearly nearer one displaces the lower candidate of a tie.
    if (distance < bestDistance - 1e-12) {
      best = candidate;
      bestDistance = distance;
    }
  }
  return best;
}

/** True when `value` is exactly a member of the series (in any decade). */
export function isPreferredValue(value: number, series: ESeries): boolean {
  const target = requirePositive(value, 'value');
  return nearestPreferredValue(target, series) === target;
}
