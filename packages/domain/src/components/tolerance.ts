import { DomainError } from '../errors.ts';
import { roundToSignificant } from '../decimal.ts';
import { requireFinite, requireNonNegative } from '../input-checks.ts';

/**
 * A part's tolerance: a percentage of nominal (±5 %, or +80/−20 % for Z-coded capacitors) or an absolute amount
 * (±0.25 pF for small capacitors). Plus and minus are both magnitudes.
 */
export type Tolerance = { kind: 'percent'; plus: number; minus: number } | { kind: 'absolute'; plus: number; minus: number };

type Spread = number | { plus: number; minus: number };

function spread(value: Spread, field: string): { plus: number; minus: number } {
  if (typeof value === 'number') {
    const amount = requireNonNegative(value, field);
    return { plus: amount, minus: amount };
  }
  if (value === null || typeof value !== 'object') {
    throw new DomainError('missing-input', `${field} must be a number or { plus, minus }`, field);
  }
  return { plus: requireNonNegative(value.plus, `${field}.plus`), minus: requireNonNegative(value.minus, `${field}.minus`) };
}

export function percentTolerance(percent: Spread): Tolerance {
  const { plus, minus } = spread(percent, 'tolerance');
  // Below −100 % the window would reach below zero, which no real part tolerance means.
  if (minus > 100) throw new DomainError('out-of-range', `a tolerance of −${minus} % would allow a negative value`, 'tolerance');
  return { kind: 'percent', plus, minus };
}

export function absoluteTolerance(amount: Spread): Tolerance {
  return { kind: 'absolute', ...spread(amount, 'tolerance') };
}

/** Checks a tolerance that arrived as data (from the API) rather than through the constructors. */
export function requireTolerance(tolerance: Tolerance): Tolerance {
  if (tolerance?.kind === 'percent') return percentTolerance(tolerance);
  if (tolerance?.kind === 'absolute') return absoluteTolerance(tolerance);
  throw new DomainError('missing-input', 'tolerance must be a percentage or an absolute amount', 'tolerance');
}

export interface Window {
  min: number;
  max: number;
}

/**
 * The allowed window around a nominal value, edges included. Edges are rounded to 15 significant figures so that
 * "10 % of 4.7k" gives exactly 4230 and 5170, the numbers a technician would type, not 4230.000000000001.
 */
export function toleranceWindow(nominal: number, tolerance: Tolerance): Window {
  const n = requireFinite(nominal, 'nominal');
  const t = requireTolerance(tolerance);
  const below = t.kind === 'percent' ? (Math.abs(n) * t.minus) / 100 : t.minus;
  const above = t.kind === 'percent' ? (Math.abs(n) * t.plus) / 100 : t.plus;
  return { min: roundToSignificant(n - below, 15), max: roundToSignificant(n + above, 15) };
}
