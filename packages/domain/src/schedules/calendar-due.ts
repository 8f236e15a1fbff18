import { DomainError } from '../errors.ts';
import { requireNonNegative } from '../input-checks.ts';
import type { DueState } from './due-state.ts';
import { firstOccurrences, nextOccurrence, type RecurrenceStart } from './recurrence.ts';
import type { RecurrenceRule } from './recurrence-rule.ts';

/**
 * Calendar-driven work: due at the first occurrence of its rule after it was last done (or at the first occurrence
 * at all, if never done). Overdue once that moment has passed; due soon within the lead.
 */

export interface CalendarTrigger {
  rule: RecurrenceRule | string;
  start: RecurrenceStart;
  lastDone?: Date | null;
  /** Days before the due moment that count as "due soon" (default 7). */
  leadDays?: number;
}

export interface CalendarDue {
  state: DueState;
  /** null when the rule has no further occurrences (COUNT or UNTIL reached). */
  dueAt: Date | null;
  detail: string;
}

export const DEFAULT_LEAD_DAYS = 7;

export function calendarDue(trigger: CalendarTrigger, now: Date): CalendarDue {
  const at = now instanceof Date ? now.getTime() : NaN;
  if (!Number.isFinite(at)) throw new DomainError('invalid-date', 'now must be a valid date and time', 'now');
  const leadDays = trigger.leadDays === undefined ? DEFAULT_LEAD_DAYS : requireNonNegative(trigger.leadDays, 'leadDays');
  const lastDone = trigger.lastDone ?? null;
  if (lastDone !== null && !(lastDone instanceof Date && Number.isFinite(lastDone.getTime()))) {
    throw new DomainError('invalid-date', 'lastDone must be a valid date and time', 'lastDone');
  }
  const next = lastDone
    ? nextOccurrence(trigger.rule, trigger.start, lastDone)
    : (firstOccurrences(trigger.rule, trigger.start, 1)[0] ?? null);
  if (!next) return { state: 'ok', dueAt: null, detail: 'the schedule has no further dates' };

  const due = next.at.getTime();
  const state: DueState = at >= due ? 'overdue' : due - at <= leadDays * 86_400_000 ? 'due-soon' : 'ok';
  const detail = state === 'overdue' ? `overdue since ${next.local}` : `due ${next.local}`;
  return { state, dueAt: next.at, detail };
}
