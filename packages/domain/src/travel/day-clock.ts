import { dateParts, parsePlainDate } from '../plain-date.ts';
import { instantOf } from '../schedules/zoned-time.ts';
import { clock } from './route-day.ts';

/**
 * The planner's clock is minutes after local midnight of the route day, on the wall clock (a day that changes to
 * or from daylight saving still reads 09:00 at 540). These turn it into what people and phones need.
 */

/** The instant (ms since the epoch) of `minutes` on `day`'s wall clock in `timeZone`; past 24:00 runs into the next day. */
export function dayClockInstant(day: string, minutes: number, timeZone: string): number {
  const whole = Math.round(minutes);
  const epochDay = parsePlainDate(day, 'day') + Math.floor(whole / 1440);
  const { year, month, day: dayOfMonth } = dateParts(epochDay);
  const inDay = ((whole % 1440) + 1440) % 1440;
  return instantOf({ year, month, day: dayOfMonth, hour: Math.floor(inDay / 60), minute: inDay % 60, second: 0 }, timeZone);
}

/** The wall time as people read it, "HH:MM" (a time past midnight reads as the next day's, 00:30). */
export function dayClockText(minutes: number): string {
  const whole = Math.round(minutes);
  return clock(((whole % 1440) + 1440) % 1440);
}
