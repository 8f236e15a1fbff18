import { DomainError } from '../errors.ts';
import { roundToSignificant } from '../decimal.ts';
import { requireNonNegative } from '../input-checks.ts';
import { requireNonNegativeCents } from './cents.ts';

/**
 * Counted cash against what the meters say: the variance in cents and percent, flagged when it passes the operator's
 * threshold (a percentage, an amount, or both — either one passed flags it). There is no standard threshold; it is
 * the operator's setting, so one must be given.
 */

export interface CashVarianceInput {
  expectedCents: number;
  countedCents: number;
  thresholdPercent?: number;
  thresholdCents?: number;
}

export interface CashVariance {
  /** counted − expected: negative is a shortfall. */
  varianceCents: number;
  /** Relative to expected; null when nothing was expected. */
  variancePercent: number | null;
  flagged: boolean;
  reason: string;
}

function money(cents: number): string {
  const sign = cents < 0 ? '−' : '';
  const abs = Math.abs(cents);
  return `${sign}${Math.floor(abs / 100)}.${String(abs % 100).padStart(2, '0')}`;
}

export function cashVariance(input: CashVarianceInput): CashVariance {
  const expected = requireNonNegativeCents(input?.expectedCents, 'expectedCents');
  const counted = requireNonNegativeCents(input.countedCents, 'countedCents');
  if (input.thresholdPercent === undefined && input.thresholdCents === undefined) {
    throw new DomainError('missing-input', 'give a variance threshold in percent, in cents, or both', 'thresholdPercent');
  }
  const percentLimit = input.thresholdPercent === undefined ? null : requireNonNegative(input.thresholdPercent, 'thresholdPercent');
  const centsLimit = input.thresholdCents === undefined ? null : requireNonNegativeCents(input.thresholdCents, 'thresholdCents');

  const varianceCents = counted - expected;
  const variancePercent = expected === 0 ? null : roundToSignificant((varianceCents / expected) * 100, 12);
  const overCents = centsLimit !== null && Math.abs(varianceCents) > centsLimit;
  // With nothing expected, any cash at all is an unbounded percentage over.
  const overPercent = percentLimit !== null && (variancePercent === null ? varianceCents !== 0 : Math.abs(variancePercent) > percentLimit);
  const flagged = overCents || overPercent;

  const direction = varianceCents < 0 ? 'short' : 'over';
  let reason: string;
  if (varianceCents === 0) reason = 'count matches the meters';
  else if (expected === 0) reason = `${money(varianceCents)} counted with no plays on the meter`;
  else reason = `${money(Math.abs(varianceCents))} ${direction} (${Math.abs(variancePercent ?? 0)} %)`;
  if (flagged) reason += ': past the threshold — check the meters, coin mech and cash box';
  return { varianceCents, variancePercent, flagged, reason };
}
