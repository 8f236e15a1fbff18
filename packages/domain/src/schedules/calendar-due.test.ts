import { describe, expect, it } from 'vitest';
import { calendarDue } from './calendar-due.ts';

const monthly = { rule: 'FREQ=MONTHLY;BYMONTHDAY=1', start: { start: '2024-01-01T08:00', timeZone: 'Europe/Berlin' } };

describe('calendarDue', () => {
  it('is due at the first occurrence after the last time it was done', () => {
    const due = calendarDue({ ...monthly, lastDone: new Date('2024-03-01T10:00:00Z') }, new Date('2024-03-10T00:00:00Z'));
    expect(due.state).toBe('ok');
    expect(due.dueAt?.toISOString()).toBe('2024-04-01T06:00:00.000Z'); // 08:00 CEST
  });

  it('is due soon inside the lead, and overdue from the due moment on', () => {
    const lastDone = new Date('2024-03-01T10:00:00Z');
    expect(calendarDue({ ...monthly, lastDone }, new Date('2024-03-27T00:00:00Z')).state).toBe('due-soon'); // 5 days before, lead 7
    expect(calendarDue({ ...monthly, lastDone, leadDays: 3 }, new Date('2024-03-27T00:00:00Z')).state).toBe('ok');
    expect(calendarDue({ ...monthly, lastDone }, new Date('2024-04-01T06:00:00Z')).state).toBe('overdue');
    expect(calendarDue({ ...monthly, lastDone }, new Date('2024-05-15T00:00:00Z')).detail).toMatch(/overdue since 2024-04-01/);
  });

  it('never done: due at the first occurrence; a finished rule is never due again', () => {
    expect(calendarDue(monthly, new Date('2023-12-01T00:00:00Z')).dueAt?.toISOString()).toBe('2024-01-01T07:00:00.000Z');
    const ended = calendarDue(
      { ...monthly, rule: 'FREQ=MONTHLY;COUNT=2', lastDone: new Date('2024-02-02T00:00:00Z') },
      new Date('2024-06-01T00:00:00Z'),
    );
    expect(ended).toMatchObject({ state: 'ok', dueAt: null });
  });

  it('refuses a negative lead and invalid dates', () => {
    expect(() => calendarDue({ ...monthly, leadDays: -1 }, new Date())).toThrow(expect.objectContaining({ code: 'negative' }));
    expect(() => calendarDue(monthly, new Date('nonsense'))).toThrow(expect.objectContaining({ code: 'invalid-date' }));
  });
});
