import { describe, expect, it } from 'vitest';
import { dayClockInstant, dayClockText } from './day-clock.ts';

describe('dayClockInstant', () => {
  it('09:00 on 2026-12-03 in Chicago (CST, UTC−6 in December) is 15:00Z', () => {
    expect(new Date(dayClockInstant('2026-12-03', 540, 'America/Chicago')).toISOString()).toBe('2026-12-03T15:00:00.000Z');
  });

  it('past midnight runs into the next day: 25:30 is 01:30 the next morning', () => {
    expect(new Date(dayClockInstant('2026-12-03', 25 * 60 + 30, 'UTC')).toISOString()).toBe('2026-12-04T01:30:00.000Z');
    expect(dayClockText(25 * 60 + 30)).toBe('01:30');
  });

  it('on the day clocks change the wall clock still reads 09:00 at 540 (US DST began 2026-03-08; CDT is UTC−5)', () => {
    expect(new Date(dayClockInstant('2026-03-08', 540, 'America/Chicago')).toISOString()).toBe('2026-03-08T14:00:00.000Z');
  });
});
