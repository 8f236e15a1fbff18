import { DomainError } from './errors.ts';
import { describe } from './input-checks.ts';

/**
 * Calendar dates with no time or zone ("2024-03-31"), held as whole days since 1970-01-01 so that adding days and
 * comparing dates is integer arithmetic, never subject to a time zone's midnight.
 */

export type EpochDay = number;

const MS_PER_DAY = 86_400_000;

/** Days since 1970-01-01 of a proleptic Gregorian date (H. Hinnant, "chrono-compatible low-level date algorithms"). */
function daysFromCivil(year: number, month: number, day: number): EpochDay {
  const y = month <= 2 ? year - 1 : year;
  const era = Math.floor(y / 400);
  const yearOfEra = y - era * 400;
  const dayOfYear = Math.floor((153 * (month + (month > 2 ? -3 : 9)) + 2) / 5) + day - 1;
  const dayOfEra = yearOfEra * 365 + Math.floor(yearOfEra / 4) - Math.floor(yearOfEra / 100) + dayOfYear;
  return era * 146_097 + dayOfEra - 719_468;
}

export function epochDayFromParts(year: number, month: number, day: number, field = 'date'): EpochDay {
  if (
    !Number.isSafeInteger(year) ||
    !Number.isInteger(month) ||
    !Number.isInteger(day) ||
    month < 1 ||
    month > 12 ||
    day < 1 ||
    day > daysInMonth(year, month)
  ) {
    throw new DomainError('invalid-date', `${year}-${month}-${day} is not a calendar date`, field);
  }
  return daysFromCivil(year, month, day);
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
  // Inverse of daysFromCivil (same source); integer arithmetic, no Date objects, as schedules call it per day.
  const z = day + 719_468;
  const era = Math.floor(z / 146_097);
  const dayOfEra = z - era * 146_097;
  const yearOfEra = Math.floor(
    (dayOfEra - Math.floor(dayOfEra / 1460) + Math.floor(dayOfEra / 36_524) - Math.floor(dayOfEra / 146_096)) / 365,
  );
  const dayOfYear = dayOfEra - (365 * yearOfEra + Math.floor(yearOfEra / 4) - Math.floor(yearOfEra / 100));
  const mp = Math.floor((5 * dayOfYear + 2) / 153);
  const month = mp < 10 ? mp + 3 : mp - 9;
  return { year: yearOfEra + era * 400 + (month <= 2 ? 1 : 0), month, day: dayOfYear - Math.floor((153 * mp + 2) / 5) + 1 };
}

export function isLeapYear(year: number): boolean {
  return (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0;
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
  return jan1 === 4 || (isLeapYear(year) && jan1 === 3);
}

const MONTH_LENGTHS = [31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];

export function daysInMonth(year: number, month: number): number {
  return month === 2 && isLeapYear(year) ? 29 : (MONTH_LENGTHS[month - 1] ?? 0);
}
