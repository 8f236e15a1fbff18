import { DomainError } from '../errors.ts';
import { describe } from '../input-checks.ts';
import { requireCents } from './cents.ts';

/**
 * Divides an amount of cents in proportion to ratios by the largest-remainder (Hamilton) method: each part first gets
 * the whole cents of its exact share, then the cents left over go one each to the parts with the largest fractions,
 * ties to the earlier part. The parts always sum exactly to the whole, and no part is more than a cent from its exact
 * share. Arithmetic is in BigInt, so large amounts and ratios with decimals ("45.5") stay exact.
 */

/** A non-negative decimal ratio as an integer numerator over 10^scale. */
function toScaled(ratio: number, field: string): { numerator: bigint; scale: number } {
  if (typeof ratio !== 'number' || !Number.isFinite(ratio)) {
    throw new DomainError('not-a-number', `${field} must be a finite number (got ${describe(ratio)})`, field);
  }
  if (ratio < 0) throw new DomainError('negative', `${field} must not be negative (got ${ratio})`, field);
  const text = ratio.toString();
  if (/e/i.test(text)) throw new DomainError('out-of-range', `${field} ${text} is too large or too fine for a ratio`, field);
  const [whole = '0', fraction = ''] = text.split('.');
  return { numerator: BigInt(whole + fraction), scale: fraction.length };
}

export function allocateCents(totalCents: number, ratios: readonly number[]): number[] {
  const total = requireCents(totalCents, 'totalCents');
  if (!Array.isArray(ratios) || ratios.length === 0) throw new DomainError('missing-input', 'give at least one ratio', 'ratios');
  const scaled = ratios.map((r, i) => toScaled(r, `ratios[${i}]`));
  const scale = Math.max(...scaled.map((s) => s.scale));
  const weights = scaled.map((s) => s.numerator * 10n ** BigInt(scale - s.scale));
  const sum = weights.reduce((a, b) => a + b, 0n);
  if (sum === 0n) throw new DomainError('out-of-range', 'at least one ratio must be above zero', 'ratios');

  const magnitude = BigInt(Math.abs(total));
  const parts = weights.map((w) => (magnitude * w) / sum);
  const remainders = weights.map((w, i) => ({ i, r: (magnitude * w) % sum }));
  let left = magnitude - parts.reduce((a, b) => a + b, 0n);
  remainders.sort((a, b) => (a.r === b.r ? a.i - b.i : a.r > b.r ? -1 : 1));
  for (const { i } of remainders) {
    if (left === 0n) break;
    parts[i] = (parts[i] as bigint) + 1n;
    left -= 1n;
  }
  const sign = total < 0 ? -1 : 1;
  return parts.map((p) => sign * Number(p) || 0);
}
