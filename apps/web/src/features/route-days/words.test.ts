import { describe, expect, it } from 'vitest';
import { formatKm, shiftDay } from './words.ts';

describe('route-day words', () => {
  it('says distances to a tenth of a kilometre in the locale', () => {
    expect(formatKm(14.46)).toBe('14.5 km');
    expect(formatKm(1234.5, 'de-DE')).toBe('1.234,5 km');
  });

  it('moves a date across month and year ends', () => {
    expect(shiftDay('2026-12-31', 1)).toBe('2027-01-01');
    expect(shiftDay('2027-03-01', -1)).toBe('2027-02-28');
  });
});
