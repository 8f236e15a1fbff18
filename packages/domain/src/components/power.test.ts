import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { checkResistorPower, dissipationWatts, STANDARD_WATTAGES } from './power.ts';

describe("dissipationWatts (Ohm's law: P = VI = I²R = V²/R)", () => {
  it("12 V across 470 Ω = 0.306 W (Ohm's law, worked by hand: 12² / 470 = 0.3064)", () => {
    expect(dissipationWatts({ volts: 12, ohms: 470 })).toBeCloseTo(0.306, 3);
  });

  it('any two of V, I, R give the same power (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.01, max: 1000, noNaN: true }), fc.double({ min: 0.1, max: 1e6, noNaN: true }), (volts, ohms) => {
        const amps = volts / ohms;
        const p = (volts * volts) / ohms;
        expect(dissipationWatts({ volts, ohms })).toBeCloseTo(p, 10);
        expect(dissipationWatts({ amps, ohms }) / p).toBeCloseTo(1, 10);
        expect(dissipationWatts({ volts, amps }) / p).toBeCloseTo(1, 10);
      }),
    );
  });

  it('needs exactly two inputs and refuses nonsense', () => {
    expect(() => dissipationWatts({ volts: 12 })).toThrow(expect.objectContaining({ code: 'missing-input' }));
    expect(() => dissipationWatts({ volts: 12, amps: 1, ohms: 12 })).toThrow(expect.objectContaining({ code: 'conflicting-input' }));
    expect(() => dissipationWatts({ volts: 12, ohms: 0 })).toThrow(expect.objectContaining({ field: 'ohms' }));
    expect(() => dissipationWatts({ amps: 1, ohms: -5 })).toThrow(expect.objectContaining({ code: 'negative' }));
    expect(() => dissipationWatts({ volts: Infinity, ohms: 5 })).toThrow(expect.objectContaining({ code: 'not-a-number' }));
  });
});

describe('checkResistorPower (derating: NASA EEE-INST-002 / common practice 50 %)', () => {
  it('12 V across 470 Ω on a ½ W part: over the 0.25 W allowed at 50 % → needs ≥ 1 W (0.306 / 0.5 = 0.61 W; next standard size 1 W, common practice)', () => {
    const check = checkResistorPower({ volts: 12, ohms: 470, ratedWatts: 0.5 });
    expect(check.ok).toBe(false);
    expect(check.allowedWatts).toBe(0.25);
    expect(check.smallestStandardWatts).toBe(1);
    expect(check.message).toContain('0.306 W');
    expect(check.message).toContain('1 W');
  });

  it('the same part is fine at 1 W, and a 70 % derating lets a ½ W part do', () => {
    expect(checkResistorPower({ volts: 12, ohms: 470, ratedWatts: 1 }).ok).toBe(true);
    // 0.306 W ≤ 0.5 W × 0.7 = 0.35 W
    expect(checkResistorPower({ volts: 12, ohms: 470, ratedWatts: 0.5, derating: 0.7 })).toMatchObject({
      ok: true,
      smallestStandardWatts: 0.5,
    });
  });

  it('says so when no standard rating up to 10 W will do', () => {
    const check = checkResistorPower({ volts: 120, ohms: 100, ratedWatts: 10 });
    expect(check.smallestStandardWatts).toBeNull();
    expect(check.message).toMatch(/no standard rating/);
  });

  it('refuses a derating outside (0, 1] and a rating of zero', () => {
    expect(() => checkResistorPower({ volts: 5, ohms: 100, ratedWatts: 0.25, derating: 0 })).toThrow(
      expect.objectContaining({ field: 'derating' }),
    );
    expect(() => checkResistorPower({ volts: 5, ohms: 100, ratedWatts: 0.25, derating: 1.5 })).toThrow(
      expect.objectContaining({ code: 'out-of-range' }),
    );
    expect(() => checkResistorPower({ volts: 5, ohms: 100, ratedWatts: 0 })).toThrow(expect.objectContaining({ field: 'ratedWatts' }));
  });

  it('the suggested rating is the smallest standard one within derating (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.001, max: 4.9, noNaN: true }), fc.double({ min: 0.3, max: 1, noNaN: true }), (watts, derating) => {
        const check = checkResistorPower({ volts: watts, amps: 1, ratedWatts: 0.125, derating });
        const suggested = check.smallestStandardWatts;
        if (suggested === null) {
          expect(watts).toBeGreaterThan(10 * derating);
          return;
        }
        expect(watts).toBeLessThanOrEqual(suggested * derating * (1 + 1e-9));
        const smaller = STANDARD_WATTAGES.filter((w) => w < suggested);
        for (const w of smaller) expect(watts).toBeGreaterThan(w * derating);
      }),
    );
  });
});
