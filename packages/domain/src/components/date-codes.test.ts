import { describe, expect, it } from 'vitest';
import { parseManufactureDate } from './date-codes';

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

  it('refuses codes that read two ways, impossible weeks, future dates and junk', () => {
    expect(() => parseManufactureDate('2012', '2025-06-01')).toThrow(expect.objectContaining({ code: 'ambiguous' }));
    expect(parseManufactureDate('20W12', '2025-06-01').date).toBe('2020-03-16');
    expect(() => parseManufactureDate('8960', '2025-06-01')).toThrow(expect.objectContaining({ code: 'invalid-date' }));
    expect(() => parseManufactureDate('2014-W53', '2025-06-01')).toThrow(expect.objectContaining({ code: 'invalid-date' }));
    expect(() => parseManufactureDate('2030-01-01', '2025-06-01')).toThrow(expect.objectContaining({ code: 'invalid-date' }));
    expect(() => parseManufactureDate('1989-02-30', '2025-06-01')).toThrow(expect.objectContaining({ code: 'invalid-date' }));
    expect(() => parseManufactureDate('last spring', '2025-06-01')).toThrow(expect.objectContaining({ field: 'dateCode' }));
  });
});
