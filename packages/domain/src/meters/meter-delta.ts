import { DomainError } from '../errors.ts';
import { requireNonNegative, requirePositive } from '../input-checks.ts';

/**
 * The count between two readings of a game's meter (plays, coins, power-on hours). Mechanical and electronic meters
 * roll over to zero at a fixed modulus (a six-digit meter at 1,000,000); a later reading lower than the earlier one
 * is then a rollover. More than one rollover between readings cannot be seen, so read meters more often than that.
 * Without a modulus, a lower reading means the meter was reset or replaced: refused, so a person records that.
 */

export interface MeterDelta {
  delta: number;
  rolledOver: boolean;
}

export function meterDelta(previous: number, current: number, modulus?: number | null): MeterDelta {
  const before = requireNonNegative(previous, 'previousReading');
  const after = requireNonNegative(current, 'currentReading');
  if (modulus === undefined || modulus === null) {
    if (after < before) {
      throw new DomainError(
        'conflicting-input',
        `the meter went backwards (${before} → ${after}) and has no rollover modulus: was it reset or replaced?`,
        'currentReading',
      );
    }
    return { delta: after - before, rolledOver: false };
  }
  const m = requirePositive(modulus, 'meterModulus');
  for (const [value, field] of [
    [before, 'previousReading'],
    [after, 'currentReading'],
  ] as const) {
    if (value >= m) throw new DomainError('out-of-range', `${field} ${value} cannot be shown on a meter that rolls over at ${m}`, field);
  }
  if (after >= before) return { delta: after - before, rolledOver: false };
  return { delta: m - before + after, rolledOver: true };
}
