import { DomainError } from '../errors.ts';
import { dateParts, epochDayFromParts, formatPlainDate, isoWeekday, parsePlainDate } from '../plain-date.ts';
import { firstOccurrences, iterateOccurrences, type Occurrence, type RecurrenceStart } from './recurrence.ts';
import { parseRecurrenceRule, WEEKDAYS, type RecurrenceRule, type Weekday } from './recurrence-rule.ts';
import { parseWallTime } from './zoned-time.ts';

/**
 * A calendar rule as people choose it on the plan editor, and back: the editor never shows RFC 5545 text. The choices
 * cover every N days; every N weeks on chosen weekdays; every N months (or every year in a chosen month) on day N or
 * the last day, or on the first/second/third/fourth/last Tuesday, weekday (Mon–Fri) or day — written with BYSETPOS as
 * in RFC 5545 §3.8.5.3's examples ("the third instance into the month of one of Tuesday, Wednesday or Thursday" is
 * BYDAY=TU,WE,TH;BYSETPOS=3; "the last work day of the month" is BYDAY=MO,TU,WE,TH,FR;BYSETPOS=-1) — and an optional
 * end after N times or on a date.
 */

export type RepeatEvery = 'day' | 'week' | 'month' | 'year';
export type Position = 1 | 2 | 3 | 4 | -1;
/** A named weekday, any weekday Monday to Friday, or any day at all. */
export type PositionDay = Weekday | 'weekday' | 'day';

export interface RuleChoices {
  every: RepeatEvery;
  /** Every `interval` days, weeks, months or years (1 = every one). */
  interval: number;
  /** Weekly: the weekdays it falls on (at least one). */
  weekdays: Weekday[];
  /** Monthly and yearly: on a day of the month, or on a position ("the last Tuesday"). */
  monthlyBy: 'day-of-month' | 'position';
  /** 1…31, or -1 for the last day of the month. */
  monthDay: number;
  position: Position;
  positionDay: PositionDay;
  /** Yearly: the month, 1…12. */
  month: number;
  end: 'never' | 'after' | 'until';
  /** After this many times. */
  times: number;
  /** Through this local date, YYYY-MM-DD. */
  until: string;
}

const WORKDAYS: readonly Weekday[] = ['MO', 'TU', 'WE', 'TH', 'FR'];
const POSITIONS: readonly Position[] = [1, 2, 3, 4, -1];
const FREQ: Record<RepeatEvery, RecurrenceRule['frequency']> = { day: 'DAILY', week: 'WEEKLY', month: 'MONTHLY', year: 'YEARLY' };

export const WEEKDAY_NAMES: Record<Weekday, string> = {
  MO: 'Monday',
  TU: 'Tuesday',
  WE: 'Wednesday',
  TH: 'Thursday',
  FR: 'Friday',
  SA: 'Saturday',
  SU: 'Sunday',
};
export const MONTH_NAMES = [
  'January',
  'February',
  'March',
  'April',
  'May',
  'June',
  'July',
  'August',
  'September',
  'October',
  'November',
  'December',
] as const;
export const POSITION_NAMES: Record<Position, string> = { 1: 'first', 2: 'second', 3: 'third', 4: 'fourth', [-1]: 'last' };

/** Sensible starting choices for a plan that starts on `start` ("2026-01-27T09:00"): monthly on that day. */
export function defaultChoices(start: string): RuleChoices {
  const wall = parseWallTime(start);
  const day = epochDayFromParts(wall.year, wall.month, wall.day);
  return {
    every: 'month',
    interval: 1,
    weekdays: [WEEKDAYS[isoWeekday(day) - 1] ?? 'MO'],
    monthlyBy: 'day-of-month',
    monthDay: wall.day,
    position: 1,
    positionDay: WEEKDAYS[isoWeekday(day) - 1] ?? 'MO',
    month: wall.month,
    end: 'never',
    times: 10,
    until: formatPlainDate(day + 365),
  };
}

function wholeAtLeast(value: number, min: number, max: number, field: string): number {
  if (!Number.isInteger(value) || value < min || value > max) {
    throw new DomainError('out-of-range', `${field} must be a whole number from ${min} to ${max} (got ${value})`, field);
  }
  return value;
}

/** The RRULE value (without "RRULE:") for the choices. */
export function ruleFromChoices(c: RuleChoices): string {
  const parts = [`FREQ=${FREQ[c.every]}`];
  const interval = wholeAtLeast(c.interval, 1, 999, 'interval');
  if (interval > 1) parts.push(`INTERVAL=${interval}`);
  if (c.every === 'week') {
    const days = WEEKDAYS.filter((d) => c.weekdays.includes(d));
    if (days.length === 0) throw new DomainError('missing-input', 'choose at least one weekday', 'weekdays');
    parts.push(`BYDAY=${days.join(',')}`);
  }
  if (c.every === 'year') parts.push(`BYMONTH=${wholeAtLeast(c.month, 1, 12, 'month')}`);
  if (c.every === 'month' || c.every === 'year') {
    if (c.monthlyBy === 'day-of-month') {
      const day = c.monthDay === -1 ? -1 : wholeAtLeast(c.monthDay, 1, 31, 'monthDay');
      parts.push(`BYMONTHDAY=${day}`);
    } else {
      if (!POSITIONS.includes(c.position)) throw new DomainError('out-of-range', 'position must be first to fourth, or last', 'position');
      const days = c.positionDay === 'weekday' ? WORKDAYS : c.positionDay === 'day' ? WEEKDAYS : [c.positionDay];
      parts.push(`BYDAY=${days.join(',')}`, `BYSETPOS=${c.position}`);
    }
  }
  if (c.end === 'after') parts.push(`COUNT=${wholeAtLeast(c.times, 1, 9999, 'times')}`);
  if (c.end === 'until') parts.push(`UNTIL=${formatPlainDate(parsePlainDate(c.until, 'until')).replace(/-/g, '')}`);
  return parts.join(';');
}

const sameDays = (a: readonly Weekday[], b: readonly Weekday[]) => a.length === b.length && a.every((d) => b.includes(d));

/**
 * The editor's choices for a stored rule, filling what the rule leaves out from the start (RFC 5545 §3.3.10); null
 * when the rule says something the editor cannot (several month days, BYDAY ordinals, several months…).
 */
export function choicesFromRule(rule: string, start: string): RuleChoices | null {
  let r: RecurrenceRule;
  try {
    r = parseRecurrenceRule(rule);
  } catch {
    return null;
  }
  const c = defaultChoices(start);
  c.interval = r.interval;
  const setPos = r.bySetPos ?? [];
  if (r.count !== null) Object.assign(c, { end: 'after', times: r.count });
  if (r.until !== null) {
    const day =
      r.until.kind === 'date'
        ? r.until.date
        : r.until.kind === 'local'
          ? epochDayFromParts(r.until.wall.year, r.until.wall.month, r.until.wall.day)
          : Math.floor(r.until.instant / 86_400_000);
    Object.assign(c, { end: 'until', until: formatPlainDate(day) });
  }
  if (r.byDay.some((d) => d.ordinal !== null)) return null;
  const weekdays = r.byDay.map((d) => d.weekday);
  switch (r.frequency) {
    case 'DAILY':
      if (weekdays.length || r.byMonthDay.length || r.byMonth.length || setPos.length) return null;
      return { ...c, every: 'day' };
    case 'WEEKLY':
      if (r.byMonthDay.length || r.byMonth.length || setPos.length) return null;
      return { ...c, every: 'week', weekdays: weekdays.length ? WEEKDAYS.filter((d) => weekdays.includes(d)) : c.weekdays };
    case 'MONTHLY':
    case 'YEARLY': {
      const every: RepeatEvery = r.frequency === 'MONTHLY' ? 'month' : 'year';
      if (r.frequency === 'MONTHLY' && r.byMonth.length) return null;
      if (r.frequency === 'YEARLY' && r.byMonth.length > 1) return null;
      const month = r.byMonth[0] ?? c.month;
      if (weekdays.length === 0) {
        if (setPos.length || r.byMonthDay.length > 1) return null;
        return { ...c, every, month, monthlyBy: 'day-of-month', monthDay: r.byMonthDay[0] ?? c.monthDay };
      }
      if (r.byMonthDay.length || setPos.length !== 1) return null;
      const position = setPos[0] as Position;
      if (!POSITIONS.includes(position)) return null;
      let positionDay: PositionDay;
      if (sameDays(weekdays, WEEKDAYS)) positionDay = 'day';
      else if (sameDays(weekdays, WORKDAYS)) positionDay = 'weekday';
      else if (weekdays.length === 1) positionDay = weekdays[0]!;
      else return null;
      return { ...c, every, month, monthlyBy: 'position', position, positionDay };
    }
  }
}

function clock(start: string): string {
  const wall = parseWallTime(start);
  return `${wall.hour}:${String(wall.minute).padStart(2, '0')}`;
}

function listWords(words: string[]): string {
  if (words.length <= 1) return words.join('');
  return `${words.slice(0, -1).join(', ')} and ${words.at(-1)}`;
}

function dayOfMonthWords(day: number): string {
  return day === -1 ? 'the last day' : `day ${day}`;
}

function positionWords(c: RuleChoices): string {
  const what = c.positionDay === 'weekday' ? 'weekday' : c.positionDay === 'day' ? 'day' : WEEKDAY_NAMES[c.positionDay];
  return `the ${POSITION_NAMES[c.position]} ${what}`;
}

function longDate(iso: string): string {
  const { year, month, day } = dateParts(parsePlainDate(iso, 'until'));
  return `${day} ${MONTH_NAMES[month - 1]} ${year}`;
}

/**
 * The rule in plain words, with the start's time of day: "Every month on the last Tuesday at 9:00",
 * "Every 2 weeks on Monday and Thursday at 7:30, 10 times". A rule the editor cannot say reads "On a custom schedule".
 */
export function describeRule(rule: string, start: string): string {
  const c = choicesFromRule(rule, start);
  if (!c) return `On a custom schedule at ${clock(start)}`;
  const unit = { day: 'day', week: 'week', month: 'month', year: 'year' }[c.every];
  const every = c.interval === 1 ? `Every ${unit}` : `Every ${c.interval} ${unit}s`;
  let on = '';
  if (c.every === 'week') on = ` on ${listWords(c.weekdays.map((d) => WEEKDAY_NAMES[d]))}`;
  if (c.every === 'month') on = ` on ${c.monthlyBy === 'day-of-month' ? dayOfMonthWords(c.monthDay) : positionWords(c)}`;
  if (c.every === 'year') {
    const month = MONTH_NAMES[c.month - 1];
    on =
      c.monthlyBy === 'day-of-month'
        ? c.monthDay === -1
          ? ` on the last day of ${month}`
          : ` on ${c.monthDay} ${month}`
        : ` on ${positionWords(c)} of ${month}`;
  }
  const end =
    c.end === 'after' ? (c.times === 1 ? ', once' : `, ${c.times} times`) : c.end === 'until' ? `, until ${longDate(c.until)}` : '';
  return `${every}${on} at ${clock(start)}${end}`;
}

/** True when the rule falls on at least one date from its start (RFC 5545 allows rules that never do). */
export function ruleOccurs(rule: string, start: RecurrenceStart): boolean {
  return firstOccurrences(rule, start, 1).length > 0;
}

/** The next `n` occurrences at or after `from`: what the editor shows while a person chooses. */
export function upcomingOccurrences(rule: string, start: RecurrenceStart, from: Date, n: number): Occurrence[] {
  const out: Occurrence[] = [];
  if (n <= 0) return out;
  for (const o of iterateOccurrences(rule, start, from)) {
    if (o.at.getTime() < from.getTime()) continue;
    out.push(o);
    if (out.length >= n) break;
  }
  return out;
}
