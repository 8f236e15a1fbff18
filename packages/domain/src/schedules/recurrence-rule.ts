import { DomainError } from '../errors.ts';
import { describe } from '../input-checks.ts';
import { epochDayFromParts, type EpochDay } from '../plain-date.ts';
import type { WallTime } from './zoned-time.ts';

/**
 * The part of RFC 5545 §3.3.10 (RECUR) that care plans need: FREQ=DAILY/WEEKLY/MONTHLY/YEARLY, INTERVAL, BYDAY
 * (with ordinals such as 1MO or -1FR for monthly and yearly rules), BYMONTHDAY (including negatives: -1 is the last
 * day), BYMONTH, BYSETPOS (the nth of the period's matches: "the third weekday" is BYDAY=MO,TU,WE,TH,FR;BYSETPOS=3,
 * RFC 5545 §3.8.5.3's examples), COUNT, UNTIL and WKST. Anything else is refused by name rather than ignored.
 */

export type Frequency = 'DAILY' | 'WEEKLY' | 'MONTHLY' | 'YEARLY';
export type Weekday = 'MO' | 'TU' | 'WE' | 'TH' | 'FR' | 'SA' | 'SU';

/** ISO order: MO = 1 … SU = 7. */
export const WEEKDAYS: readonly Weekday[] = ['MO', 'TU', 'WE', 'TH', 'FR', 'SA', 'SU'];

export interface ByDay {
  weekday: Weekday;
  /** 1 = first, -1 = last, null = every such weekday in the period. */
  ordinal: number | null;
}

export type Until =
  | { kind: 'instant'; instant: number } // "20250101T000000Z"
  | { kind: 'local'; wall: WallTime } // "20250101T090000", in the rule's zone
  | { kind: 'date'; date: EpochDay }; // "20250101": through the end of that local date

export interface RecurrenceRule {
  frequency: Frequency;
  interval: number;
  byDay: ByDay[];
  byMonthDay: number[];
  byMonth: number[];
  /** Positions within each period's set of matches (1 = first, -1 = last); absent or empty = every match. */
  bySetPos?: number[];
  count: number | null;
  until: Until | null;
  weekStart: Weekday;
}

const FREQUENCIES: readonly Frequency[] = ['DAILY', 'WEEKLY', 'MONTHLY', 'YEARLY'];
const UNSUPPORTED = ['BYWEEKNO', 'BYYEARDAY', 'BYHOUR', 'BYMINUTE', 'BYSECOND'];

function invalid(message: string, part?: string): never {
  throw new DomainError('invalid-rule', message, part ? `rule.${part}` : 'rule');
}

function integerList(value: string, part: string, min: number, max: number, allowNegative: boolean): number[] {
  return value.split(',').map((item) => {
    if (!/^[+-]?\d{1,2}$/.test(item)) invalid(`${part}=${value}: "${item}" is not a whole number`, part);
    const n = Number(item);
    const magnitude = Math.abs(n);
    if ((n < 0 && !allowNegative) || magnitude < min || magnitude > max) {
      invalid(`${part}=${value}: ${item} is outside ${allowNegative ? `±${min}…±${max}` : `${min}…${max}`}`, part);
    }
    return n;
  });
}

function parseUntil(value: string): Until {
  const m = /^(\d{4})(\d{2})(\d{2})(?:T(\d{2})(\d{2})(\d{2})(Z)?)?$/.exec(value);
  if (!m) invalid(`UNTIL=${value} is not a date (20250131) or date-time (20250131T090000Z)`, 'UNTIL');
  const [, y, mo, d, h, mi, s, z] = m;
  let date: EpochDay;
  try {
    date = epochDayFromParts(Number(y), Number(mo), Number(d));
  } catch {
    invalid(`UNTIL=${value} is not a real date`, 'UNTIL');
  }
  if (h === undefined) return { kind: 'date', date };
  const wall = { year: Number(y), month: Number(mo), day: Number(d), hour: Number(h), minute: Number(mi), second: Number(s) };
  if (wall.hour > 23 || wall.minute > 59 || wall.second > 59) invalid(`UNTIL=${value} is not a real time`, 'UNTIL');
  if (z) return { kind: 'instant', instant: Date.UTC(wall.year, wall.month - 1, wall.day, wall.hour, wall.minute, wall.second) };
  return { kind: 'local', wall };
}

/** Parses "FREQ=MONTHLY;BYDAY=-1FR;COUNT=6" (an "RRULE:" prefix is allowed). */
export function parseRecurrenceRule(text: string): RecurrenceRule {
  if (typeof text !== 'string' || text.trim() === '') {
    throw new DomainError('invalid-rule', `a recurrence rule is needed, such as FREQ=MONTHLY;BYMONTHDAY=1 (got ${describe(text)})`, 'rule');
  }
  const body = text.trim().replace(/^RRULE:/i, '');
  const parts = new Map<string, string>();
  for (const piece of body.split(';')) {
    const eq = piece.indexOf('=');
    if (eq <= 0) invalid(`"${piece}" is not NAME=VALUE`);
    const name = piece.slice(0, eq).trim().toUpperCase();
    const value = piece
      .slice(eq + 1)
      .trim()
      .toUpperCase();
    if (parts.has(name)) invalid(`${name} appears twice`, name);
    if (UNSUPPORTED.includes(name)) {
      throw new DomainError('unsupported-rule-part', `${name} is not supported in care-plan schedules`, `rule.${name}`);
    }
    parts.set(name, value);
  }

  const frequency = parts.get('FREQ');
  if (!frequency) invalid('FREQ is required', 'FREQ');
  if (!FREQUENCIES.includes(frequency as Frequency)) {
    if (['SECONDLY', 'MINUTELY', 'HOURLY'].includes(frequency)) {
      throw new DomainError('unsupported-rule-part', `FREQ=${frequency} is not supported: care plans recur by day or longer`, 'rule.FREQ');
    }
    invalid(`FREQ=${frequency} is not a frequency`, 'FREQ');
  }

  const rule: RecurrenceRule = {
    frequency: frequency as Frequency,
    interval: 1,
    byDay: [],
    byMonthDay: [],
    byMonth: [],
    count: null,
    until: null,
    weekStart: 'MO',
  };

  for (const [name, value] of parts) {
    switch (name) {
      case 'FREQ':
        break;
      case 'INTERVAL':
        if (!/^\d+$/.test(value) || Number(value) < 1) invalid(`INTERVAL=${value} must be a whole number of at least 1`, name);
        rule.interval = Number(value);
        break;
      case 'COUNT':
        if (!/^\d+$/.test(value) || Number(value) < 1) invalid(`COUNT=${value} must be a whole number of at least 1`, name);
        rule.count = Number(value);
        break;
      case 'UNTIL':
        rule.until = parseUntil(value);
        break;
      case 'WKST':
        if (!WEEKDAYS.includes(value as Weekday)) invalid(`WKST=${value} is not a weekday (MO…SU)`, name);
        rule.weekStart = value as Weekday;
        break;
      case 'BYMONTH':
        rule.byMonth = integerList(value, name, 1, 12, false);
        break;
      case 'BYMONTHDAY':
        rule.byMonthDay = integerList(value, name, 1, 31, true);
        break;
      case 'BYSETPOS':
        rule.bySetPos = integerList(value, name, 1, 366, true);
        break;
      case 'BYDAY':
        rule.byDay = value.split(',').map((item) => {
          const m = /^([+-]?\d{1,2})?(MO|TU|WE|TH|FR|SA|SU)$/.exec(item);
          if (!m) invalid(`BYDAY=${value}: "${item}" is not a weekday such as MO, 1MO or -1FR`, name);
          const ordinal = m[1] === undefined ? null : Number(m[1]);
          if (ordinal !== null && (ordinal === 0 || Math.abs(ordinal) > 53))
            invalid(`BYDAY=${value}: ordinal ${ordinal} is out of range`, name);
          return { weekday: m[2] as Weekday, ordinal };
        });
        break;
      default:
        invalid(`${name} is not a recurrence rule part`, name);
    }
  }
  return validateRecurrenceRule(rule);
}

/** Checks a rule built as an object, with the constraints RFC 5545 §3.3.10 places on combinations. */
export function validateRecurrenceRule(rule: RecurrenceRule): RecurrenceRule {
  if (!FREQUENCIES.includes(rule?.frequency)) invalid(`frequency must be one of ${FREQUENCIES.join(', ')}`, 'FREQ');
  if (!Number.isSafeInteger(rule.interval) || rule.interval < 1) invalid('interval must be a whole number of at least 1', 'INTERVAL');
  if (rule.count !== null && (!Number.isSafeInteger(rule.count) || rule.count < 1))
    invalid('count must be a whole number of at least 1', 'COUNT');
  if (rule.count !== null && rule.until !== null) invalid('COUNT and UNTIL must not both be given (RFC 5545)', 'COUNT');
  if (rule.frequency === 'WEEKLY' && rule.byMonthDay.length > 0)
    invalid('BYMONTHDAY must not be used with FREQ=WEEKLY (RFC 5545)', 'BYMONTHDAY');
  for (const d of rule.byDay) {
    if (!WEEKDAYS.includes(d.weekday)) invalid(`${describe(d.weekday)} is not a weekday`, 'BYDAY');
    if (d.ordinal !== null) {
      if (rule.frequency !== 'MONTHLY' && rule.frequency !== 'YEARLY') {
        invalid('BYDAY ordinals such as 1MO are only allowed with FREQ=MONTHLY or YEARLY (RFC 5545)', 'BYDAY');
      }
      const limit = rule.frequency === 'MONTHLY' || rule.byMonth.length > 0 ? 5 : 53;
      if (!Number.isInteger(d.ordinal) || d.ordinal === 0 || Math.abs(d.ordinal) > limit) {
        invalid(`BYDAY ordinal ${d.ordinal} is out of range ±1…±${limit}`, 'BYDAY');
      }
    }
  }
  for (const d of rule.byMonthDay) {
    if (!Number.isInteger(d) || d === 0 || Math.abs(d) > 31) invalid(`BYMONTHDAY ${d} is outside ±1…±31`, 'BYMONTHDAY');
  }
  for (const m of rule.byMonth) {
    if (!Number.isInteger(m) || m < 1 || m > 12) invalid(`BYMONTH ${m} is outside 1…12`, 'BYMONTH');
  }
  const setPos = rule.bySetPos ?? [];
  for (const n of setPos) {
    if (!Number.isInteger(n) || n === 0 || Math.abs(n) > 366) invalid(`BYSETPOS ${n} is outside ±1…±366`, 'BYSETPOS');
  }
  // RFC 5545 §3.3.10: BYSETPOS "MUST only be used in conjunction with another BYxxx rule part".
  if (setPos.length > 0 && rule.byDay.length + rule.byMonthDay.length + rule.byMonth.length === 0) {
    invalid('BYSETPOS must be used with BYDAY, BYMONTHDAY or BYMONTH (RFC 5545)', 'BYSETPOS');
  }
  return rule;
}
