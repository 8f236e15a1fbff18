import { DomainError } from './errors';
import { describe } from './input-checks';

/**
 * Calendar dates with no time or zone ("2024-03-31"), held as whole days since 1970-01-01 so that adding days and
 * comparing dates is integer arithmetic, never subject to a time zone's midnight.
 */

export type EpochDay = number;

const MS_PER_DAY = 86_400_000;

export function epochDayFromParts(year: number, month: number, day: number, field = 'date'): EpochDay {
  const ms = Date.UTC(year, month - 1, day);
  const check = new Date(ms);
  if (
    !Number.isInteger(year) ||
    !Number.isInteger(month) ||
    !Number.isInteger(day) ||
    check.getUTCFullYear() !== year ||
    check.getUTCMonth() !== month - 1 ||
    check.getUTCDate() !== day
  ) {
    throw new DomainError('invalid-date', `${year}-${month}-${day} is not a calendar date`, field);
  }
  return Math.round(ms / MS_PER_DAY);
}

export function parsePlainDate(text: string, field = 'date'): EpochDay {
  const match = typeof text === 'string' ? /^(\d{4})-(\d{2})-(\d{2})$/.exec(text.trim()) : null;
  if (!match) throw new DomainError('invalid-date', `${describe(text)} is not a date in the form YYYY-MM-DD`, field);
  return epochDayFromParts(Number(match[1]), Number(match[2]), Number(match[3]), field);
}

export function formatPlainDate(day: EpochDay): string {
  return new Date(day * MS_PER_DAY).toISOString().slice(0, 10);
}

export function dateParts(day: EpochDay): { year: number; month: number; day: number } {
  const d = new Date(day * MS_PER_DAY);
  return { year: d.getUTCFullYear(), month: d.getUTCMonth() + 1, day: d.getUTCDate() };
}

/** ISO 8601 weekday: Monday 1 … Sunday 7. */
export function isoWeekday(day: EpochDay): number {
  // 1970-01-01 was a Thursday (4).
  return ((((day + 3) % 7) + 7) % 7) + 1;
}

/** The Monday of ISO 8601 week `week` of `year` (week 1 holds the year's first Thursday). */
export function isoWeekMonday(year: number, week: number, field = 'date'): EpochDay {
  const jan4 = epochDayFromParts(year, 1, 4, field);
  const week1Monday = jan4 - (isoWeekday(jan4) - 1);
  const monday = week1Monday + (week - 1) * 7;
  const weeksInYear = isoWeekMonday53(year) ? 53 : 52;
  if (!Number.isInteger(week) || week < 1 || week > weeksInYear) {
    throw new DomainError('invalid-date', `${year} has no ISO week ${week} (it has ${weeksInYear})`, field);
  }
  return monday;
}

/** A year has 53 ISO weeks when it starts on a Thursday, or is a leap year starting on a Wednesday. */
function isoWeekMonday53(year: number): boolean {
  const jan1 = isoWeekday(epochDayFromParts(year, 1, 1));
  const leap = (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0;
  return jan1 === 4 || (leap && jan1 === 3);
}

export function daysInMonth(year: number, month: number): number {
  return new Date(Date.UTC(year, month, 0)).getUTCDate();
}
