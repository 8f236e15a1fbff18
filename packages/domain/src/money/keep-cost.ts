import { DomainError } from '../errors.ts';
import { describe } from '../input-checks.ts';
import { requireNonNegativeCents } from './cents.ts';

/**
 * Keep cost of one job on a game: the parts at what they cost us plus the time on it at the company's hourly labour
 * rate. Quantities may be fractional (0.5 m of wire, 0.25 of a tube of flux) to the thousandth, as the stock tables
 * hold them. Each part line is rounded to the cent on its own, half up (0.5 ¢ → 1 ¢: the usual commercial rounding
 * of a non-negative amount), so the lines a person sees on the job add up to its parts total exactly; labour is
 * rounded the same way once. All sums are integer cents (common practice; worked examples in the tests, by hand).
 */

export interface KeepCostPart {
  /** How many were fitted, to the thousandth (1, 2.5, 0.125). */
  quantity: number;
  /** What one costs, in cents. */
  unitCostCents: number;
}

export interface KeepCost {
  partsCents: number;
  labourCents: number;
  totalCents: number;
  /** Each part line's cost, in the order given. */
  lineCents: number[];
}

/** n / d rounded half up, for non-negative integers (exact: no floating-point division). */
function divideHalfUp(n: bigint, d: bigint): bigint {
  return (2n * n + d) / (2n * d);
}

function thousandths(quantity: number, field: string): bigint {
  if (typeof quantity !== 'number' || !Number.isFinite(quantity) || quantity < 0) {
    throw new DomainError('out-of-range', `${field} must be a number of at least 0 (got ${describe(quantity)})`, field);
  }
  const milli = Math.round(quantity * 1000);
  if (Math.abs(milli - quantity * 1000) > 1e-6 * Math.max(1, quantity * 1000)) {
    throw new DomainError('out-of-range', `${field} is given to more than three decimal places (${quantity})`, field);
  }
  return BigInt(milli);
}

/** One part line: quantity × unit cost, rounded half up to the cent. */
export function partLineCents(part: KeepCostPart, field = 'quantity'): number {
  const unit = BigInt(requireNonNegativeCents(part.unitCostCents, 'unitCostCents'));
  return Number(divideHalfUp(thousandths(part.quantity, field) * unit, 1000n));
}

/** Labour: minutes × hourly rate / 60, rounded half up to the cent. */
export function labourCents(minutes: number, hourlyRateCents: number): number {
  if (!Number.isSafeInteger(minutes) || minutes < 0) {
    throw new DomainError('out-of-range', `labourMinutes must be a whole number of at least 0 (got ${describe(minutes)})`, 'labourMinutes');
  }
  const rate = BigInt(requireNonNegativeCents(hourlyRateCents, 'labourRateCents'));
  return Number(divideHalfUp(BigInt(minutes) * rate, 60n));
}

export function keepCost(p: { parts: readonly KeepCostPart[]; labourMinutes: number; hourlyRateCents: number }): KeepCost {
  const lineCents = p.parts.map((part, i) => partLineCents(part, `parts.${i}.quantity`));
  const partsCents = lineCents.reduce((a, b) => a + b, 0);
  const labour = labourCents(p.labourMinutes, p.hourlyRateCents);
  const totalCents = partsCents + labour;
  if (!Number.isSafeInteger(totalCents)) throw new DomainError('out-of-range', 'the keep cost is too large to hold exactly', 'parts');
  return { partsCents, labourCents: labour, totalCents, lineCents };
}
