import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  calendarLife,
  estimateLifeHours,
  profileLife,
  profileLives,
  recapDue,
  recapDueFromLives,
  recapDueWithProfile,
} from './capacitor-life.ts';

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

// Varying temperature: each hour at T uses 1/L(T) of the life, so a day uses Σ hᵢ / L(Tᵢ) (COSEL's note on lifetime
// at varying ambient temperature; Nippon Chemi-Con's technical note on estimating life — from memory of both).
describe('profileLife', () => {
  it('a profile at one temperature gives exactly the single-temperature answer, whole or split into slices', () => {
    for (const [t, hours] of [
      [65, 8],
      [47.3, 7],
      [31, 13],
    ] as const) {
      const steady = calendarLife({ ...part, operatingTemperatureC: t, hoursPerDay: hours, maxYears: 100 });
      const whole = profileLife({ ...part, slices: [{ hours, temperatureC: t }], maxYears: 100 });
      const split = profileLife({
        ...part,
        slices: [
          { hours: 3, temperatureC: t },
          { hours: hours - 3, temperatureC: t },
        ],
        maxYears: 100,
      });
      for (const life of [whole, split]) {
        expect(life.days).toBe(steady.days);
        expect(life.years).toBe(steady.years);
        expect(life.lifeHours).toBe(steady.lifeHours);
        expect(life.equivalentTemperatureC).toBe(t);
      }
    }
  });

  it('hand-worked: 105 °C / 2,000 h part, 4 h at 45 °C + 6 h at 55 °C a day → 8,000 days', () => {
    // L45 = 2,000 × 2^6 = 128,000 h; L55 = 2,000 × 2^5 = 64,000 h; a day uses 4/128,000 + 6/64,000 = 0.000125 of
    // the life → 1 / 0.000125 = 8,000 days = 80,000 powered hours (worked by hand).
    const life = profileLife({
      ...part,
      slices: [
        { hours: 4, temperatureC: 45 },
        { hours: 6, temperatureC: 55 },
      ],
      maxYears: 30,
    });
    expect(life.days).toBe(8000);
    expect(life.lifeHours).toBe(80_000);
    expect(life.hoursPerDay).toBe(10);
    expect(life.years).toBeCloseTo(8000 / 365.25, 12);
    expect(life.limitedByAge).toBe(false);
    // 80,000 h = 2,000 × 2^((105 − T)/10) → T = 105 − 10 log2(40) = 51.78 °C (worked by hand).
    expect(life.equivalentTemperatureC).toBeCloseTo(105 - 10 * Math.log2(40), 9);
    // With the makers' 15-year cap (from memory), 21.9 years becomes 15.
    expect(
      profileLife({
        ...part,
        slices: [
          { hours: 4, temperatureC: 45 },
          { hours: 6, temperatureC: 55 },
        ],
      }),
    ).toMatchObject({
      years: 15,
      limitedByAge: true,
    });
  });

  it('lies between the lives at its coolest and its hottest slice (property, fixed seed)', () => {
    fc.assert(
      fc.property(
        fc.array(
          fc.record({ hours: fc.double({ min: 0.1, max: 4, noNaN: true }), temperatureC: fc.double({ min: -20, max: 105, noNaN: true }) }),
          {
            minLength: 1,
            maxLength: 6,
          },
        ),
        (slices) => {
          const hoursPerDay = slices.reduce((sum, s) => sum + s.hours, 0);
          const temperatures = slices.map((s) => s.temperatureC);
          const at = (t: number) => calendarLife({ ...part, operatingTemperatureC: t, hoursPerDay, maxYears: 1e9 }).days;
          const days = profileLife({ ...part, slices, maxYears: 1e9 }).days;
          const slack = 1e-12 * days;
          expect(days).toBeLessThanOrEqual(at(Math.min(...temperatures)) + slack);
          expect(days).toBeGreaterThanOrEqual(at(Math.max(...temperatures)) - slack);
        },
      ),
    );
  });

  it('a board never switched on is limited by age alone', () => {
    expect(profileLife({ ...part, slices: [] })).toMatchObject({
      years: 15,
      limitedByAge: true,
      hoursPerDay: 0,
      equivalentTemperatureC: null,
    });
  });

  it('refuses a slice above the rating (naming it), more than 24 hours, and negative hours', () => {
    expect(() =>
      profileLife({
        ...part,
        slices: [
          { hours: 4, temperatureC: 45 },
          { hours: 2, temperatureC: 110 },
        ],
      }),
    ).toThrow(
      expect.objectContaining({
        code: 'above-rated-temperature',
        field: 'slices[1].temperatureC',
        message: expect.stringMatching(/^slice 2 \(2 h at 110 °C\) is above the part's rated 105 °C/),
      }),
    );
    expect(() =>
      profileLife({
        ...part,
        slices: [
          { hours: 20, temperatureC: 45 },
          { hours: 5, temperatureC: 50 },
        ],
      }),
    ).toThrow(expect.objectContaining({ code: 'out-of-range', field: 'slices' }));
    expect(() => profileLife({ ...part, slices: [{ hours: -1, temperatureC: 45 }] })).toThrow(
      expect.objectContaining({ field: 'slices[0].hours' }),
    );
  });
});

describe('recapDueWithProfile', () => {
  const slices = [
    { hours: 4, temperatureC: 45 },
    { hours: 6, temperatureC: 55 },
  ];

  it('counts the profile life on from the last recap: 8,000 days from 2010-01-01 (hand-worked above)', () => {
    const r = recapDueWithProfile({ from: '2010-01-01', capacitors: [part], slices, asOf: '2020-01-01', maxYears: 30 });
    // The calendar day 8,000 days on, with ECMAScript Date as the calendar.
    expect(r.dueDate).toBe(new Date(Date.UTC(2010, 0, 1) + 8000 * 86_400_000).toISOString().slice(0, 10));
    expect(r).toMatchObject({ manufactured: '2010-01-01', status: 'ok', limitingCapacitor: 0 });
  });

  it('agrees with recapDue for a steady temperature, and the shortest-lived part sets the date', () => {
    const capacitors = [part, { ratedLifeHours: 1000, ratedTemperatureC: 85 }];
    const steady = recapDue({
      manufactured: '1534',
      capacitors: capacitors.map((c) => ({ ...c, operatingTemperatureC: 65 })),
      hoursPerDay: 8,
      asOf: '2020-06-01',
    });
    const profiled = recapDueWithProfile({ from: '1534', capacitors, slices: [{ hours: 8, temperatureC: 65 }], asOf: '2020-06-01' });
    expect(profiled).toEqual(steady);
    expect(profiled.limitingCapacitor).toBe(1);
  });

  it('says overdue once past, and names the capacitor a too-hot slice rules out', () => {
    expect(recapDueWithProfile({ from: '2000-01-01', capacitors: [part], slices, asOf: '2024-01-01' }).status).toBe('overdue');
    expect(() =>
      recapDueWithProfile({
        from: '2010-01-01',
        capacitors: [part, { ratedLifeHours: 1000, ratedTemperatureC: 50 }],
        slices,
        asOf: '2020-01-01',
      }),
    ).toThrow(expect.objectContaining({ code: 'above-rated-temperature', message: expect.stringMatching(/^capacitor 2: slice 2/) }));
    expect(() => recapDueWithProfile({ from: '2030-01-01', capacitors: [part], slices, asOf: '2020-01-01' })).toThrow(
      expect.objectContaining({ field: 'from' }),
    );
  });
});

describe('profileLives and recapDueFromLives (recapDueWithProfile in two steps, for a list of many boards)', () => {
  const slices = [
    { hours: 4, temperatureC: 45 },
    { hours: 6, temperatureC: 55 },
  ];

  it('give recapDueWithProfile’s answer (or its refusal: a slice hotter than an 85 °C part) for any start, parts and day', () => {
    const capacitor = fc.record({
      ratedLifeHours: fc.integer({ min: 500, max: 20_000 }),
      ratedTemperatureC: fc.constantFrom(85, 105, 125),
    });
    const day = fc.array(fc.record({ hours: fc.integer({ min: 0, max: 6 }), temperatureC: fc.integer({ min: 20, max: 95 }) }), {
      minLength: 1,
      maxLength: 4,
    });
    const start = fc
      .integer({ min: 0, max: 12_000 })
      .map((d) => new Date(Date.UTC(1990, 0, 1) + d * 86_400_000).toISOString().slice(0, 10));
    fc.assert(
      fc.property(fc.array(capacitor, { minLength: 1, maxLength: 5 }), day, start, (capacitors, day, from) => {
        const asOf = '2024-06-01';
        let whole: unknown;
        try {
          whole = recapDueWithProfile({ from, capacitors, slices: day, asOf });
        } catch (error) {
          whole = error;
        }
        let split: unknown;
        try {
          split = recapDueFromLives({ from, lives: profileLives({ capacitors, slices: day }), asOf });
        } catch (error) {
          split = error;
        }
        expect(split).toEqual(whole);
      }),
    );
  });

  it('name the capacitor a too-hot slice rules out, and refuse a start after today or no parts', () => {
    expect(() => profileLives({ capacitors: [part, { ratedLifeHours: 1000, ratedTemperatureC: 50 }], slices })).toThrow(
      expect.objectContaining({ code: 'above-rated-temperature', message: expect.stringMatching(/^capacitor 2: slice 2/) }),
    );
    const lives = profileLives({ capacitors: [part], slices });
    expect(() => recapDueFromLives({ from: '2030-01-01', lives, asOf: '2020-01-01' })).toThrow(expect.objectContaining({ field: 'from' }));
    expect(() => recapDueFromLives({ from: '2010-01-01', lives: [], asOf: '2020-01-01' })).toThrow(
      expect.objectContaining({ code: 'missing-input' }),
    );
  });
});
