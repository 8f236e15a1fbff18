// Time as people say it ("45 min", "1 h 30", "1:30", "1.5 h", "2 hours") read into whole minutes, the unit the
// API stores. No outside standard covers the spoken forms: these are common practice on job sheets. A bare number is
// minutes, because that is how time on site is usually jotted down ("45").
import { DomainError } from './errors.ts';

const HOURS = '(?:h|hr|hrs|hour|hours)';
const MINUTES = '(?:m|min|mins|minute|minutes)';
const NUMBER = '(\\d+(?:[.,]\\d+)?)';

const forms: { pattern: RegExp; minutes: (m: RegExpMatchArray) => number }[] = [
  { pattern: new RegExp(`^${NUMBER}\\s*${MINUTES}?$`), minutes: (m) => num(m[1]!) },
  { pattern: new RegExp(`^${NUMBER}\\s*${HOURS}$`), minutes: (m) => num(m[1]!) * 60 },
  { pattern: new RegExp(`^(\\d+)\\s*${HOURS}\\s*(\\d+)\\s*${MINUTES}?$`), minutes: (m) => num(m[1]!) * 60 + num(m[2]!) },
  { pattern: /^(\d+):([0-5]\d)$/, minutes: (m) => num(m[1]!) * 60 + num(m[2]!) },
];

function num(text: string): number {
  // "1,5 h": a decimal comma (a duration never has a thousands separator this small).
  return Number(text.replace(',', '.'));
}

/** Whole minutes from a spoken duration; throws DomainError (`field`) with words to fix it. */
export function parseSpokenMinutes(text: string, field = 'time', maxMinutes = 24 * 60): number {
  const t = text.trim().toLowerCase().replace(/\s+/g, ' ');
  if (t === '') throw new DomainError('missing-input', 'is required: say how long, e.g. "45 min" or "1 h 30"', field);
  for (const form of forms) {
    const m = t.match(form.pattern);
    if (!m) continue;
    const minutes = Math.round(form.minutes(m));
    if (minutes > maxMinutes) throw new DomainError('out-of-range', `must be at most ${formatSpokenMinutes(maxMinutes)}`, field);
    return minutes;
  }
  throw new DomainError('unparseable', `"${text.trim()}" is not a time: write it like "45 min", "1 h 30" or "1:30"`, field);
}

/** Minutes the way the screens show them: "45 min", "1 h", "1 h 30". */
export function formatSpokenMinutes(minutes: number): string {
  const h = Math.floor(minutes / 60);
  const m = minutes % 60;
  if (h === 0) return `${m} min`;
  return m === 0 ? `${h} h` : `${h} h ${m}`;
}
