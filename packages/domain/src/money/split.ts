import { fromDecimal } from '../decimal.ts';
import { DomainError } from '../errors.ts';
import { requireInRange } from '../input-checks.ts';
import { allocateCents } from './allocation.ts';
import { requireCents, requireNonNegativeCents } from './cents.ts';

/**
 * The split of a collection between venue and operator by their agreement:
 *   1. fees come off the top first (a music licence, an amusement-machine tax…);
 *   2. the rest (the net) is split by the venue's percentage, to the cent by largest remainder;
 *   3. the operator keeps at least its minimum, if the net reaches it; the venue gets the rest.
 * Fees + venue + operator always equal the gross. If the fees exceed the takings, the venue gets nothing and the
 * operator's share is the (negative) shortfall — stated in the notes.
 */

export interface SplitAgreement {
  /** The venue's share of the net, 0–100, to at most two decimal places (42.5, 8.04). */
  venuePercent: number;
  feesOffTheTop?: ReadonlyArray<{ label: string; cents: number }>;
  /** The operator keeps at least this much of the net. */
  operatorMinimumCents?: number;
}

export interface CollectionSplit {
  grossCents: number;
  fees: Array<{ label: string; cents: number }>;
  feesCents: number;
  netCents: number;
  venueCents: number;
  operatorCents: number;
  minimumApplied: boolean;
  notes: string[];
}

/**
 * The percentage in whole basis points (8.04 → 804), so the operator's share is 10,000 − 804 exactly: 100 − 8.04 in
 * floating point is 91.96000000000001, which tips a tied cent to the operator. Finer than 0.01 % is refused.
 */
function basisPoints(percent: number, field: string): number {
  const points = Math.round(percent * 100);
  if (fromDecimal(points, -2) !== percent) {
    throw new DomainError('out-of-range', `${field} ${percent} has more than two decimal places: give it to 0.01 %`, field);
  }
  return points;
}

export function splitCollection(grossCents: number, agreement: SplitAgreement): CollectionSplit {
  const gross = requireNonNegativeCents(grossCents, 'grossCents');
  if (agreement === null || typeof agreement !== 'object') throw new DomainError('missing-input', 'an agreement is needed', 'agreement');
  const venuePoints = basisPoints(requireInRange(agreement.venuePercent, 0, 100, 'venuePercent'), 'venuePercent');
  const fees = (agreement.feesOffTheTop ?? []).map((fee, i) => ({
    label: typeof fee?.label === 'string' && fee.label !== '' ? fee.label : `fee ${i + 1}`,
    cents: requireNonNegativeCents(fee?.cents, `feesOffTheTop[${i}].cents`),
  }));
  const minimum =
    agreement.operatorMinimumCents === undefined ? 0 : requireNonNegativeCents(agreement.operatorMinimumCents, 'operatorMinimumCents');

  const feesCents = fees.reduce((sum, fee) => sum + fee.cents, 0);
  const net = requireCents(gross - feesCents, 'netCents');
  const notes: string[] = [];
  if (net < 0) {
    notes.push('fees exceed the takings: the venue gets nothing and the operator carries the shortfall');
    return { grossCents: gross, fees, feesCents, netCents: net, venueCents: 0, operatorCents: net, minimumApplied: false, notes };
  }

  let [venue, operator] = allocateCents(net, [venuePoints, 10_000 - venuePoints]) as [number, number];
  let minimumApplied = false;
  if (operator < minimum) {
    operator = Math.min(minimum, net);
    venue = net - operator;
    minimumApplied = true;
    notes.push(
      net < minimum
        ? 'the net is below the operator minimum: the operator keeps all of it'
        : `the operator minimum applies: the venue gets the rest of the net`,
    );
  }
  return { grossCents: gross, fees, feesCents, netCents: net, venueCents: venue, operatorCents: operator, minimumApplied, notes };
}
