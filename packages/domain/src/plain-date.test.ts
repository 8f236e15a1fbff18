import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { dateParts, daysInMonth, epochDayFromParts, formatPlainDate, isoWeekday, isoWeekMonday, parsePlainDate } from './plain-date.ts';

describe('plain dates', () => {
  it('agree with ECMAScript Date (proleptic Gregorian, ECMA-262 §21.4.1) from year 1 to 9999 (property)', () => {
    fc.assert(
      fc.property(fc.integer({ min: -719_162, max: 2_932_896 }), (day) => {
        const d = new Date(day * 86_400_000);
        expect(dateParts(day)).toEqual({ year: d.getUTCFullYear(), month: d.getUTCMonth() + 1, day: d.getUTCDate() });
        expect(epochDayFromParts(d.getUTCFullYear(), d.getUTCMonth() + 1, d.getUTCDate())).toBe(day);
        expect(isoWeekday(day)).toBe(d.getUTCDay() === 0 ? 7 : d.getUTCDay());
      }),
      { numRuns: 2000 },
    );
  });

  it('knows leap years (Gregorian rule: 1900 no, 2000 yes, 2024 yes)', () => {
    expect([1900, 2000, 2023, 2024].map((y) => daysInMonth(y, 2))).toEqual([28, 29, 28, 29]);
  });

  it('ISO 8601 weeks: 2009-W01 starts 2008-12-29; 2020 has a week 53, 2021 does not', () => {
    expect(formatPlainDate(isoWeekMonday(2009, 1))).toBe('2008-12-29');
    expect(formatPlainDate(isoWeekMonday(2020, 53))).toBe('2020-12-28');
    expect(() => isoWeekMonday(2021, 53)).toThrow(expect.objectContaining({ code: 'invalid-date' }));
  });

  it('parses only real YYYY-MM-DD dates', () => {
    expect(formatPlainDate(parsePlainDate('2024-02-29'))).toBe('2024-02-29');
    for (const bad of ['2023-02-29', '2024-13-01', '2024-1-5', 'yesterday', '']) {
      expect(() => parsePlainDate(bad)).toThrow(expect.objectContaining({ code: 'invalid-date' }));
    }
  });
});
