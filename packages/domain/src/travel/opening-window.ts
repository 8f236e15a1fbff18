import { DomainError } from '../errors.ts';
import { requireNonNegative } from '../input-checks.ts';
import { isoWeekday, parsePlainDate } from '../plain-date.ts';
import { clock } from './route-day.ts';

/**
 * A venue's opening hours on one date, turned into the window a technician may arrive in: from opening until
 * closing less the time on site, on the day clock (minutes after local midnight of that date). Hours are per ISO
 * weekday ('1' = Monday … '7' = Sunday, ISO 8601 numbering), local "HH:MM"; a close at or before the open runs past
 * midnight (so 18:00–02:00 is open until 2 in the morning, and 00:00–00:00 is open round the clock); "24:00" is
 * accepted as a close at midnight. Yesterday's interval that runs past midnight counts for the early hours. Empty
 * hours ({}) mean not recorded: open all day, no window.
 *
 * The planner takes one window per stop, so of several usable intervals (a lunch and an evening opening) the widest
 * stretch of arrival times inside the technician's day is chosen, and the interval nearest the day as a fallback.
 */

export type Weekday = '1' | '2' | '3' | '4' | '5' | '6' | '7';
export type OpeningHours = Partial<Record<Weekday, readonly { open: string; close: string }[]>>;

export interface ArrivalWindow {
  earliest: number;
  latest: number;
}

export interface OpeningWindow {
  /** That date's hours in words: "11:00–23:00", "until 02:00, 17:00–23:00", "Closed", "Hours not recorded". */
  hoursText: string;
  /** The arrival window; null when the hours are not recorded (any time) or the venue cannot be visited. */
  window: ArrivalWindow | null;
  /** Why the venue cannot be visited that date, in plain words; null when it can. */
  closedReason: string | null;
}

const DAY = 24 * 60;

/** "HH:MM" as minutes after midnight; "24:00" only where a close at midnight is meant. */
export function clockMinutes(text: string, field: string, allowMidnightEnd = false): number {
  const match = /^(\d{2}):(\d{2})$/.exec(typeof text === 'string' ? text : '');
  const hours = Number(match?.[1]);
  const minutes = Number(match?.[2]);
  const valid = match !== null && minutes < 60 && (hours < 24 || (allowMidnightEnd && hours === 24 && minutes === 0));
  if (!valid) throw new DomainError('unparseable', `${field} must be a time as HH:MM (got ${String(text)})`, field);
  return hours * 60 + minutes;
}

/** A day's intervals on that day's clock; a close at or before the open is on the next day. */
function intervalsOf(hours: OpeningHours, weekday: Weekday): ArrivalWindow[] {
  return (hours[weekday] ?? []).map((interval, i) => {
    const field = `openingHours.${weekday}[${i}]`;
    const open = clockMinutes(interval?.open, `${field}.open`, false);
    let close = clockMinutes(interval?.close, `${field}.close`, true);
    if (close <= open) close += DAY;
    return { earliest: open, latest: close };
  });
}

const previousWeekday = (weekday: number): Weekday => String(weekday === 1 ? 7 : weekday - 1) as Weekday;

/**
 * The venue's open intervals that touch `date` (YYYY-MM-DD), on that date's clock: yesterday's late opening first
 * (shifted back a day, so it ends after midnight of `date`), then today's own.
 */
export function openIntervalsOn(hours: OpeningHours, date: string): ArrivalWindow[] {
  const weekday = isoWeekday(parsePlainDate(date, 'date'));
  const yesterday = intervalsOf(hours, previousWeekday(weekday))
    .filter((i) => i.latest > DAY)
    .map((i) => ({ earliest: i.earliest - DAY, latest: i.latest - DAY }));
  return [...yesterday, ...intervalsOf(hours, String(weekday) as Weekday)];
}

function hoursInWords(intervals: readonly ArrivalWindow[]): string {
  return intervals.map((i) => (i.earliest < 0 ? `until ${clock(i.latest)}` : `${clock(i.earliest)}–${clock(i.latest % DAY)}`)).join(', ');
}

export function isHoursRecorded(hours: OpeningHours): boolean {
  return Object.keys(hours ?? {}).length > 0;
}

/**
 * The window to arrive in on `date` for `onSiteMinutes` of work, within the technician's day if given (minutes on
 * the same clock).
 */
export function openingWindow(
  hours: OpeningHours,
  date: string,
  onSiteMinutes: number,
  day: { start: number; end: number } = { start: 0, end: DAY },
): OpeningWindow {
  const onSite = requireNonNegative(onSiteMinutes, 'onSiteMinutes');
  if (hours === null || typeof hours !== 'object')
    throw new DomainError('missing-input', 'opening hours must be an object', 'openingHours');
  if (!isHoursRecorded(hours)) {
    parsePlainDate(date, 'date');
    return { hoursText: 'Hours not recorded', window: null, closedReason: null };
  }
  // Only what is open during the technician's day matters (yesterday's late opening that ended before it does not).
  const intervals = openIntervalsOn(hours, date).filter((i) => i.latest > Math.max(0, day.start) || i.earliest >= 0);
  if (intervals.length === 0) return { hoursText: 'Closed', window: null, closedReason: 'closed that day' };
  const hoursText = hoursInWords(intervals);

  const usable = intervals.map((i) => ({ earliest: i.earliest, latest: i.latest - onSite })).filter((w) => w.latest >= w.earliest);
  if (usable.length === 0) {
    const longest = Math.max(...intervals.map((i) => i.latest - i.earliest));
    return {
      hoursText,
      window: null,
      closedReason: `open too briefly (${hoursText}) for ${onSite} min on site: at most ${longest} min at a time`,
    };
  }
  // The widest stretch of arrival times inside the day; when none overlaps it, the one nearest to it.
  const overlap = (w: ArrivalWindow) => Math.min(w.latest, day.end - onSite) - Math.max(w.earliest, day.start);
  const distance = (w: ArrivalWindow) => Math.max(w.earliest - day.end, day.start - w.latest, 0);
  const chosen = [...usable].sort((a, b) => {
    const oa = overlap(a);
    const ob = overlap(b);
    if (oa >= 0 || ob >= 0) return ob - oa;
    return distance(a) - distance(b);
  })[0] as ArrivalWindow;
  return { hoursText, window: chosen, closedReason: null };
}
