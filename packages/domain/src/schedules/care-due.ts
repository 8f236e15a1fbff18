import { DomainError } from '../errors.ts';
import { calendarDue, type CalendarTrigger } from './calendar-due.ts';
import { urgency, type DueState } from './due-state.ts';
import { usageDue, type UsageTrigger } from './usage-due.ts';

/**
 * A care plan's task can be due by calendar, by plays and by power-on hours at once: whichever comes first. The task
 * takes the most urgent state of its triggers, and the earliest known due date.
 */

export type TriggerKind = 'calendar' | 'plays' | 'hours';

export interface CareDueInput {
  now: Date;
  calendar?: CalendarTrigger;
  plays?: UsageTrigger;
  hours?: UsageTrigger;
}

export interface TriggerStatus {
  trigger: TriggerKind;
  state: DueState;
  dueAt: Date | null;
  detail: string;
}

export interface CareDue {
  state: DueState;
  /** The trigger that sets the state (earliest due among the most urgent). */
  triggeredBy: TriggerKind;
  dueAt: Date | null;
  triggers: TriggerStatus[];
}

export function careDue(input: CareDueInput): CareDue {
  const triggers: TriggerStatus[] = [];
  if (input.calendar) triggers.push({ trigger: 'calendar', ...calendarDue(input.calendar, input.now) });
  if (input.plays) triggers.push({ trigger: 'plays', ...pick(usageDue(input.plays, input.now, 'plays')) });
  if (input.hours) triggers.push({ trigger: 'hours', ...pick(usageDue(input.hours, input.now, 'hours')) });
  if (triggers.length === 0) {
    throw new DomainError('missing-input', 'a care task needs a calendar, plays or hours trigger', 'triggers');
  }

  const time = (t: TriggerStatus) => t.dueAt?.getTime() ?? Infinity;
  const ranked = [...triggers].sort((a, b) => urgency(b.state) - urgency(a.state) || time(a) - time(b));
  const first = ranked[0] as TriggerStatus;
  const known = triggers.map(time).filter((t) => t !== Infinity);
  return {
    state: first.state,
    triggeredBy: first.trigger,
    dueAt: known.length > 0 ? new Date(Math.min(...known)) : null,
    triggers,
  };
}

function pick(due: { state: DueState; dueAt: Date | null; detail: string }) {
  return { state: due.state, dueAt: due.dueAt, detail: due.detail };
}
