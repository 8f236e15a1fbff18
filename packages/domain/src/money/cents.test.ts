import { describe, expect, it } from 'vitest';
import { multiplyCents, requireCents, requireNonNegativeCents } from './cents.ts';

describe('cents', () => {
  it('accepts whole cents and refuses everything else', () => {
    expect(requireCents(-250, 'x')).toBe(-250);
    expect(() => requireCents(2.5, 'x')).toThrow(expect.objectContaining({ code: 'not-an-integer', field: 'x' }));
    expect(() => requireCents(2 ** 53, 'x')).toThrow(expect.objectContaining({ code: 'not-an-integer' }));
    expect(() => requireCents('250', 'x')).toThrow(expect.objectContaining({ code: 'not-a-number' }));
    expect(() => requireNonNegativeCents(-1, 'x')).toThrow(expect.objectContaining({ code: 'negative' }));
  });

  it('refuses a product too large to hold exactly (Number.MAX_SAFE_INTEGER = 2^53 − 1)', () => {
    expect(multiplyCents(100, 1_000, 'x')).toBe(100_000);
    expect(() => multiplyCents(2 ** 40, 2 ** 20, 'x')).toThrow(expect.objectContaining({ code: 'out-of-range' }));
  });
});
