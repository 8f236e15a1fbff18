import { describe, expect, it } from 'vitest';
import { formatDate, formatDateTime, formatMoney } from './format.ts';

describe('format', () => {
  it('shows a calendar date as that day in any time zone', () => {
    expect(formatDate('2024-03-10', { locale: 'en-US', timeZone: 'Pacific/Kiritimati', currency: 'USD' })).toBe('Mar 10, 2024');
  });
  it("shows an instant in the operator's time zone (CDT is UTC−5 in July)", () => {
    expect(formatDateTime('2024-07-01T03:30:00Z', { locale: 'en-US', timeZone: 'America/Chicago', currency: 'USD' })).toMatch(
      /Jun 30, 2024.*10:30\s?PM/,
    );
  });
  it('formats integer cents as money in the locale', () => {
    expect(formatMoney(123456, { locale: 'en-US', timeZone: 'UTC', currency: 'USD' })).toBe('$1,234.56');
    expect(formatMoney(123456, { locale: 'de-DE', timeZone: 'UTC', currency: 'EUR' })).toMatch(/1\.234,56\s?€/);
  });
});
