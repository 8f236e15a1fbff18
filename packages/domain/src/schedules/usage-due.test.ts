import { describe, expect, it } from 'vitest';
import { usageDue } from './usage-due.ts';

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
    expect(usageDue({ every: 500, lastServiceReading: 100, currentReading: 700 }, now, 'hours')).toMatchObject({
      state: 'overdue',
      remaining: -100,
    });
  });

  it('refuses an interval of zero and a meter that went backwards with no rollover', () => {
    expect(() => usageDue({ every: 0, lastServiceReading: 0, currentReading: 1 }, now, 'plays')).toThrow(
      expect.objectContaining({ field: 'every' }),
    );
    expect(() => usageDue({ every: 10, lastServiceReading: 50, currentReading: 1 }, now, 'plays')).toThrow(
      expect.objectContaining({ code: 'conflicting-input' }),
    );
  });
});
