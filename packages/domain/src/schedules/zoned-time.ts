import { DomainError } from '../errors.ts';
import { describe } from '../input-checks.ts';

/**
 * Wall-clock time in an IANA time zone, through the platform's Intl (the tz database), with the rules of RFC 5545
 * §3.3.5 for the hours a daylight-saving change skips or repeats:
 *   - a local time that does not exist (spring forward) "is interpreted using the UTC offset before the gap";
 *   - a local time that occurs twice (fall back) "refers to the first occurrence".
 */

export interface WallTime {
  year: number;
  month: number;
  day: number;
  hour: number;
  minute: number;
  second: number;
}

const formatters = new Map<string, Intl.DateTimeFormat>();

function formatter(timeZone: string): Intl.DateTimeFormat {
  let f = formatters.get(timeZone);
  if (!f) {
    f = new Intl.DateTimeFormat('en-US', {
      timeZone,
      hourCycle: 'h23',
      year: 'numeric',
      month: 'numeric',
      day: 'numeric',
      hour: 'numeric',
      minute: 'numeric',
      second: 'numeric',
    });
    formatters.set(timeZone, f);
  }
  return f;
}

export function requireTimeZone(timeZone: string, field = 'timeZone'): string {
  if (typeof timeZone !== 'string' || timeZone.trim() === '') {
    throw new DomainError('unknown-time-zone', `a time zone is needed, such as Europe/Berlin (got ${describe(timeZone)})`, field);
  }
  try {
    formatter(timeZone);
  } catch {
    throw new DomainError('unknown-time-zone', `"${timeZone}" is not an IANA time zone`, field);
  }
  return timeZone;
}

const MS_PER_DAY = 86_400_000;

export function wallTimeAt(instant: number, timeZone: string): WallTime {
  const parts: Record<string, number> = {};
  for (const part of formatter(requireTimeZone(timeZone)).formatToParts(new Date(instant))) {
    if (part.type !== 'literal') parts[part.type] = Number(part.value);
  }
  return {
    year: parts.year ?? 0,
    month: parts.month ?? 0,
    day: parts.day ?? 0,
    hour: parts.hour ?? 0,
    minute: parts.minute ?? 0,
    second: parts.second ?? 0,
  };
}

/** The wall time's fields read as if they were UTC: a plain number to do local arithmetic on. */
export function wallAsUtc(wall: WallTime): number {
  return Date.UTC(wall.year, wall.month - 1, wall.day, wall.hour, wall.minute, wall.second);
}

/** Local time minus UTC at that instant, in milliseconds (+3,600,000 for CET). */
export function offsetAt(instant: number, timeZone: string): number {
  const whole = Math.floor(instant / 1000) * 1000;
  return wallAsUtc(wallTimeAt(whole, timeZone)) - whole;
}

/** The instant a wall time in a zone names, with RFC 5545's rules for skipped and repeated hours. */
export function instantOf(wall: WallTime, timeZone: string): number {
  requireTimeZone(timeZone);
  const local = wallAsUtc(wall);
  // Zones change offset at most once in any two days, so the offsets a day either side bracket the answer.
  const before = offsetAt(local - MS_PER_DAY, timeZone);
  const after = offsetAt(local + MS_PER_DAY, timeZone);
  const candidates = [local - before, local - after].filter((t) => offsetAt(t, timeZone) === local - t);
  if (candidates.length > 0) return Math.min(...candidates); // repeated hour: the first occurrence
  return local - before; // skipped hour: the offset before the gap
}

/** Strict "YYYY-MM-DDTHH:MM" or "YYYY-MM-DDTHH:MM:SS", no offset: a wall time, not an instant. */
export function parseWallTime(text: string, field = 'start'): WallTime {
  const m = typeof text === 'string' ? /^(\d{4})-(\d{2})-(\d{2})[T ](\d{2}):(\d{2})(?::(\d{2}))?$/.exec(text.trim()) : null;
  if (!m) {
    throw new DomainError('invalid-date', `${describe(text)} is not a local date and time such as 2024-01-31T09:00`, field);
  }
  const wall: WallTime = {
    year: Number(m[1]),
    month: Number(m[2]),
    day: Number(m[3]),
    hour: Number(m[4]),
    minute: Number(m[5]),
    second: Number(m[6] ?? 0),
  };
  const check = new Date(wallAsUtc(wall));
  if (check.getUTCDate() !== wall.day || check.getUTCMonth() !== wall.month - 1 || wall.hour > 23 || wall.minute > 59 || wall.second > 59) {
    throw new DomainError('invalid-date', `${text} is not a real date and time`, field);
  }
  return wall;
}

export function formatWallTime(wall: WallTime): string {
  const p = (n: number, w = 2) => String(n).padStart(w, '0');
  return `${p(wall.year, 4)}-${p(wall.month)}-${p(wall.day)}T${p(wall.hour)}:${p(wall.minute)}:${p(wall.second)}`;
}
