import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { meterDelta } from './meter-delta.ts';

describe('meterDelta', () => {
  it('counts forward, and across a rollover at the modulus (worked by hand: 999,990 → 15 is 10 + 15 = 25)', () => {
    expect(meterDelta(1_200, 1_950, 1_000_000)).toEqual({ delta: 750, rolledOver: false });
    expect(meterDelta(999_990, 15, 1_000_000)).toEqual({ delta: 25, rolledOver: true });
    expect(meterDelta(500, 500, 1_000_000)).toEqual({ delta: 0, rolledOver: false });
  });

  it('agrees with modular arithmetic: (previous + delta) mod m = current (property)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 2, max: 10_000_000 }), fc.nat(), fc.nat(), (m, a, d) => {
        const previous = a % m;
        const delta = d % m;
        const current = (previous + delta) % m;
        expect(meterDelta(previous, current, m).delta).toBe(delta);
      }),
    );
  });

  it('refuses a meter that went backwards without a modulus, and readings beyond the modulus', () => {
    expect(() => meterDelta(100, 50)).toThrow(expect.objectContaining({ code: 'conflicting-input' }));
    expect(() => meterDelta(1_000_000, 5, 1_000_000)).toThrow(expect.objectContaining({ code: 'out-of-range' }));
    expect(() => meterDelta(-1, 5, 1_000_000)).toThrow(expect.objectContaining({ code: 'negative' }));
    expect(() => meterDelta(1, 5, 0)).toThrow(expect.objectContaining({ field: 'meterModulus' }));
  });
});
