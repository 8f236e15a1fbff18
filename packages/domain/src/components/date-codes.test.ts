import { describe, expect, it } from 'vitest';
import { parseManufactureDate } from './date-codes.ts';

describe('parseManufactureDate', () => {
  it('reads full dates, months, years and ISO weeks (ISO 8601: week 1 holds the first Thursday)', () => {
    expect(parseManufactureDate('1989-08-21', '2025-01-01')).toEqual({ date: '1989-08-21', precision: 'day' });
    expect(parseManufactureDate('1989-08', '2025-01-01')).toEqual({ date: '1989-08-01', precision: 'month' });
    expect(parseManufactureDate('1998', '2025-01-01')).toEqual({ date: '1998-01-01', precision: 'year' });
    // 2009-W01 starts Monday 2008-12-29; 2015-W53 starts 2015-12-28 (ISO 8601 calendar, from memory).
    expect(parseManufactureDate('2009-W01', '2025-01-01').date).toBe('2008-12-29');
    expect(parseManufactureDate('2015W53', '2025-01-01').date).toBe('2015-12-28');
  });

  it('reads a YYWW code as the most recent such year not after today', () => {
    expect(parseManufactureDate('8934', '2025-06-01')).toEqual({ date: '1989-08-21', precision: 'week' });
    expect(parseManufactureDate('2410', '2025-06-01').date).toBe('2024-03-04');
    expect(parseManufactureDate('2540', '2025-06-01').date).toBe('1925-09-28'); // week 40 of 2025 is still ahead
  });

  it('a four-digit code equal to the current year (ISO 8601 calendar years and weeks)', () => {
    // "2060" cannot be a year-week (there is no week 60), so as of 2060 it is that year, from 1 January: not the future.
    expect(parseManufactureDate('2060', '2060-01-01')).toEqual({ date: '2060-01-01', precision: 'year' });
    expect(parseManufactureDate('1999', '1999-12-31')).toEqual({ date: '1999-01-01', precision: 'year' });
    // "2025" in 2025 reads as that year and as week 25 of 2020 as well, so it is refused as ambiguous.
    expect(() => parseManufactureDate('2025', '2025-06-01')).toThrow(expect.objectContaining({ code: 'ambiguous' }));
    // A year still to come is a board from the future, and the message says so.
    expect(() => parseManufactureDate('2061', '2060-12-31')).toThrow(
      expect.objectContaining({ code: 'invalid-date', message: expect.stringMatching(/cannot be made in the future/) }),
    );
  });

  it('a year-week code for the current week counts from its Monday (ISO 8601: 2025-W23 starts Monday 2 June)', () => {
    expect(parseManufactureDate('2523', '2025-06-02')).toEqual({ date: '2025-06-02', precision: 'week' });
    // The day before, that week has not begun: the code is a century older.
    expect(parseManufactureDate('2523', '2025-06-01').date).toBe('1925-06-01');
  });

  it('refuses codes that read two ways, impossible weeks, future dates and junk', () => {
    expect(() => parseManufactureDate('2012', '2025-06-01')).toThrow(expect.objectContaining({ code: 'ambiguous' }));
    expect(parseManufactureDate('20W12', '2025-06-01').date).toBe('2020-03-16');
    expect(() => parseManufactureDate('8960', '2025-06-01')).toThrow(
      expect.objectContaining({ code: 'invalid-date', message: expect.stringMatching(/neither a year nor a year-week/) }),
    );
    expect(() => parseManufactureDate('2014-W53', '2025-06-01')).toThrow(expect.objectContaining({ code: 'invalid-date' }));
    expect(() => parseManufactureDate('2030-01-01', '2025-06-01')).toThrow(expect.objectContaining({ code: 'invalid-date' }));
    expect(() => parseManufactureDate('1989-02-30', '2025-06-01')).toThrow(expect.objectContaining({ code: 'invalid-date' }));
    expect(() => parseManufactureDate('last spring', '2025-06-01')).toThrow(expect.objectContaining({ field: 'dateCode' }));
  });
});
