import { DomainError } from '../errors.ts';
import { dateParts, daysInMonth, epochDayFromParts, isoWeekday, type EpochDay } from '../plain-date.ts';
import { parseRecurrenceRule, validateRecurrenceRule, WEEKDAYS, type RecurrenceRule } from './recurrence-rule.ts';
import { formatWallTime, instantOf, parseWallTime, requireTimeZone, wallTimeAt, type WallTime } from './zoned-time.ts';

/**
 * Occurrences of a recurrence rule from a start in an IANA zone. Each occurrence keeps the start's wall-clock time
 * ("09:00 every first Monday" stays 09:00 across daylight-saving changes), turned into an instant per RFC 5545
 * §3.3.5. As RFC 5545 §3.3.10 says, parts the rule leaves out come from the start: a monthly rule starting on the 31st
 * means BYMONTHDAY=31 and so skips months without a 31st (use BYMONTHDAY=-1 for "the last day"). Like the rrule
 * package, a start that does not itself match the rule is not an occurrence.
 */

export interface RecurrenceStart {
  /** Local wall time of the first occurrence, "2024-01-31T09:00". */
  start: string;
  timeZone: string;
}

export interface Occurrence {
  at: Date;
  /** The clock on the wall in the rule's zone at that instant, "2024-03-31T09:00:00". */
  local: string;
}

interface Plan {
  rule: RecurrenceRule;
  startWall: WallTime;
  startDay: EpochDay;
  timeZone: string;
  untilInstant: number;
}

/** Periods scanned without a single occurrence before deciding the rule can never match again (400 years). */
const EMPTY_SCAN_YEARS = 400;

/** RFC 5545 §3.3.4 and §3.3.5 give DATE and DATE-TIME a four-digit year: no occurrence can fall after 9999-12-31. */
const LAST_DAY = epochDayFromParts(9999, 12, 31);

function plan(ruleInput: RecurrenceRule | string, start: RecurrenceStart): Plan {
  const parsed = typeof ruleInput === 'string' ? parseRecurrenceRule(ruleInput) : validateRecurrenceRule(ruleInput);
  const timeZone = requireTimeZone(start?.timeZone);
  const startWall = parseWallTime(start.start);
  const startDay = epochDayFromParts(startWall.year, startWall.month, startWall.day);
  const rule: RecurrenceRule = {
    ...parsed,
    byDay: [...parsed.byDay],
    byMonthDay: [...parsed.byMonthDay],
    byMonth: [...parsed.byMonth],
    bySetPos: [...(parsed.bySetPos ?? [])],
  };

  // RFC 5545 §3.3.10: missing parts are taken from DTSTART.
  if (rule.byDay.length === 0 && rule.byMonthDay.length === 0) {
    if (rule.frequency === 'WEEKLY') rule.byDay = [{ weekday: WEEKDAYS[isoWeekday(startDay) - 1] ?? 'MO', ordinal: null }];
    if (rule.frequency === 'MONTHLY') rule.byMonthDay = [startWall.day];
    if (rule.frequency === 'YEARLY') {
      if (rule.byMonth.length === 0) rule.byMonth = [startWall.month];
      rule.byMonthDay = [startWall.day];
    }
  }

  let untilInstant = Infinity;
  const until = rule.until;
  if (until?.kind === 'instant') untilInstant = until.instant;
  else if (until?.kind === 'local') untilInstant = instantOf(until.wall, timeZone);
  else if (until?.kind === 'date') {
    // A date-only UNTIL includes the whole of that local date.
    const { year, month, day } = dateParts(until.date + 1);
    untilInstant = instantOf({ year, month, day, hour: 0, minute: 0, second: 0 }, timeZone) - 1;
  }
  return { rule, startWall, startDay, timeZone, untilInstant };
}

function monthIndex(day: EpochDay): number {
  const { year, month } = dateParts(day);
  return year * 12 + (month - 1);
}

/** How many days, weeks, months or years (before INTERVAL) the period holding `day` lies after the start's period. */
function periodUnitsBetween(p: Plan, day: EpochDay): number {
  switch (p.rule.frequency) {
    case 'DAILY':
      return day - p.startDay;
    case 'WEEKLY':
      return Math.floor((weekStartOf(p, day) - weekStartOf(p, p.startDay)) / 7);
    case 'MONTHLY':
      return monthIndex(day) - monthIndex(p.startDay);
    case 'YEARLY':
      return dateParts(day).year - p.startWall.year;
  }
}

function weekStartOf(p: Plan, day: EpochDay): EpochDay {
  const wkst = WEEKDAYS.indexOf(p.rule.weekStart) + 1;
  return day - ((isoWeekday(day) - wkst + 7) % 7);
}

/** Every day of period number `units` (counted in days, weeks, months or years from the start's period). */
function daysOfPeriod(p: Plan, units: number): [EpochDay, EpochDay] {
  switch (p.rule.frequency) {
    case 'DAILY':
      return [p.startDay + units, p.startDay + units + 1];
    case 'WEEKLY': {
      const first = weekStartOf(p, p.startDay) + units * 7;
      return [first, first + 7];
    }
    case 'MONTHLY': {
      const index = monthIndex(p.startDay) + units;
      const year = Math.floor(index / 12);
      const month = (index % 12) + 1;
      const first = epochDayFromParts(year, month, 1);
      return [first, first + daysInMonth(year, month)];
    }
    case 'YEARLY': {
      const year = p.startWall.year + units;
      return [epochDayFromParts(year, 1, 1), epochDayFromParts(year + 1, 1, 1)];
    }
  }
}

function matches(p: Plan, day: EpochDay): boolean {
  const { rule } = p;
  const { year, month, day: dom } = dateParts(day);
  if (rule.byMonth.length > 0 && !rule.byMonth.includes(month)) return false;
  const monthLength = daysInMonth(year, month);
  if (rule.byMonthDay.length > 0 && !rule.byMonthDay.some((d) => (d > 0 ? d === dom : monthLength + d + 1 === dom))) {
    return false;
  }
  if (rule.byDay.length > 0) {
    const weekday = WEEKDAYS[isoWeekday(day) - 1];
    // Ordinals count within the month for monthly rules and yearly rules with BYMONTH, else within the year.
    const withinMonth = rule.frequency === 'MONTHLY' || rule.byMonth.length > 0;
    const position = withinMonth ? dom : day - epochDayFromParts(year, 1, 1) + 1;
    const length = withinMonth ? monthLength : epochDayFromParts(year + 1, 1, 1) - epochDayFromParts(year, 1, 1);
    const ok = rule.byDay.some((d) => {
      if (d.weekday !== weekday) return false;
      if (d.ordinal === null) return true;
      const nth = d.ordinal > 0 ? Math.floor((position - 1) / 7) + 1 : -(Math.floor((length - position) / 7) + 1);
      return nth === d.ordinal;
    });
    if (!ok) return false;
  }
  return true;
}

/**
 * The period's matching days in order; with BYSETPOS, only those at the given positions of that set (RFC 5545
 * §3.3.10: BYSETPOS picks from the whole period's set, before occurrences ahead of DTSTART are dropped — as the
 * rrule package does).
 */
function daysInSet(p: Plan, first: EpochDay, end: EpochDay): EpochDay[] {
  const set: EpochDay[] = [];
  for (let day = first; day < end; day++) if (matches(p, day)) set.push(day);
  const positions = p.rule.bySetPos ?? [];
  if (positions.length === 0) return set;
  const picked = new Set<EpochDay>();
  for (const n of positions) {
    const day = n > 0 ? set[n - 1] : set[set.length + n];
    if (day !== undefined) picked.add(day);
  }
  return [...picked].sort((a, b) => a - b);
}

function periodsPerYear(p: Plan): number {
  return { DAILY: 366, WEEKLY: 53, MONTHLY: 12, YEARLY: 1 }[p.rule.frequency];
}

/**
 * Occurrences in order, from the start (or, when `from` is given and the rule has no COUNT, from the period
 * holding `from`, so that a rule begun years ago costs nothing to query today).
 */
export function* iterateOccurrences(ruleInput: RecurrenceRule | string, start: RecurrenceStart, from?: Date): Generator<Occurrence> {
  const p = plan(ruleInput, start);
  const { rule } = p;
  const fromInstant = from === undefined ? -Infinity : requireInstant(from, 'from');
  let units = 0;
  if (
    from !== undefined &&
    rule.count === null &&
    fromInstant > Date.UTC(p.startWall.year, p.startWall.month - 1, p.startWall.day) + 2 * 86_400_000
  ) {
    // Jump to one period before the one holding `from`, aligned to INTERVAL; a day's margin covers the zone offset.
    const fromDay = Math.floor(fromInstant / 86_400_000) - 1;
    const raw = periodUnitsBetween(p, fromDay);
    units = Math.max(0, (Math.floor(raw / rule.interval) - 1) * rule.interval);
  }

  let emitted = 0;
  let emptyPeriods = 0;
  const maxEmpty = Math.ceil((EMPTY_SCAN_YEARS * periodsPerYear(p)) / rule.interval);
  for (;;) {
    const [first, end] = daysOfPeriod(p, units);
    let found = false;
    for (const day of daysInSet(p, first, end)) {
      if (day > LAST_DAY) return;
      if (day < p.startDay) continue;
      found = true;
      const { year, month, day: dom } = dateParts(day);
      const wall: WallTime = { year, month, day: dom, hour: p.startWall.hour, minute: p.startWall.minute, second: p.startWall.second };
      const instant = instantOf(wall, p.timeZone);
      if (instant > p.untilInstant) return;
      emitted++;
      // In a skipped hour the clock shows a different time from the rule's (02:30 becomes 03:30): report the clock.
      if (instant >= fromInstant) yield { at: new Date(instant), local: formatWallTime(wallTimeAt(instant, p.timeZone)) };
      if (rule.count !== null && emitted >= rule.count) return;
    }
    emptyPeriods = found ? 0 : emptyPeriods + 1;
    if (emptyPeriods > maxEmpty) return;
    units += rule.interval;
  }
}

function requireInstant(value: Date, field: string): number {
  const t = value instanceof Date ? value.getTime() : NaN;
  if (!Number.isFinite(t)) throw new DomainError('invalid-date', `${field} must be a valid date and time`, field);
  return t;
}

/** The first occurrence strictly after `after` (or at it, with `inclusive`); null when the rule has ended. */
export function nextOccurrence(
  rule: RecurrenceRule | string,
  start: RecurrenceStart,
  after: Date,
  options: { inclusive?: boolean } = {},
): Occurrence | null {
  const t = requireInstant(after, 'after');
  for (const occurrence of iterateOccurrences(rule, start, after)) {
    if (occurrence.at.getTime() > t || (options.inclusive && occurrence.at.getTime() === t)) return occurrence;
  }
  return null;
}

/** Occurrences with from ≤ at < to, at most `limit` of them. */
export function occurrencesBetween(
  rule: RecurrenceRule | string,
  start: RecurrenceStart,
  from: Date,
  to: Date,
  limit = 1000,
): Occurrence[] {
  if (!Number.isSafeInteger(limit) || limit < 0)
    throw new DomainError('out-of-range', `limit must be a whole number (got ${limit})`, 'limit');
  const end = requireInstant(to, 'to');
  if (end < requireInstant(from, 'from')) {
    throw new DomainError('inverted-period', 'the end of the range is before its start', 'to');
  }
  const out: Occurrence[] = [];
  for (const occurrence of iterateOccurrences(rule, start, from)) {
    if (occurrence.at.getTime() >= end || out.length >= limit) break;
    out.push(occurrence);
  }
  return out;
}

/** The first `n` occurrences from the start. */
export function firstOccurrences(rule: RecurrenceRule | string, start: RecurrenceStart, n: number): Occurrence[] {
  if (!Number.isSafeInteger(n) || n < 0) throw new DomainError('out-of-range', `n must be a whole number (got ${n})`, 'n');
  const out: Occurrence[] = [];
  if (n === 0) return out;
  for (const occurrence of iterateOccurrences(rule, start)) {
    out.push(occurrence);
    if (out.length >= n) break;
  }
  return out;
}
