import { DomainError } from '../errors.ts';
import { roundToSignificant } from '../decimal.ts';
import { requireNonNegative, requirePositive } from '../input-checks.ts';
import { toleranceWindow, type Tolerance } from './tolerance.ts';

/**
 * A reading taken on the bench against the parts list: is the part within its tolerance window?
 * Edges are inclusive. Measured in circuit, other parts in parallel can only lower a resistance reading, so a low
 * in-circuit reading is indicative (lift a leg and measure again), never a definite fail (common practice).
 */

export type ReadingVerdict = 'pass' | 'low' | 'high';

export interface ReadingInput {
  nominal: number;
  tolerance: Tolerance;
  measured: number;
  /** Measured with the part still soldered in. */
  inCircuit?: boolean;
}

export interface ReadingResult {
  verdict: ReadingVerdict;
  /** True when the verdict may be an artefact of parallel paths: confirm out of circuit. */
  indicative: boolean;
  min: number;
  max: number;
  /** (measured − nominal) / nominal, in percent. */
  deviationPercent: number;
  note: string | null;
}

// A relative allowance far below any meter's resolution, so a reading equal to an edge as typed never fails on
// binary rounding.
const EDGE_SLACK = 1e-12;

export function checkReading(input: ReadingInput): ReadingResult {
  if (input === null || typeof input !== 'object')
    throw new DomainError('missing-input', 'a reading needs nominal, tolerance and measured');
  const nominal = requirePositive(input.nominal, 'nominal');
  const measured = requireNonNegative(input.measured, 'measured');
  const { min, max } = toleranceWindow(nominal, input.tolerance);
  const slack = EDGE_SLACK * Math.max(Math.abs(min), Math.abs(max));

  const verdict: ReadingVerdict = measured < min - slack ? 'low' : measured > max + slack ? 'high' : 'pass';
  const indicative = verdict === 'low' && input.inCircuit === true;
  const deviationPercent = roundToSignificant(((measured - nominal) / nominal) * 100, 12);

  let note: string | null = null;
  if (indicative) note = 'reads low in circuit: parallel paths can lower the reading — lift one leg and measure again';
  else if (verdict === 'low') note = `below the minimum of ${min}`;
  else if (verdict === 'high') note = `above the maximum of ${max}`;

  return { verdict, indicative, min, max, deviationPercent, note };
}
