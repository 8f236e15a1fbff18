import { DomainError } from '../errors.ts';
import { describe } from '../input-checks.ts';
import { dateParts, epochDayFromParts, formatPlainDate, isoWeekMonday, parsePlainDate, type EpochDay } from '../plain-date.ts';

/**
 * When a board was made, from what is stamped or written on it: a full date ("1989-08-21"), a month ("1989-08"),
 * a year ("1989"), an ISO week ("1989-W34"), or the four-digit year-week code printed on chips and boards ("8934").
 * A two-digit year is read as the most recent year not after `asOf` ("8934" in 2025 is 1989, "1512" is 2015): a
 * board cannot be made in the future. Four digits that read both as a year and as a year-week ("2012") are refused
 * as ambiguous; "20W12" says which. Partial dates resolve to their first day, the earlier (safer) end for a recap.
 */

export interface ManufactureDate {
  date: string;
  precision: 'day' | 'week' | 'month' | 'year';
}

/** YYWW: the most recent year ending in YY whose week WW does not start after `today`. */
function yearWeekCode(twoDigitYear: number, week: number, today: EpochDay): EpochDay {
  const { year: thisYear } = dateParts(today);
  const year = thisYear - (((thisYear % 100) - twoDigitYear + 100) % 100);
  const day = isoWeekMonday(year, week, 'dateCode');
  return day > today ? isoWeekMonday(year - 100, week, 'dateCode') : day;
}

export function parseManufactureDate(code: string, asOf: string): ManufactureDate {
  const today = parsePlainDate(asOf, 'asOf');
  if (typeof code !== 'string') throw new DomainError('invalid-date', `${describe(code)} is not a date code`, 'dateCode');
  const text = code.trim().toUpperCase();
  let day: EpochDay;
  let precision: ManufactureDate['precision'];
  let m: RegExpExecArray | null;

  if (/^\d{4}-\d{2}-\d{2}$/.test(text)) {
    day = parsePlainDate(text, 'dateCode');
    precision = 'day';
  } else if ((m = /^(\d{4})-(\d{2})$/.exec(text))) {
    day = epochDayFromParts(Number(m[1]), Number(m[2]), 1, 'dateCode');
    precision = 'month';
  } else if ((m = /^(\d{4})-?W(\d{2})$/.exec(text))) {
    day = isoWeekMonday(Number(m[1]), Number(m[2]), 'dateCode');
    precision = 'week';
  } else if ((m = /^(\d{2})(\d{2})$/.exec(text))) {
    const { year: thisYear } = dateParts(today);
    const week = Number(m[2]);
    const readsAsYear = Number(text) >= 1900 && Number(text) <= thisYear;
    const readsAsYearWeek = week >= 1 && week <= 53;
    if (readsAsYear && readsAsYearWeek) {
      throw new DomainError(
        'ambiguous',
        `"${code}" could be the year ${text} or week ${week} of a year ending in ${m[1]}: write ${text}-01 or ${m[1]}W${m[2]}`,
        'dateCode',
      );
    }
    if (readsAsYear) {
      day = epochDayFromParts(Number(text), 1, 1, 'dateCode');
      precision = 'year';
    } else if (readsAsYearWeek) {
      day = yearWeekCode(Number(m[1]), week, today);
      precision = 'week';
    } else if (Number(text) > thisYear && Number(text) < thisYear + 100) {
      // "2061" in 2060 is a year still to come; "8960" is more likely a year-week with a slip in the week.
      throw new DomainError('invalid-date', `"${code}" is after ${asOf}: a board cannot be made in the future`, 'dateCode');
    } else {
      throw new DomainError('invalid-date', `"${code}" is neither a year nor a year-week code (weeks run 01–53)`, 'dateCode');
    }
  } else if ((m = /^(\d{2})W(\d{2})$/.exec(text))) {
    day = yearWeekCode(Number(m[1]), Number(m[2]), today);
    precision = 'week';
  } else {
    throw new DomainError(
      'invalid-date',
      `"${code}" is not a date code: use YYYY-MM-DD, YYYY-MM, YYYY, YYYY-Www or a year-week code such as 8934`,
      'dateCode',
    );
  }
  if (day > today) throw new DomainError('invalid-date', `"${code}" is after ${asOf}: a board cannot be made in the future`, 'dateCode');
  return { date: formatPlainDate(day), precision };
}
