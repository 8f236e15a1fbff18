import { describe, expect, it } from 'vitest';
import { parseRecurrenceRule } from './recurrence-rule.ts';

describe('parseRecurrenceRule (RFC 5545 §3.3.10 subset)', () => {
  it('reads every supported part', () => {
    expect(parseRecurrenceRule('RRULE:FREQ=MONTHLY;INTERVAL=2;BYDAY=1MO,-1FR;BYMONTHDAY=-1,15;BYMONTH=1,7;COUNT=6;WKST=SU')).toEqual({
      frequency: 'MONTHLY',
      interval: 2,
      byDay: [
        { weekday: 'MO', ordinal: 1 },
        { weekday: 'FR', ordinal: -1 },
      ],
      byMonthDay: [-1, 15],
      byMonth: [1, 7],
      count: 6,
      until: null,
      weekStart: 'SU',
    });
  });

  it('reads UNTIL as a UTC instant, a local date-time, or a date', () => {
    expect(parseRecurrenceRule('FREQ=DAILY;UNTIL=19971224T000000Z').until).toEqual({ kind: 'instant', instant: Date.UTC(1997, 11, 24) });
    expect(parseRecurrenceRule('FREQ=DAILY;UNTIL=19971224T090000').until).toMatchObject({ kind: 'local', wall: { hour: 9 } });
    expect(parseRecurrenceRule('FREQ=DAILY;UNTIL=19971224').until?.kind).toBe('date');
    expect(() => parseRecurrenceRule('FREQ=DAILY;UNTIL=19970230')).toThrow(
      expect.objectContaining({ code: 'invalid-rule', field: 'rule.UNTIL' }),
    );
  });

  it('is case-insensitive in names and values (RFC 5545 §3.1: names are case-insensitive)', () => {
    expect(parseRecurrenceRule('freq=weekly;byday=mo').byDay).toEqual([{ weekday: 'MO', ordinal: null }]);
  });

  it('allows ordinals up to ±53 for yearly rules without BYMONTH, ±5 otherwise', () => {
    expect(parseRecurrenceRule('FREQ=YEARLY;BYDAY=20MO').byDay[0]?.ordinal).toBe(20);
    expect(() => parseRecurrenceRule('FREQ=MONTHLY;BYDAY=6MO')).toThrow(expect.objectContaining({ code: 'invalid-rule' }));
    expect(() => parseRecurrenceRule('FREQ=YEARLY;BYMONTH=3;BYDAY=6MO')).toThrow(expect.objectContaining({ code: 'invalid-rule' }));
  });
});
