import { describe, expect, it } from 'vitest';
import { calendarDue } from './calendar-due';
import { careDue } from './care-due';
import { usageDue } from './usage-due';

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
    const ended = calendarDue({ ...monthly, rule: 'FREQ=MONTHLY;COUNT=2', lastDone: new Date('2024-02-02T00:00:00Z') }, new Date('2024-06-01T00:00:00Z'));
    expect(ended).toMatchObject({ state: 'ok', dueAt: null });
  });

  it('refuses a negative lead and invalid dates', () => {
    expect(() => calendarDue({ ...monthly, leadDays: -1 }, new Date())).toThrow(expect.objectContaining({ code: 'negative' }));
    expect(() => calendarDue(monthly, new Date('nonsense'))).toThrow(expect.objectContaining({ code: 'invalid-date' }));
  });
});

describe('usageDue', () => {
  const now = new Date('2024-06-01T00:00:00Z');
  it('counts plays since the last service, across a meter rollover at 1,000,000', () => {
    // Worked by hand: 998,000 → 2,500 is 2,000 + 2,500 = 4,500 plays; every 5,000 → 500 to go, inside the 10 % lead.
    const due = usageDue({ every: 5_000, lastServiceReading: 998_000, currentReading: 2_500, meterModulus: 1_000_000 }, now, 'plays');
    expect(due).toMatchObject({ used: 4_500, remaining: 500, state: 'due-soon' });
  });

  it('projects a due date from the rate of use, and is overdue past the count', () => {
    const due = usageDue({ every: 5_000, lastServiceReading: 0, currentReading: 3_000, perDay: 100 }, now, 'plays');
    expect(due.dueAt?.toISOString()).toBe('2024-06-21T00:00:00.000Z'); // 2,000 plays at 100 a day = 20 days
    expect(usageDue({ every: 500, lastServiceReading: 100, currentReading: 700 }, now, 'hours')).toMatchObject({ state: 'overdue', remaining: -100 });
  });

  it('refuses an interval of zero and a meter that went backwards with no rollover', () => {
    expect(() => usageDue({ every: 0, lastServiceReading: 0, currentReading: 1 }, now, 'plays')).toThrow(expect.objectContaining({ field: 'every' }));
    expect(() => usageDue({ every: 10, lastServiceReading: 50, currentReading: 1 }, now, 'plays')).toThrow(expect.objectContaining({ code: 'conflicting-input' }));
  });
});

describe('careDue: whichever comes first', () => {
  const now = new Date('2024-03-10T00:00:00Z');
  const calendar = { ...monthly, lastDone: new Date('2024-03-01T10:00:00Z') }; // next 2024-04-01: ok

  it('takes the most urgent trigger', () => {
    const due = careDue({
      now,
      calendar,
      plays: { every: 5_000, lastServiceReading: 0, currentReading: 5_200 },
      hours: { every: 1_000, lastServiceReading: 0, currentReading: 100 },
    });
    expect(due).toMatchObject({ state: 'overdue', triggeredBy: 'plays' });
    expect(due.triggers.map((t) => t.state)).toEqual(['ok', 'overdue', 'ok']);
  });

  it('when all are ok, reports the earliest projected due date', () => {
    const due = careDue({
      now,
      calendar,
      hours: { every: 1_000, lastServiceReading: 0, currentReading: 100, perDay: 100 }, // 9 days → 2024-03-19
    });
    expect(due).toMatchObject({ state: 'ok', triggeredBy: 'hours' });
    expect(due.dueAt?.toISOString()).toBe('2024-03-19T00:00:00.000Z');
  });

  it('needs at least one trigger', () => {
    expect(() => careDue({ now })).toThrow(expect.objectContaining({ code: 'missing-input' }));
  });
});
