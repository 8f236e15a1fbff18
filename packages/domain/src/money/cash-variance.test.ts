import { describe, expect, it } from 'vitest';
import { cashVariance } from './cash-variance.ts';

describe('cashVariance', () => {
  it('variance in cents and percent, flagged past the threshold (worked by hand)', () => {
    // Expected 240.00, counted 228.00: −12.00 = −5 %.
    expect(cashVariance({ expectedCents: 24_000, countedCents: 22_800, thresholdPercent: 3 })).toMatchObject({
      varianceCents: -1_200,
      variancePercent: -5,
      flagged: true,
    });
    expect(cashVariance({ expectedCents: 24_000, countedCents: 22_800, thresholdPercent: 5 }).flagged).toBe(false); // at the threshold
    expect(cashVariance({ expectedCents: 24_000, countedCents: 22_800, thresholdPercent: 10, thresholdCents: 1_000 }).flagged).toBe(true);
    expect(cashVariance({ expectedCents: 24_000, countedCents: 22_800, thresholdPercent: 10 }).reason).toBe('12.00 short (5 %)');
  });

  it('with nothing expected the percentage is undefined (null), and any cash is flagged on a percentage threshold', () => {
    const v = cashVariance({ expectedCents: 0, countedCents: 500, thresholdPercent: 5 });
    expect(v).toMatchObject({ varianceCents: 500, variancePercent: null, flagged: true });
    expect(cashVariance({ expectedCents: 0, countedCents: 0, thresholdPercent: 5 })).toMatchObject({
      flagged: false,
      reason: 'count matches the meters',
    });
  });

  it('needs a threshold and whole cents', () => {
    expect(() => cashVariance({ expectedCents: 100, countedCents: 100 })).toThrow(expect.objectContaining({ code: 'missing-input' }));
    expect(() => cashVariance({ expectedCents: 100.1, countedCents: 100, thresholdPercent: 5 })).toThrow(
      expect.objectContaining({ code: 'not-an-integer' }),
    );
    expect(() => cashVariance({ expectedCents: 100, countedCents: 100, thresholdPercent: -5 })).toThrow(
      expect.objectContaining({ code: 'negative' }),
    );
  });
});
