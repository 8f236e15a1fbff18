import { DomainError } from '../errors.ts';
import { roundToSignificant } from '../decimal.ts';
import { requireFinite, requireInRange, requireNonNegative, requirePositive } from '../input-checks.ts';

/**
 * Resistor dissipation from any two of voltage, current and resistance (Ohm's law: P = VI = I²R = V²/R), checked
 * against the part's rating after derating. Running a resistor at half its rating is common practice; NASA
 * EEE-INST-002 (resistors) derates to 50–70 % of rated power. Standard wattages are the usual through-hole
 * ratings (common practice).
 */

export interface ElectricalInput {
  volts?: number;
  amps?: number;
  ohms?: number;
}

export const STANDARD_WATTAGES: readonly number[] = [0.125, 0.25, 0.5, 1, 2, 3, 5, 10];

export const DEFAULT_DERATING = 0.5;

export function dissipationWatts(input: ElectricalInput): number {
  const given = (['volts', 'amps', 'ohms'] as const).filter((key) => input?.[key] !== undefined && input[key] !== null);
  if (given.length !== 2) {
    throw new DomainError(
      given.length < 2 ? 'missing-input' : 'conflicting-input',
      `give exactly two of volts, amps and ohms (got ${given.length === 0 ? 'none' : given.join(', ')})`,
    );
  }
  const { volts, amps, ohms } = input;
  if (volts !== undefined && amps !== undefined) {
    return Math.abs(requireFinite(volts, 'volts') * requireFinite(amps, 'amps'));
  }
  if (amps !== undefined && ohms !== undefined) {
    const current = requireFinite(amps, 'amps');
    return current * current * requireNonNegative(ohms, 'ohms');
  }
  const voltage = requireFinite(volts, 'volts');
  return (voltage * voltage) / requirePositive(ohms, 'ohms');
}

export interface PowerCheckInput extends ElectricalInput {
  ratedWatts: number;
  /** Fraction of the rating the part may run at, 0 < f ≤ 1. Default 0.5. */
  derating?: number;
}

export interface PowerCheck {
  watts: number;
  ratedWatts: number;
  derating: number;
  /** ratedWatts × derating: the most this part should dissipate. */
  allowedWatts: number;
  /** Dissipation as a percentage of the rating (not of the derated allowance). */
  loadPercent: number;
  ok: boolean;
  /** The smallest standard rating that would be within derating; null if even 10 W is not enough. */
  smallestStandardWatts: number | null;
  message: string;
}

function watts(value: number): string {
  return `${roundToSignificant(value, 3)} W`;
}

export function checkResistorPower(input: PowerCheckInput): PowerCheck {
  const dissipated = dissipationWatts(input);
  const rated = requirePositive(input.ratedWatts, 'ratedWatts');
  const derating = input.derating === undefined ? DEFAULT_DERATING : requireInRange(input.derating, 0, 1, 'derating');
  if (derating === 0) throw new DomainError('out-of-range', 'derating must be greater than zero', 'derating');

  const allowed = rated * derating;
  const ok = dissipated <= allowed * (1 + 1e-12);
  const smallest = STANDARD_WATTAGES.find((w) => dissipated <= w * derating * (1 + 1e-12)) ?? null;
  const percent = `${roundToSignificant(derating * 100, 3)} %`;
  const message = ok
    ? `dissipates ${watts(dissipated)}, within the ${watts(allowed)} a ${watts(rated)} part allows at ${percent}`
    : `dissipates ${watts(dissipated)}, over the ${watts(allowed)} a ${watts(rated)} part allows at ${percent}: ` +
      (smallest === null ? 'no standard rating up to 10 W is enough' : `use ${watts(smallest)} or more`);
  return {
    watts: dissipated,
    ratedWatts: rated,
    derating,
    allowedWatts: allowed,
    loadPercent: roundToSignificant((dissipated / rated) * 100, 12),
    ok,
    smallestStandardWatts: smallest,
    message,
  };
}
