import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { calendarLife, estimateLifeHours, recapDue } from './capacitor-life.ts';

const part = { ratedLifeHours: 2000, ratedTemperatureC: 105 };

describe('estimateLifeHours (L = L0 × 2^((T0 − T)/10): Nippon Chemi-Con, technical note "Estimating the life of aluminum electrolytic capacitors"; TDK capacitor FAQ)', () => {
  it('105 °C / 2,000 h part at 65 °C → 32,000 h (10 °C rule: 2,000 × 2^(40/10) = 2,000 × 16)', () => {
    expect(estimateLifeHours({ ...part, operatingTemperatureC: 65 })).toBe(32_000);
  });

  it("at the rated temperature the life is the rated life; each 10 °C cooler doubles it (the notes' 10 °C rule)", () => {
    expect(estimateLifeHours({ ...part, operatingTemperatureC: 105 })).toBe(2000);
    fc.assert(
      fc.property(fc.double({ min: -40, max: 95, noNaN: true }), (t) => {
        const warmer = estimateLifeHours({ ...part, operatingTemperatureC: t + 10 });
        expect(estimateLifeHours({ ...part, operatingTemperatureC: t }) / warmer).toBeCloseTo(2, 10);
      }),
    );
  });

  it('refuses a temperature above rated, a zero life, and NaN', () => {
    expect(() => estimateLifeHours({ ...part, operatingTemperatureC: 110 })).toThrow(
      expect.objectContaining({ code: 'above-rated-temperature', field: 'operatingTemperatureC' }),
    );
    expect(() => estimateLifeHours({ ...part, ratedLifeHours: 0, operatingTemperatureC: 65 })).toThrow(
      expect.objectContaining({ field: 'ratedLifeHours' }),
    );
    expect(() => estimateLifeHours({ ...part, operatingTemperatureC: NaN })).toThrow(expect.objectContaining({ code: 'not-a-number' }));
  });
});

describe('calendarLife', () => {
  it('32,000 h at 8 h a day is 4,000 days (worked by hand: 32000 / 8 = 4000; / 365.25 = 10.95 years)', () => {
    const life = calendarLife({ ...part, operatingTemperatureC: 65, hoursPerDay: 8 });
    expect(life.years).toBeCloseTo(4000 / 365.25, 10);
    expect(life.limitedByAge).toBe(false);
  });

  it("caps at 15 years however little the game runs (makers' notes, from memory)", () => {
    const life = calendarLife({ ...part, operatingTemperatureC: 45, hoursPerDay: 2 });
    expect(life).toMatchObject({ years: 15, limitedByAge: true });
    expect(calendarLife({ ...part, operatingTemperatureC: 45, hoursPerDay: 0 }).years).toBe(15);
  });

  it('refuses negative hours and more than 24 hours a day', () => {
    expect(() => calendarLife({ ...part, operatingTemperatureC: 65, hoursPerDay: -1 })).toThrow(
      expect.objectContaining({ code: 'negative' }),
    );
    expect(() => calendarLife({ ...part, operatingTemperatureC: 65, hoursPerDay: 25 })).toThrow(
      expect.objectContaining({ code: 'out-of-range' }),
    );
  });
});

describe('recapDue', () => {
  // Hand-worked: made 2015-01-01; 105 °C/2,000 h at 65 °C = 32,000 h; 8 h/day → 4,000 days → due 4,000 days later.
  const dueByHand = new Date(Date.UTC(2015, 0, 1) + 4000 * 86_400_000).toISOString().slice(0, 10);
  const board = { manufactured: '2015-01-01', capacitors: [{ ...part, operatingTemperatureC: 65 }], hoursPerDay: 8 };

  it('gives the due date and says ok while it is far off', () => {
    const r = recapDue({ ...board, asOf: '2020-06-01' });
    expect(r.dueDate).toBe(dueByHand);
    expect(r.status).toBe('ok');
    expect(r.message).toContain(dueByHand);
  });

  it('says "due within N months" inside the lead, and "recap now — overdue since …" once passed', () => {
    // dueByHand is 2025-12-14; from 2025-09-01 that is 104 days ≈ 3.4 months → "within 4 months".
    expect(dueByHand).toBe('2025-12-14');
    const soon = recapDue({ ...board, asOf: '2025-09-01' });
    expect(soon).toMatchObject({ status: 'due-soon', monthsUntilDue: 4 });
    expect(soon.message).toBe(`due within 4 months (${dueByHand})`);
    const late = recapDue({ ...board, asOf: '2026-03-01' });
    expect(late.status).toBe('overdue');
    expect(late.message).toBe(`recap now — overdue since ${dueByHand}`);
    expect(recapDue({ ...board, asOf: dueByHand }).status).toBe('overdue');
  });

  it('the shortest-lived capacitor on the board sets the date', () => {
    const r = recapDue({
      ...board,
      capacitors: [
        { ...part, operatingTemperatureC: 45 },
        { ratedLifeHours: 1000, ratedTemperatureC: 85, operatingTemperatureC: 65 },
      ],
      asOf: '2016-01-01',
    });
    // 85 °C / 1,000 h at 65 °C = 4,000 h → 500 days at 8 h/day.
    expect(r.limitingCapacitor).toBe(1);
    expect(r.dueDate).toBe(new Date(Date.UTC(2015, 0, 1) + 500 * 86_400_000).toISOString().slice(0, 10));
  });

  it('a life of a whole number of days lands on that exact day, not the day before', () => {
    // 105 °C / 3,000 h at 75 °C: 3,000 × 2^((105 − 75)/10) = 24,000 h (the 10 °C rule above); at 8 h a day that is
    // exactly 3,000 days (worked by hand), counted on from 2015-01-01 with ECMAScript Date as the calendar.
    const r = recapDue({
      ...board,
      capacitors: [{ ratedLifeHours: 3000, ratedTemperatureC: 105, operatingTemperatureC: 75 }],
      asOf: '2016-01-01',
    });
    expect(r.dueDate).toBe(new Date(Date.UTC(2015, 0, 1) + 3000 * 86_400_000).toISOString().slice(0, 10));
    expect(r.dueDate).toBe('2023-03-20');
  });

  it('a fractional number of days rounds down: the recap comes no later than the life allows', () => {
    // 32,000 h at 9 h a day = 3,555.56 days (worked by hand) → due 3,555 days on, not 3,556.
    const r = recapDue({ ...board, hoursPerDay: 9, asOf: '2016-01-01' });
    expect(r.dueDate).toBe(new Date(Date.UTC(2015, 0, 1) + 3555 * 86_400_000).toISOString().slice(0, 10));
    // Capped at 15 years: 15 × 365.25 = 5,478.75 days → 5,478 (a year of 365.25 days, as calendarLife counts it).
    const capped = recapDue({ ...board, hoursPerDay: 1, asOf: '2016-01-01' });
    expect(capped.lifeYears).toBe(15);
    expect(capped.dueDate).toBe(new Date(Date.UTC(2015, 0, 1) + 5478 * 86_400_000).toISOString().slice(0, 10));
  });

  it('reads a board date code (YYWW) and a configurable lead', () => {
    const r = recapDue({ ...board, manufactured: '1534', asOf: '2020-06-01', leadMonths: 0 });
    expect(r.manufactured).toBe('2015-08-17'); // ISO week 34 of 2015 starts Monday 17 August (ISO 8601)
  });

  it('refuses a board with no capacitors, bad dates and negative leads', () => {
    expect(() => recapDue({ ...board, capacitors: [], asOf: '2020-01-01' })).toThrow(expect.objectContaining({ code: 'missing-input' }));
    expect(() => recapDue({ ...board, asOf: '2020-13-01' })).toThrow(expect.objectContaining({ code: 'invalid-date' }));
    expect(() => recapDue({ ...board, asOf: '2020-01-01', leadMonths: -1 })).toThrow(expect.objectContaining({ code: 'negative' }));
    expect(() => recapDue({ ...board, asOf: '2020-01-01', hoursPerDay: 30 })).toThrow(expect.objectContaining({ field: 'hoursPerDay' }));
  });
});
