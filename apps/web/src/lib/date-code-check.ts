// A date code checked as it is typed, with the same domain code the API runs (which checks again on save): an
// impossible week or a date after today is shown at the field before anything is sent. A code that reads two
// ways is not an error here — the API saves it and flags it for a person to settle.
import { parseManufactureDate } from '@bumperline/domain/components/date-codes';
import { isDomainError } from '@bumperline/domain/errors';
import { epochDayFromParts, formatPlainDate } from '@bumperline/domain/plain-date';

/** Today on this device's calendar, YYYY-MM-DD. */
export function localToday(now: Date = new Date()): string {
  return formatPlainDate(epochDayFromParts(now.getFullYear(), now.getMonth() + 1, now.getDate()));
}

/** What is wrong with the date code as printed, or null when it can be saved (blank and two-way codes included). */
export function dateCodeProblem(code: string, today: string = localToday()): string | null {
  if (code.trim() === '') return null;
  try {
    parseManufactureDate(code, today);
    return null;
  } catch (error) {
    if (!isDomainError(error)) throw error;
    return error.code === 'ambiguous' ? null : error.message;
  }
}
