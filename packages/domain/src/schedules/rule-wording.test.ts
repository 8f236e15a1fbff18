import fc from 'fast-check';
import { rrulestr } from 'rrule';
import { describe, expect, it } from 'vitest';
import { firstOccurrences } from './recurrence.ts';
import { WEEKDAYS } from './recurrence-rule.ts';
import {
  choicesFromRule,
  defaultChoices,
  describeRule,
  ruleFromChoices,
  ruleOccurs,
  upcomingOccurrences,
  type RuleChoices,
} from './rule-wording.ts';

const START = '2026-01-06T09:00';
const choose = (patch: Partial<RuleChoices>): RuleChoices => ({ ...defaultChoices(START), ...patch });

/** Local dates of our expansion, in UTC so they compare with the rrule package's floating times. */
function ours(rule: string, start: string, n: number): string[] {
  return firstOccurrences(rule, { start, timeZone: 'UTC' }, n).map((o) => o.local.slice(0, 19));
}

/** The rrule package's answer (the reference implementation of RFC 5545 §3.3.10 the design names). */
function reference(rule: string, start: string, n: number): string[] {
  const dtstart = start.replace(/[-:]/g, '').slice(0, 13) + '00';
  return rrulestr(`DTSTART:${dtstart}\nRRULE:${rule}`)
    .all((_, i) => i < n)
    .map((d) => d.toISOString().slice(0, 19));
}

describe('choices → RRULE', () => {
  it('writes "the last Tuesday" with BYSETPOS=-1 and "the third weekday" with the five workdays and BYSETPOS=3', () => {
    expect(ruleFromChoices(choose({ every: 'month', monthlyBy: 'position', position: -1, positionDay: 'TU' }))).toBe(
      'FREQ=MONTHLY;BYDAY=TU;BYSETPOS=-1',
    );
    expect(ruleFromChoices(choose({ every: 'month', monthlyBy: 'position', position: 3, positionDay: 'weekday' }))).toBe(
      'FREQ=MONTHLY;BYDAY=MO,TU,WE,TH,FR;BYSETPOS=3',
    );
    expect(ruleFromChoices(choose({ every: 'week', interval: 2, weekdays: ['TH', 'MO'], end: 'after', times: 6 }))).toBe(
      'FREQ=WEEKLY;INTERVAL=2;BYDAY=MO,TH;COUNT=6',
    );
    expect(
      ruleFromChoices(choose({ every: 'year', month: 3, monthlyBy: 'day-of-month', monthDay: 14, end: 'until', until: '2030-12-31' })),
    ).toBe('FREQ=YEARLY;BYMONTH=3;BYMONTHDAY=14;UNTIL=20301231');
  });

  it('refuses a week with no weekday chosen, naming the choice', () => {
    expect(() => ruleFromChoices(choose({ every: 'week', weekdays: [] }))).toThrow(expect.objectContaining({ field: 'weekdays' }));
  });
});

describe('plain words', () => {
  it.each([
    ['FREQ=MONTHLY;BYDAY=TU;BYSETPOS=-1', 'Every month on the last Tuesday at 9:00'],
    ['FREQ=MONTHLY;BYDAY=MO,TU,WE,TH,FR;BYSETPOS=3', 'Every month on the third weekday at 9:00'],
    ['FREQ=MONTHLY;INTERVAL=3;BYMONTHDAY=-1', 'Every 3 months on the last day at 9:00'],
    ['FREQ=WEEKLY;INTERVAL=2;BYDAY=MO,TH;COUNT=6', 'Every 2 weeks on Monday and Thursday at 9:00, 6 times'],
    ['FREQ=DAILY;INTERVAL=10', 'Every 10 days at 9:00'],
    ['FREQ=YEARLY;BYMONTH=3;BYMONTHDAY=14;UNTIL=20301231', 'Every year on 14 March at 9:00, until 31 December 2030'],
    ['FREQ=YEARLY;BYMONTH=11;BYDAY=TH;BYSETPOS=4', 'Every year on the fourth Thursday of November at 9:00'],
    // A monthly rule without a day takes the start's (RFC 5545 §3.3.10): the 6th.
    ['FREQ=MONTHLY', 'Every month on day 6 at 9:00'],
    ['FREQ=MONTHLY;BYMONTHDAY=1,15', 'On a custom schedule at 9:00'],
  ])('%s reads "%s"', (rule, words) => {
    expect(describeRule(rule, START)).toBe(words);
  });
});

describe('expansion against the rrule package (RFC 5545 §3.3.10; BYSETPOS examples of §3.8.5.3)', () => {
  it('the last work day of the month (§3.8.5.3: BYDAY=MO,TU,WE,TH,FR;BYSETPOS=-1)', () => {
    const rule = 'FREQ=MONTHLY;BYDAY=MO,TU,WE,TH,FR;BYSETPOS=-1';
    const got = ours(rule, '1997-09-29T09:00', 7);
    expect(got.map((d) => d.slice(0, 10))).toEqual([
      '1997-09-30',
      '1997-10-31',
      '1997-11-28',
      '1997-12-31',
      '1998-01-30',
      '1998-02-27',
      '1998-03-31',
    ]);
    expect(got).toEqual(reference(rule, '1997-09-29T09:00', 7));
  });

  it('the third instance of Tuesday, Wednesday or Thursday, 3 times (§3.8.5.3)', () => {
    const rule = 'FREQ=MONTHLY;COUNT=3;BYDAY=TU,WE,TH;BYSETPOS=3';
    expect(ours(rule, '1997-09-04T09:00', 10).map((d) => d.slice(0, 10))).toEqual(['1997-09-04', '1997-10-07', '1997-11-06']);
    expect(ours(rule, '1997-09-04T09:00', 10)).toEqual(reference(rule, '1997-09-04T09:00', 10));
  });

  it('every choice the editor can make expands as the rrule package does', () => {
    const weekday = fc.constantFrom(...WEEKDAYS);
    const choices = fc.record({
      every: fc.constantFrom('day', 'week', 'month', 'year'),
      interval: fc.integer({ min: 1, max: 4 }),
      weekdays: fc.uniqueArray(weekday, { minLength: 1, maxLength: 4 }),
      monthlyBy: fc.constantFrom('day-of-month', 'position'),
      monthDay: fc.constantFrom(1, 5, 15, 28, 29, 30, 31, -1),
      position: fc.constantFrom(1, 2, 3, 4, -1),
      positionDay: fc.constantFrom(...WEEKDAYS, 'weekday', 'day'),
      month: fc.integer({ min: 1, max: 12 }),
      end: fc.constantFrom('never', 'after'),
      times: fc.integer({ min: 1, max: 12 }),
      until: fc.constant('2035-01-01'),
    }) as fc.Arbitrary<RuleChoices>;
    const start = fc
      .record({ day: fc.integer({ min: 0, max: 3650 }), hour: fc.constantFrom(7, 9, 13) })
      .map(
        ({ day, hour }) =>
          `${new Date(Date.UTC(2020, 0, 1) + day * 86_400_000).toISOString().slice(0, 10)}T${String(hour).padStart(2, '0')}:00`,
      );
    let checked = 0;
    fc.assert(
      fc.property(choices, start, (c, s) => {
        const rule = ruleFromChoices(c);
        expect(ours(rule, s, 12)).toEqual(reference(rule, s, 12));
        // What the editor writes it reads back the same.
        expect(ruleFromChoices(choicesFromRule(rule, s)!)).toBe(rule);
        checked++;
      }),
      { numRuns: 150 },
    );
    expect(checked).toBe(150);
  });
});

describe('rules that never fall on a date', () => {
  it('the 31st of February, yearly, never occurs; the 29th does (in leap years)', () => {
    const start = { start: '2026-01-06T09:00', timeZone: 'America/Chicago' };
    expect(ruleOccurs('FREQ=YEARLY;BYMONTH=2;BYMONTHDAY=31', start)).toBe(false);
    expect(ruleOccurs('FREQ=YEARLY;BYMONTH=2;BYMONTHDAY=29', start)).toBe(true);
  });

  it('an end before the start never occurs', () => {
    expect(ruleOccurs('FREQ=MONTHLY;BYMONTHDAY=6;UNTIL=20251231', { start: START, timeZone: 'UTC' })).toBe(false);
  });
});

describe('the next dates the editor shows', () => {
  it('gives the next five last-Tuesdays from a moment, at 9:00 Chicago time', () => {
    const next = upcomingOccurrences(
      'FREQ=MONTHLY;BYDAY=TU;BYSETPOS=-1',
      { start: '2026-01-27T09:00', timeZone: 'America/Chicago' },
      new Date('2026-12-03T12:00:00Z'),
      5,
    );
    expect(next.map((o) => o.local)).toEqual([
      '2026-12-29T09:00:00',
      '2027-01-26T09:00:00',
      '2027-02-23T09:00:00',
      '2027-03-30T09:00:00',
      '2027-04-27T09:00:00',
    ]);
    // CST is UTC−6 in December (tz database).
    expect(next[0]!.at.toISOString()).toBe('2026-12-29T15:00:00.000Z');
  });
});
