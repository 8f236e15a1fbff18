import { DomainError } from '../errors.ts';
import { describe } from '../input-checks.ts';

/**
 * Money is whole minor units of the operator's currency (cents), as safe integers: never floats, so sums are exact
 * and a split always adds back up to the whole.
 */

export function requireCents(value: unknown, field: string): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new DomainError('not-a-number', `${field} must be a whole number of cents (got ${describe(value)})`, field);
  }
  if (!Number.isSafeInteger(value)) {
    throw new DomainError('not-an-integer', `${field} must be a whole number of cents, not ${value}`, field);
  }
  return value;
}

export function requireNonNegativeCents(value: unknown, field: string): number {
  const cents = requireCents(value, field);
  if (cents < 0) throw new DomainError('negative', `${field} must not be negative (got ${cents})`, field);
  return cents;
}

/** A product of cents that must stay a safe integer. */
export function multiplyCents(cents: number, factor: number, field: string): number {
  const product = cents * factor;
  if (!Number.isSafeInteger(product)) throw new DomainError('out-of-range', `${field} is too large to hold exactly`, field);
  return product;
}
