// Reading durations as people say them: time on site "45 min", "1 h 30", "1:30", "2 hours", "1.5 h"; a lead
// "7 days", "2 weeks", "10". The API takes whole minutes and whole days; these turn the text into them, or say what
// is wrong in words a person can act on.
import type { Read } from './cabinet-entry.ts';

export type { Read } from './cabinet-entry.ts';

/** "1.5" or "1,5" (a decimal comma); no thousands separators in a duration. */
function readNumber(text: string): number | null {
  if (!/^\d+([.,]\d+)?$/.test(text)) return null;
  return Number(text.replace(',', '.'));
}

const HOURS = '(?:h|hr|hrs|hour|hours)';
const MINUTES = '(?:m|min|mins|minute|minutes)';

/**
 * Minutes: a bare number is minutes; "h" or "min" may follow; "1 h 30", "1 h 30 min", "1h30" and "1:30" are an hour
 * and a half. Whole minutes only (1.5 min is refused rather than rounded).
 */
export function readMinutes(input: string, bounds: { min?: number; max?: number } = {}): Read {
  const { min = 1, max = 24 * 60 } = bounds;
  const text = input.trim().toLowerCase().replace(/\s+/g, ' ');
  if (text === '') return { ok: false, message: 'enter how long, such as 45 min or 1 h 30' };
  let minutes: number | null = null;
  const clock = /^(\d{1,2}):([0-5]\d)$/.exec(text);
  const both = new RegExp(`^(\\S+?) ?${HOURS} ?(\\d+)(?: ?${MINUTES})?$`).exec(text);
  const hoursOnly = new RegExp(`^(\\S+?) ?${HOURS}$`).exec(text);
  const minutesOnly = new RegExp(`^(\\S+?)(?: ?${MINUTES})?$`).exec(text);
  const days = /^(\S+?) ?(?:d|day|days)$/.exec(text);
  if (days) {
    // Response targets run to days ("3 days"); a day here is 24 hours on the clock.
    const d = readNumber(days[1]!);
    if (d !== null) minutes = d * 24 * 60;
  } else if (clock) minutes = Number(clock[1]) * 60 + Number(clock[2]);
  else if (both) {
    const h = readNumber(both[1]!);
    const m = readNumber(both[2]!);
    if (h !== null && m !== null && Number.isInteger(h) && m < 60) minutes = h * 60 + m;
  } else if (hoursOnly) {
    const h = readNumber(hoursOnly[1]!);
    if (h !== null) minutes = h * 60;
  } else if (minutesOnly) {
    minutes = readNumber(minutesOnly[1]!);
  }
  if (minutes === null) return { ok: false, message: `"${input.trim()}" is not a length of time: write it as 45 min, 1 h 30 or 2 hours` };
  if (!Number.isInteger(minutes)) return { ok: false, message: 'give it to the whole minute, such as 1 h 15 or 75 min' };
  if (minutes < min) return { ok: false, message: min === 0 ? 'must not be negative' : `must be at least ${min} min` };
  if (minutes > max) return { ok: false, message: `must be at most ${formatMinutes(max)}` };
  return { ok: true, value: minutes };
}

/** Days: a bare number is days; "day(s)" or "week(s)" may follow. Whole days only. */
export function readDays(input: string, bounds: { min?: number; max?: number } = {}): Read {
  const { min = 0, max = 365 } = bounds;
  const text = input.trim().toLowerCase().replace(/\s+/g, ' ');
  if (text === '') return { ok: false, message: 'enter how many days, such as 7 days' };
  const m = /^(\S+?) ?(d|day|days|w|wk|wks|week|weeks)?$/.exec(text);
  const n = m ? readNumber(m[1]!) : null;
  if (n === null) return { ok: false, message: `"${input.trim()}" is not a number of days: write it as 7 days or 2 weeks` };
  const days = m![2]?.startsWith('w') ? n * 7 : n;
  if (!Number.isInteger(days)) return { ok: false, message: 'give it in whole days' };
  if (days < min) return { ok: false, message: `must be at least ${min} days` };
  if (days > max) return { ok: false, message: `must be at most ${max} days` };
  return { ok: true, value: days };
}

/** Minutes as people say them back: "45 min", "1 h", "1 h 30 min", "3 days". */
export function formatMinutes(minutes: number): string {
  // Two days and more read better in days ("3 days"); a single day stays "24 h", as people say it of a deadline.
  if (minutes >= 2 * 24 * 60 && minutes % (24 * 60) === 0) return formatDays(minutes / (24 * 60));
  const h = Math.floor(minutes / 60);
  const m = minutes % 60;
  if (h === 0) return `${m} min`;
  return m === 0 ? `${h} h` : `${h} h ${m} min`;
}

/** Days as people say them: "1 day", "7 days". */
export function formatDays(days: number): string {
  return days === 1 ? '1 day' : `${days} days`;
}
