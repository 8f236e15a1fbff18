import { describe, expect, it } from 'vitest';
import { openIntervalsOn, openingWindow, type OpeningHours } from './opening-window.ts';

// 2026-12-03 is a Thursday (ISO weekday 4), 2026-12-04 a Friday (5), 2026-12-07 a Monday (1): worked by hand from
// the calendar, ISO 8601 weekday numbering.
const THURSDAY = '2026-12-03';
const FRIDAY = '2026-12-04';
const MONDAY = '2026-12-07';
const day = { start: 8 * 60, end: 17 * 60 };

describe('openingWindow', () => {
  it('one interval: arrive from opening until closing less the time on site (11:00–23:00, 45 min → 660..1335)', () => {
    const hours: OpeningHours = { '4': [{ open: '11:00', close: '23:00' }] };
    expect(openingWindow(hours, THURSDAY, 45, day)).toEqual({
      hoursText: '11:00–23:00',
      window: { earliest: 660, latest: 23 * 60 - 45 },
      closedReason: null,
    });
  });

  it('hours not recorded ({}) mean open all day: no window', () => {
    expect(openingWindow({}, THURSDAY, 45, day)).toEqual({ hoursText: 'Hours not recorded', window: null, closedReason: null });
  });

  it('a weekday without hours, when others are recorded, is closed that day', () => {
    const hours: OpeningHours = { '4': [{ open: '11:00', close: '23:00' }] };
    expect(openingWindow(hours, MONDAY, 30, day)).toEqual({ hoursText: 'Closed', window: null, closedReason: 'closed that day' });
  });

  it('open too briefly for the time on site: says so with the longest stretch', () => {
    const hours: OpeningHours = { '4': [{ open: '12:00', close: '12:30' }] };
    const result = openingWindow(hours, THURSDAY, 45, day);
    expect(result.window).toBeNull();
    expect(result.closedReason).toBe('open too briefly (12:00–12:30) for 45 min on site: at most 30 min at a time');
  });

  it('a close before the open runs past midnight (18:00–02:00 → latest arrival 01:00 next day = 1500)', () => {
    const hours: OpeningHours = { '4': [{ open: '18:00', close: '02:00' }] };
    expect(openingWindow(hours, THURSDAY, 60, { start: 0, end: 48 * 60 }).window).toEqual({ earliest: 1080, latest: 1500 });
  });

  it("yesterday's late opening counts for the early hours of today", () => {
    // Thursday 18:00–03:00 covers Friday 00:00–03:00 on Friday's clock as -360..180.
    const hours: OpeningHours = { '4': [{ open: '18:00', close: '03:00' }] };
    expect(openIntervalsOn(hours, FRIDAY)).toEqual([{ earliest: -360, latest: 180 }]);
    const early = openingWindow(hours, FRIDAY, 30, { start: 0, end: 24 * 60 });
    expect(early).toEqual({ hoursText: 'until 03:00', window: { earliest: -360, latest: 150 }, closedReason: null });
    // A technician whose day starts at 08:00 cannot use it: Friday is closed for them.
    expect(openingWindow(hours, FRIDAY, 30, day).closedReason).toBe('closed that day');
  });

  it('several intervals: the widest stretch of arrivals inside the day is chosen', () => {
    // Lunch 11:00–14:00 gives arrivals 11:00–13:00 (120 min) inside 08:00–17:00; the evening 16:00–23:00 only
    // 16:00–16:00 (0 min, since the day's work must end by 17:00). Lunch wins.
    const hours: OpeningHours = {
      '4': [
        { open: '11:00', close: '14:00' },
        { open: '16:00', close: '23:00' },
      ],
    };
    const result = openingWindow(hours, THURSDAY, 60, day);
    expect(result.hoursText).toBe('11:00–14:00, 16:00–23:00');
    expect(result.window).toEqual({ earliest: 660, latest: 780 });
    // For an evening technician (14:00–23:00) the evening opening is the wider one.
    expect(openingWindow(hours, THURSDAY, 60, { start: 14 * 60, end: 23 * 60 }).window).toEqual({ earliest: 960, latest: 1320 });
  });

  it('00:00–00:00 is open round the clock and 24:00 closes at midnight', () => {
    expect(openingWindow({ '4': [{ open: '00:00', close: '00:00' }] }, THURSDAY, 30, day).window).toEqual({ earliest: 0, latest: 1410 });
    expect(openingWindow({ '4': [{ open: '10:00', close: '24:00' }] }, THURSDAY, 30, day).window).toEqual({ earliest: 600, latest: 1410 });
  });

  it('refuses a malformed time, naming the field', () => {
    expect(() => openingWindow({ '4': [{ open: '9am', close: '17:00' }] }, THURSDAY, 30, day)).toThrow(/openingHours\.4\[0\]\.open/);
    expect(() => openingWindow({}, '2026-13-01', 30, day)).toThrow();
  });
});
