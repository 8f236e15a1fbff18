import { describe, expect, it } from 'vitest';
import { dateCodeProblem, localToday } from './date-code-check.ts';

describe('dateCodeProblem', () => {
  it('lets a readable code, a blank and a code that reads two ways through', () => {
    expect(dateCodeProblem('8934', '2026-12-03')).toBeNull();
    expect(dateCodeProblem('1989-W34', '2026-12-03')).toBeNull();
    expect(dateCodeProblem('', '2026-12-03')).toBeNull();
    // "2012": the year, or week 12 of 2020 — saved and flagged by the API, not refused.
    expect(dateCodeProblem('2012', '2026-12-03')).toBeNull();
  });

  it('names an impossible week and a date after today', () => {
    expect(dateCodeProblem('8954', '2026-12-03')).toMatch(/weeks run 01–53/);
    expect(dateCodeProblem('1989-W53', '2026-12-03')).toMatch(/no ISO week 53/);
    expect(dateCodeProblem('2027-01-04', '2026-12-03')).toMatch(/cannot be made in the future/);
    expect(dateCodeProblem('soon', '2026-12-03')).toMatch(/is not a date code/);
  });

  it('takes today from the device calendar', () => {
    expect(localToday(new Date(2026, 11, 3, 23, 30))).toBe('2026-12-03');
  });
});
