import { describe, expect, it } from 'vitest';
import { careDue } from './care-due.ts';

const monthly = { rule: 'FREQ=MONTHLY;BYMONTHDAY=1', start: { start: '2024-01-01T08:00', timeZone: 'Europe/Berlin' } };

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
