import { describe, expect, it } from 'vitest';
import { expectedCash } from './expected-cash.ts';

describe('expectedCash', () => {
  it('plays × price, across a meter rollover (worked by hand: 999,950 → 30 on a 1,000,000 meter is 80 plays)', () => {
    expect(expectedCash({ previousMeter: 12_000, currentMeter: 12_480, pricePerPlayCents: 50 })).toEqual({
      plays: 480,
      expectedCents: 24_000,
      rolledOver: false,
    });
    expect(expectedCash({ previousMeter: 999_950, currentMeter: 30, meterModulus: 1_000_000, pricePerPlayCents: 100 })).toEqual({
      plays: 80,
      expectedCents: 8_000,
      rolledOver: true,
    });
  });

  it('refuses fractional prices and meters, and a meter that went backwards with no rollover', () => {
    expect(() => expectedCash({ previousMeter: 0, currentMeter: 10, pricePerPlayCents: 0.5 })).toThrow(
      expect.objectContaining({ code: 'not-an-integer', field: 'pricePerPlayCents' }),
    );
    expect(() => expectedCash({ previousMeter: 0.5, currentMeter: 10, pricePerPlayCents: 50 })).toThrow(
      expect.objectContaining({ code: 'not-an-integer' }),
    );
    expect(() => expectedCash({ previousMeter: 100, currentMeter: 10, pricePerPlayCents: 50 })).toThrow(
      expect.objectContaining({ code: 'conflicting-input' }),
    );
    expect(() => expectedCash({ previousMeter: 0, currentMeter: 2 ** 52, pricePerPlayCents: 100 })).toThrow(
      expect.objectContaining({ code: 'out-of-range' }),
    );
  });
});
