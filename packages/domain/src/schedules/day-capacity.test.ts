import { describe, expect, it } from 'vitest';
import { firstDayWithRoom, onSiteCapacityMinutes } from './day-capacity.ts';

// Worked by hand: an 08:00–17:00 day is 540 min; less a third for driving leaves 360 min on site.
describe('onSiteCapacityMinutes', () => {
  it('is the day less a third for driving', () => {
    expect(onSiteCapacityMinutes('08:00', '17:00')).toBe(360);
    expect(onSiteCapacityMinutes('07:30', '16:30')).toBe(360);
  });
  it('refuses a day that ends before it starts, naming the field', () => {
    expect(() => onSiteCapacityMinutes('17:00', '08:00')).toThrow(expect.objectContaining({ field: 'dayEnd' }));
    expect(() => onSiteCapacityMinutes('8am', '17:00')).toThrow(expect.objectContaining({ field: 'dayStart' }));
  });
});

describe('firstDayWithRoom', () => {
  const bookedOn = (days: Record<string, number>) => (day: string) => days[day] ?? 0;

  it('keeps the first day while it has room', () => {
    expect(firstDayWithRoom({ from: '2026-12-03', needMinutes: 180, capacityMinutes: 360, booked: bookedOn({ '2026-12-03': 180 }) })).toBe(
      '2026-12-03',
    );
  });

  it('spreads a backlog: eight three-hour jobs fill two a day over four days', () => {
    const booked: Record<string, number> = {};
    const days: string[] = [];
    for (let i = 0; i < 8; i++) {
      const day = firstDayWithRoom({ from: '2026-12-30', needMinutes: 180, capacityMinutes: 360, booked: bookedOn(booked) });
      booked[day] = (booked[day] ?? 0) + 180;
      days.push(day);
    }
    // Across the year's end, two a day.
    expect(days).toEqual(['2026-12-30', '2026-12-30', '2026-12-31', '2026-12-31', '2027-01-01', '2027-01-01', '2027-01-02', '2027-01-02']);
  });

  it('puts a job longer than a day on the first empty day, and falls back to the first day when the horizon is full', () => {
    expect(firstDayWithRoom({ from: '2026-12-03', needMinutes: 600, capacityMinutes: 360, booked: bookedOn({ '2026-12-03': 30 }) })).toBe(
      '2026-12-04',
    );
    expect(firstDayWithRoom({ from: '2026-12-03', needMinutes: 60, capacityMinutes: 360, booked: () => 360, horizonDays: 3 })).toBe(
      '2026-12-03',
    );
  });

  it('refuses a bad day or a negative need, naming the field', () => {
    expect(() => firstDayWithRoom({ from: '2026-02-30', needMinutes: 60, capacityMinutes: 360, booked: () => 0 })).toThrow(
      expect.objectContaining({ field: 'from' }),
    );
    expect(() => firstDayWithRoom({ from: '2026-12-03', needMinutes: -1, capacityMinutes: 360, booked: () => 0 })).toThrow(
      expect.objectContaining({ field: 'needMinutes' }),
    );
  });
});
