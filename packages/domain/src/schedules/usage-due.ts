import { DomainError } from '../errors.ts';
import { requireNonNegative, requirePositive } from '../input-checks.ts';
import { meterDelta } from '../meters/meter-delta.ts';
import type { DueState } from './due-state.ts';

/**
 * Usage-driven work: every N plays on the play meter, or every N power-on hours on the hour meter, counted from the
 * reading at the last service (with rollover at the meter's modulus). With a usage rate per day, the due date is
 * projected so it can be compared with calendar work.
 */

export interface UsageTrigger {
  every: number;
  lastServiceReading: number;
  currentReading: number;
  /** The meter's rollover point, e.g. 1,000,000 for a six-digit meter. */
  meterModulus?: number | null;
  /** Units before due that count as "due soon" (default 10 % of `every`). */
  lead?: number;
  /** Average use per day, to project a due date. */
  perDay?: number;
}

export interface UsageDue {
  state: DueState;
  used: number;
  /** Units left until due; negative when overdue. */
  remaining: number;
  /** Projected from `perDay`; null without a rate (or with a rate of 0). */
  dueAt: Date | null;
  detail: string;
}

export const DEFAULT_USAGE_LEAD_FRACTION = 0.1;

export function usageDue(trigger: UsageTrigger, now: Date, unit: string): UsageDue {
  const at = now instanceof Date ? now.getTime() : NaN;
  if (!Number.isFinite(at)) throw new DomainError('invalid-date', 'now must be a valid date and time', 'now');
  const every = requirePositive(trigger?.every, 'every');
  const lead = trigger.lead === undefined ? every * DEFAULT_USAGE_LEAD_FRACTION : requireNonNegative(trigger.lead, 'lead');
  const perDay = trigger.perDay === undefined ? null : requireNonNegative(trigger.perDay, 'perDay');
  const { delta: used } = meterDelta(trigger.lastServiceReading, trigger.currentReading, trigger.meterModulus);

  const remaining = every - used;
  const state: DueState = remaining <= 0 ? 'overdue' : remaining <= lead ? 'due-soon' : 'ok';
  const dueAt = perDay ? new Date(at + (remaining / perDay) * 86_400_000) : null;
  const detail =
    remaining <= 0 ? `${used} ${unit} since last service, ${-remaining} past the ${every}` : `${remaining} ${unit} to go of ${every}`;
  return { state, used, remaining, dueAt, detail };
}
