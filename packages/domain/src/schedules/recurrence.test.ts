import fc from 'fast-check';
import { rrulestr } from 'rrule';
import { describe, expect, it } from 'vitest';
import { firstOccurrences, iterateOccurrences, nextOccurrence, occurrencesBetween } from './recurrence.ts';

const NY = 'America/New_York';

/** Local dates (YYYY-MM-DD) of the first `n` occurrences. */
function dates(rule: string, start: string, n: number, timeZone = NY): string[] {
  return firstOccurrences(rule, { start, timeZone }, n).map((o) => o.local.slice(0, 10));
}

/** The rrule package's answer, as floating local date-times "YYYY-MM-DDTHH:MM:SS". */
function reference(rule: string, start: string, n: number): string[] {
  const dtstart = start.replace(/[-:]/g, '').slice(0, 13) + '00';
  const set = rrulestr(`DTSTART:${dtstart}\nRRULE:${rule}`);
  return set.all((_, i) => i < n).map((d) => d.toISOString().slice(0, 19));
}

describe('RFC 5545 §3.8.5.3 examples (DTSTART;TZID=America/New_York; dates from the RFC, from memory)', () => {
  it('daily for 10 occurrences', () => {
    expect(dates('FREQ=DAILY;COUNT=10', '1997-09-02T09:00', 20)).toEqual(
      ['02', '03', '04', '05', '06', '07', '08', '09', '10', '11'].map((d) => `1997-09-${d}`),
    );
  });

  it('daily until December 24, 1997: 113 occurrences, 09:00 local across the October change to EST', () => {
    const all = firstOccurrences('FREQ=DAILY;UNTIL=19971224T000000Z', { start: '1997-09-02T09:00', timeZone: NY }, 500);
    expect(all).toHaveLength(29 + 31 + 30 + 23);
    expect(all.at(-1)?.local).toBe('1997-12-23T09:00:00');
    // EDT (UTC−4) until 26 Oct 1997, then EST (UTC−5): tz database.
    expect(all.find((o) => o.local.startsWith('1997-10-25'))?.at.toISOString()).toBe('1997-10-25T13:00:00.000Z');
    expect(all.find((o) => o.local.startsWith('1997-10-27'))?.at.toISOString()).toBe('1997-10-27T14:00:00.000Z');
  });

  it('every 10 days, 5 occurrences', () => {
    expect(dates('FREQ=DAILY;INTERVAL=10;COUNT=5', '1997-09-02T09:00', 10)).toEqual([
      '1997-09-02',
      '1997-09-12',
      '1997-09-22',
      '1997-10-02',
      '1997-10-12',
    ]);
  });

  it('every day in January, for 3 years (yearly by BYMONTH and BYDAY, and daily by BYMONTH)', () => {
    const yearly = dates('FREQ=YEARLY;UNTIL=20000131T140000Z;BYMONTH=1;BYDAY=SU,MO,TU,WE,TH,FR,SA', '1998-01-01T09:00', 200);
    const daily = dates('FREQ=DAILY;UNTIL=20000131T140000Z;BYMONTH=1', '1998-01-01T09:00', 200);
    expect(yearly).toHaveLength(93);
    expect(daily).toEqual(yearly);
    expect(yearly.at(-1)).toBe('2000-01-31');
  });

  it('weekly for 10 occurrences', () => {
    expect(dates('FREQ=WEEKLY;COUNT=10', '1997-09-02T09:00', 20)).toEqual([
      '1997-09-02',
      '1997-09-09',
      '1997-09-16',
      '1997-09-23',
      '1997-09-30',
      '1997-10-07',
      '1997-10-14',
      '1997-10-21',
      '1997-10-28',
      '1997-11-04',
    ]);
  });

  it('weekly on Tuesday and Thursday for five weeks', () => {
    expect(dates('FREQ=WEEKLY;UNTIL=19971007T000000Z;WKST=SU;BYDAY=TU,TH', '1997-09-02T09:00', 20)).toEqual([
      '1997-09-02',
      '1997-09-04',
      '1997-09-09',
      '1997-09-11',
      '1997-09-16',
      '1997-09-18',
      '1997-09-23',
      '1997-09-25',
      '1997-09-30',
      '1997-10-02',
    ]);
  });

  it('every other week on Monday, Wednesday and Friday until December 24, 1997', () => {
    const d = dates('FREQ=WEEKLY;INTERVAL=2;UNTIL=19971224T000000Z;WKST=SU;BYDAY=MO,WE,FR', '1997-09-01T09:00', 100);
    expect(d).toHaveLength(25);
    expect(d.slice(0, 7)).toEqual(['1997-09-01', '1997-09-03', '1997-09-05', '1997-09-15', '1997-09-17', '1997-09-19', '1997-09-29']);
    expect(d.slice(-4)).toEqual(['1997-12-08', '1997-12-10', '1997-12-12', '1997-12-22']);
  });

  it('every other week on Tuesday and Thursday, for 8 occurrences', () => {
    expect(dates('FREQ=WEEKLY;INTERVAL=2;COUNT=8;WKST=SU;BYDAY=TU,TH', '1997-09-02T09:00', 20)).toEqual([
      '1997-09-02',
      '1997-09-04',
      '1997-09-16',
      '1997-09-18',
      '1997-09-30',
      '1997-10-02',
      '1997-10-14',
      '1997-10-16',
    ]);
  });

  it('monthly on the first Friday for 10 occurrences', () => {
    expect(dates('FREQ=MONTHLY;COUNT=10;BYDAY=1FR', '1997-09-05T09:00', 20)).toEqual([
      '1997-09-05',
      '1997-10-03',
      '1997-11-07',
      '1997-12-05',
      '1998-01-02',
      '1998-02-06',
      '1998-03-06',
      '1998-04-03',
      '1998-05-01',
      '1998-06-05',
    ]);
  });

  it('every other month on the first and last Sunday, for 10 occurrences', () => {
    expect(dates('FREQ=MONTHLY;INTERVAL=2;COUNT=10;BYDAY=1SU,-1SU', '1997-09-07T09:00', 20)).toEqual([
      '1997-09-07',
      '1997-09-28',
      '1997-11-02',
      '1997-11-30',
      '1998-01-04',
      '1998-01-25',
      '1998-03-01',
      '1998-03-29',
      '1998-05-03',
      '1998-05-31',
    ]);
  });

  it('monthly on the second-to-last Monday for 6 months', () => {
    expect(dates('FREQ=MONTHLY;COUNT=6;BYDAY=-2MO', '1997-09-22T09:00', 20)).toEqual([
      '1997-09-22',
      '1997-10-20',
      '1997-11-17',
      '1997-12-22',
      '1998-01-19',
      '1998-02-16',
    ]);
  });

  it('monthly on the third-to-last day, forever', () => {
    expect(dates('FREQ=MONTHLY;BYMONTHDAY=-3', '1997-09-28T09:00', 6)).toEqual([
      '1997-09-28',
      '1997-10-29',
      '1997-11-28',
      '1997-12-29',
      '1998-01-29',
      '1998-02-26',
    ]);
  });

  it('monthly on the first and last day of the month for 10 occurrences', () => {
    expect(dates('FREQ=MONTHLY;COUNT=10;BYMONTHDAY=1,-1', '1997-09-30T09:00', 20)).toEqual([
      '1997-09-30',
      '1997-10-01',
      '1997-10-31',
      '1997-11-01',
      '1997-11-30',
      '1997-12-01',
      '1997-12-31',
      '1998-01-01',
      '1998-01-31',
      '1998-02-01',
    ]);
  });

  it('every 18 months on the 10th to 15th, for 10 occurrences', () => {
    expect(dates('FREQ=MONTHLY;INTERVAL=18;COUNT=10;BYMONTHDAY=10,11,12,13,14,15', '1997-09-10T09:00', 20)).toEqual([
      '1997-09-10',
      '1997-09-11',
      '1997-09-12',
      '1997-09-13',
      '1997-09-14',
      '1997-09-15',
      '1999-03-10',
      '1999-03-11',
      '1999-03-12',
      '1999-03-13',
    ]);
  });

  it('yearly in June and July for 10 occurrences', () => {
    expect(dates('FREQ=YEARLY;COUNT=10;BYMONTH=6,7', '1997-06-10T09:00', 20)).toEqual(
      ['1997', '1998', '1999', '2000', '2001'].flatMap((y) => [`${y}-06-10`, `${y}-07-10`]),
    );
  });

  it('every other year on January, February and March for 10 occurrences', () => {
    expect(dates('FREQ=YEARLY;INTERVAL=2;COUNT=10;BYMONTH=1,2,3', '1997-03-10T09:00', 20)).toEqual([
      '1997-03-10',
      '1999-01-10',
      '1999-02-10',
      '1999-03-10',
      '2001-01-10',
      '2001-02-10',
      '2001-03-10',
      '2003-01-10',
      '2003-02-10',
      '2003-03-10',
    ]);
  });

  it('every 20th Monday of the year', () => {
    expect(dates('FREQ=YEARLY;BYDAY=20MO', '1997-05-19T09:00', 3)).toEqual(['1997-05-19', '1998-05-18', '1999-05-17']);
  });

  it('every Thursday in March', () => {
    expect(dates('FREQ=YEARLY;BYMONTH=3;BYDAY=TH', '1997-03-13T09:00', 11)).toEqual([
      '1997-03-13',
      '1997-03-20',
      '1997-03-27',
      '1998-03-05',
      '1998-03-12',
      '1998-03-19',
      '1998-03-26',
      '1999-03-04',
      '1999-03-11',
      '1999-03-18',
      '1999-03-25',
    ]);
  });

  it('every Friday the 13th (the RFC excludes DTSTART with EXDATE; here it simply does not match)', () => {
    expect(dates('FREQ=MONTHLY;BYDAY=FR;BYMONTHDAY=13', '1997-09-02T09:00', 5)).toEqual([
      '1998-02-13',
      '1998-03-13',
      '1998-11-13',
      '1999-08-13',
      '2000-10-13',
    ]);
  });

  it('the first Saturday after the first Sunday of the month', () => {
    expect(dates('FREQ=MONTHLY;BYDAY=SA;BYMONTHDAY=7,8,9,10,11,12,13', '1997-09-13T09:00', 6)).toEqual([
      '1997-09-13',
      '1997-10-11',
      '1997-11-08',
      '1997-12-13',
      '1998-01-10',
      '1998-02-07',
    ]);
  });

  it('every four years, the first Tuesday after a Monday in November', () => {
    expect(dates('FREQ=YEARLY;INTERVAL=4;BYMONTH=11;BYDAY=TU;BYMONTHDAY=2,3,4,5,6,7,8', '1996-11-05T09:00', 3)).toEqual([
      '1996-11-05',
      '2000-11-07',
      '2004-11-02',
    ]);
  });

  it('WKST changes which days an every-other-week rule picks', () => {
    expect(dates('FREQ=WEEKLY;INTERVAL=2;COUNT=4;BYDAY=TU,SU;WKST=MO', '1997-08-05T09:00', 10)).toEqual([
      '1997-08-05',
      '1997-08-10',
      '1997-08-19',
      '1997-08-24',
    ]);
    expect(dates('FREQ=WEEKLY;INTERVAL=2;COUNT=4;BYDAY=TU,SU;WKST=SU', '1997-08-05T09:00', 10)).toEqual([
      '1997-08-05',
      '1997-08-17',
      '1997-08-19',
      '1997-08-31',
    ]);
  });

  it('an invalid date (30 February) is skipped, not moved', () => {
    expect(dates('FREQ=MONTHLY;BYMONTHDAY=15,30;COUNT=5', '2007-01-15T09:00', 10)).toEqual([
      '2007-01-15',
      '2007-01-30',
      '2007-02-15',
      '2007-03-15',
      '2007-03-30',
    ]);
  });
});

describe('month ends (RFC 5545 §3.3.10: a date that does not exist, such as 31 April, is ignored, not moved)', () => {
  it('a monthly rule starting on the 31st skips months without a 31st', () => {
    expect(dates('FREQ=MONTHLY', '2024-01-31T09:00', 7, 'Europe/Berlin')).toEqual([
      '2024-01-31',
      '2024-03-31',
      '2024-05-31',
      '2024-07-31',
      '2024-08-31',
      '2024-10-31',
      '2024-12-31',
    ]);
  });

  it('BYMONTHDAY=-1 is the last day of every month, 29 February in a leap year', () => {
    expect(dates('FREQ=MONTHLY;BYMONTHDAY=-1', '2024-01-31T09:00', 4, 'Europe/Berlin')).toEqual([
      '2024-01-31',
      '2024-02-29',
      '2024-03-31',
      '2024-04-30',
    ]);
  });

  it('a yearly rule from 29 February occurs only in leap years', () => {
    expect(dates('FREQ=YEARLY', '2024-02-29T09:00', 3, 'Europe/Berlin')).toEqual(['2024-02-29', '2028-02-29', '2032-02-29']);
  });
});

describe('daylight saving (tz database offsets: Berlin CET +1/CEST +2, New York EST −5/EDT −4)', () => {
  it('09:00 daily stays 09:00 on the clock: 08:00Z before the March change in Berlin, 07:00Z after', () => {
    const o = firstOccurrences('FREQ=DAILY;COUNT=3', { start: '2024-03-30T09:00', timeZone: 'Europe/Berlin' }, 3);
    expect(o.map((x) => x.at.toISOString())).toEqual(['2024-03-30T08:00:00.000Z', '2024-03-31T07:00:00.000Z', '2024-04-01T07:00:00.000Z']);
    expect(o.map((x) => x.local.slice(11, 16))).toEqual(['09:00', '09:00', '09:00']);
  });

  it('and across the November change in New York: 13:00Z, then 14:00Z', () => {
    const o = firstOccurrences('FREQ=WEEKLY;COUNT=2', { start: '2024-10-28T09:00', timeZone: NY }, 2);
    expect(o.map((x) => x.at.toISOString())).toEqual(['2024-10-28T13:00:00.000Z', '2024-11-04T14:00:00.000Z']);
  });

  it('a time the spring change skips uses the offset before the gap (RFC 5545 §3.3.5): 02:30 → 03:30 CEST', () => {
    const o = firstOccurrences('FREQ=DAILY;COUNT=3', { start: '2024-03-30T02:30', timeZone: 'Europe/Berlin' }, 3);
    expect(o[1]?.at.toISOString()).toBe('2024-03-31T01:30:00.000Z');
    expect(o[1]?.local).toBe('2024-03-31T03:30:00');
    expect(o[2]?.local).toBe('2024-04-01T02:30:00');
  });

  it('a time the autumn change repeats means its first occurrence (RFC 5545 §3.3.5)', () => {
    const o = firstOccurrences('FREQ=DAILY;COUNT=2', { start: '2024-10-26T02:30', timeZone: 'Europe/Berlin' }, 2);
    expect(o[1]?.at.toISOString()).toBe('2024-10-27T00:30:00.000Z'); // 02:30 CEST, not 02:30 CET (01:30Z)
  });
});

describe('agreement with the rrule package (reference implementation)', () => {
  const weekday = fc.constantFrom('MO', 'TU', 'WE', 'TH', 'FR', 'SA', 'SU');
  const ruleArb = fc
    .record({
      freq: fc.constantFrom('DAILY', 'WEEKLY', 'MONTHLY', 'YEARLY'),
      interval: fc.integer({ min: 1, max: 4 }),
      byDay: fc.uniqueArray(weekday, { maxLength: 3 }),
      ordinal: fc.option(fc.constantFrom(1, 2, 3, -1, -2), { nil: undefined }),
      byMonthDay: fc.uniqueArray(fc.constantFrom(1, 2, 10, 15, 28, 29, 30, 31, -1, -2, -10), { maxLength: 3 }),
      byMonth: fc.uniqueArray(fc.integer({ min: 1, max: 12 }), { maxLength: 3 }),
      count: fc.integer({ min: 1, max: 25 }),
      wkst: weekday,
    })
    .map((r) => {
      const parts = [`FREQ=${r.freq}`, `INTERVAL=${r.interval}`, `COUNT=${r.count}`, `WKST=${r.wkst}`];
      const ordinalAllowed = r.freq === 'MONTHLY' || r.freq === 'YEARLY';
      if (r.byDay.length > 0) {
        const prefix = ordinalAllowed && r.ordinal !== undefined ? String(r.ordinal) : '';
        parts.push(`BYDAY=${r.byDay.map((d) => prefix + d).join(',')}`);
      }
      // Keep to combinations that occur at least yearly, so both implementations finish quickly.
      const safeDays = r.byMonth.length > 0 ? r.byMonthDay.filter((d) => Math.abs(d) <= 28) : r.byMonthDay;
      if (r.freq !== 'WEEKLY' && safeDays.length > 0) parts.push(`BYMONTHDAY=${safeDays.join(',')}`);
      if (r.byMonth.length > 0) parts.push(`BYMONTH=${r.byMonth.join(',')}`);
      return parts.join(';');
    });
  // Start times avoid 02:00–03:00, the hour Berlin skips or repeats, where the clock time itself differs.
  const startArb = fc
    .record({
      day: fc.integer({ min: 0, max: 365 * 30 }),
      hour: fc.constantFrom(0, 1, 4, 9, 13, 23),
      minute: fc.constantFrom(0, 15, 59),
    })
    .map(({ day, hour, minute }) => {
      const date = new Date(Date.UTC(2000, 0, 1) + day * 86_400_000).toISOString().slice(0, 10);
      return `${date}T${String(hour).padStart(2, '0')}:${String(minute).padStart(2, '0')}`;
    });

  it('gives the same local date-times for random rules (property)', () => {
    fc.assert(
      fc.property(ruleArb, startArb, (rule, start) => {
        const ours = firstOccurrences(rule, { start, timeZone: 'Europe/Berlin' }, 30).map((o) => o.local);
        expect(ours).toEqual(reference(rule, start, 30));
      }),
      { numRuns: 150 },
    );
  }, 60_000);

  it('jumping ahead to a later date gives what walking from the start gives (property)', () => {
    fc.assert(
      fc.property(ruleArb, startArb, fc.integer({ min: 0, max: 365 * 5 }), (ruleWithCount, start, offsetDays) => {
        const rule = ruleWithCount.replace(/;COUNT=\d+/, '');
        const s = { start, timeZone: 'Europe/Berlin' };
        const after = new Date(Date.parse(`${start}:00Z`) + offsetDays * 86_400_000 + 3_600_000);
        let walked = null;
        for (const o of iterateOccurrences(rule, s)) {
          if (o.at.getTime() > after.getTime()) {
            walked = o;
            break;
          }
          if (o.at.getFullYear() > after.getFullYear() + 450) break;
        }
        expect(nextOccurrence(rule, s, after)).toEqual(walked);
      }),
      { numRuns: 200 },
    );
  }, 60_000);
});

describe('the end of the calendar (RFC 5545 §3.3.4 DATE: date-fullyear = 4DIGIT, so 9999-12-31 is the last date)', () => {
  it('a yearly rule starting in 9998 occurs in 9998 and 9999 only, as the rrule package gives', () => {
    const got = dates('FREQ=YEARLY', '9998-06-01T09:00', 5, 'UTC');
    expect(got).toEqual(['9998-06-01', '9999-06-01']);
    expect(reference('FREQ=YEARLY', '9998-06-01T09:00', 5).map((d) => d.slice(0, 10))).toEqual(got);
  });

  it('a daily rule stops on 9999-12-31 local, though in New York that evening is already 10000 in UTC', () => {
    expect(dates('FREQ=DAILY', '9999-12-30T23:30', 5, NY)).toEqual(['9999-12-30', '9999-12-31']);
    expect(nextOccurrence('FREQ=DAILY', { start: '9999-12-30T09:00', timeZone: 'UTC' }, new Date(Date.UTC(9999, 11, 31, 12)))).toBeNull();
  });
});

describe('ranges and bad input', () => {
  const start = { start: '2024-01-01T09:00', timeZone: 'Europe/Berlin' };

  it('occurrencesBetween is half-open: from ≤ at < to', () => {
    const from = new Date('2024-01-03T08:00:00Z'); // exactly 09:00 Berlin
    const got = occurrencesBetween('FREQ=DAILY', start, from, new Date('2024-01-05T08:00:00Z'));
    expect(got.map((o) => o.local.slice(0, 10))).toEqual(['2024-01-03', '2024-01-04']);
    expect(() => occurrencesBetween('FREQ=DAILY', start, new Date('2024-02-01'), new Date('2024-01-01'))).toThrow(
      expect.objectContaining({ code: 'inverted-period' }),
    );
  });

  it('returns null once a rule has ended, and gives up on rules that can never occur', () => {
    expect(nextOccurrence('FREQ=DAILY;COUNT=2', start, new Date('2024-06-01T00:00:00Z'))).toBeNull();
    expect(firstOccurrences('FREQ=YEARLY;BYMONTH=2;BYMONTHDAY=30', start, 1)).toEqual([]);
  });

  it.each([
    ['FREQ=DAILY;COUNT=3;UNTIL=20250101T000000Z', 'invalid-rule'],
    ['FREQ=MONTHLY;BYWEEKNO=1', 'unsupported-rule-part'],
    ['FREQ=HOURLY', 'unsupported-rule-part'],
    ['FREQ=WEEKLY;BYDAY=1MO', 'invalid-rule'],
    ['FREQ=WEEKLY;BYMONTHDAY=1', 'invalid-rule'],
    ['FREQ=MONTHLY;BYMONTHDAY=32', 'invalid-rule'],
    ['FREQ=MONTHLY;BYMONTHDAY=0', 'invalid-rule'],
    ['FREQ=DAILY;INTERVAL=0', 'invalid-rule'],
    ['INTERVAL=2', 'invalid-rule'],
    ['FREQ=DAILY;FREQ=WEEKLY', 'invalid-rule'],
    ['FREQ=DAILY;COLOUR=RED', 'invalid-rule'],
    ['', 'invalid-rule'],
  ])('%j → %s', (rule, code) => {
    expect(() => firstOccurrences(rule, start, 1)).toThrow(expect.objectContaining({ code }));
  });

  it('refuses an unknown zone and an impossible start', () => {
    expect(() => firstOccurrences('FREQ=DAILY', { start: '2024-01-01T09:00', timeZone: 'Mars/Olympus' }, 1)).toThrow(
      expect.objectContaining({ code: 'unknown-time-zone' }),
    );
    expect(() => firstOccurrences('FREQ=DAILY', { start: '2024-02-30T09:00', timeZone: 'UTC' }, 1)).toThrow(
      expect.objectContaining({ code: 'invalid-date' }),
    );
  });
});
