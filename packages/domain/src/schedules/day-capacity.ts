import { DomainError } from '../errors.ts';
import { requireNonNegativeInteger, requirePositive } from '../input-checks.ts';
import { formatPlainDate, parsePlainDate } from '../plain-date.ts';

/**
 * Which day a new piece of work goes on: the first day from `from` whose booked time on site leaves room for it, so a
 * backlog of overdue work spreads over the coming days instead of piling onto one. A job longer than a whole day's
 * room goes on the first day with nothing booked; when no day within the horizon has room, on `from` (the route day
 * then lists what cannot be fitted, with the reason).
 */
export interface DayWithRoomInput {
  /** The earliest day, "YYYY-MM-DD". */
  from: string;
  needMinutes: number;
  /** Time on site a day can hold. */
  capacityMinutes: number;
  /** Minutes already booked on a day. */
  booked: (day: string) => number;
  /** How many days to look ahead (default 14). */
  horizonDays?: number;
}

export function firstDayWithRoom(input: DayWithRoomInput): string {
  const start = parsePlainDate(input.from, 'from');
  const need = requireNonNegativeInteger(input.needMinutes, 'needMinutes');
  const capacity = requirePositive(input.capacityMinutes, 'capacityMinutes');
  const horizon = requireNonNegativeInteger(input.horizonDays ?? 14, 'horizonDays');
  if (horizon > 366) throw new DomainError('out-of-range', 'must be at most 366', 'horizonDays');
  for (let offset = 0; offset <= horizon; offset++) {
    const day = formatPlainDate(start + offset);
    const booked = input.booked(day);
    if (booked + need <= capacity || (need > capacity && booked === 0)) return day;
  }
  return input.from;
}

/**
 * The time on site a technician's day can hold: their hours less a share for driving between venues. Our own
 * planning assumption (no published source): a third of a field day goes to the road.
 */
export const DRIVING_SHARE = 1 / 3;

export function onSiteCapacityMinutes(dayStart: string, dayEnd: string): number {
  const minutes = (hhmm: string, field: string) => {
    const m = /^([01]\d|2[0-3]):([0-5]\d)$/.exec(hhmm);
    if (!m) throw new DomainError('unparseable', `"${hhmm}" is not a time of day (HH:MM)`, field);
    return Number(m[1]) * 60 + Number(m[2]);
  };
  const length = minutes(dayEnd, 'dayEnd') - minutes(dayStart, 'dayStart');
  if (length <= 0) throw new DomainError('out-of-range', 'must be after the day starts', 'dayEnd');
  return Math.round(length * (1 - DRIVING_SHARE));
}
