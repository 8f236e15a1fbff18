import { requireNonNegativeInteger } from '../input-checks.ts';
import { meterDelta } from '../meters/meter-delta.ts';
import { multiplyCents, requireNonNegativeCents } from './cents.ts';

/**
 * What the cash box should hold: plays counted on the meter since the last collection × the price per play.
 * Meters roll over at their modulus (999,999 → 0 on a six-digit meter).
 */

export interface ExpectedCashInput {
  previousMeter: number;
  currentMeter: number;
  /** Rollover point, e.g. 1,000,000; omit for a meter that never rolls over. */
  meterModulus?: number | null;
  pricePerPlayCents: number;
}

export interface ExpectedCash {
  plays: number;
  expectedCents: number;
  rolledOver: boolean;
}

export function expectedCash(input: ExpectedCashInput): ExpectedCash {
  const previous = requireNonNegativeInteger(input?.previousMeter, 'previousMeter');
  const current = requireNonNegativeInteger(input.currentMeter, 'currentMeter');
  const modulus = input.meterModulus == null ? input.meterModulus : requireNonNegativeInteger(input.meterModulus, 'meterModulus');
  const price = requireNonNegativeCents(input.pricePerPlayCents, 'pricePerPlayCents');
  const { delta, rolledOver } = meterDelta(previous, current, modulus);
  return { plays: delta, expectedCents: multiplyCents(price, delta, 'expectedCents'), rolledOver };
}
