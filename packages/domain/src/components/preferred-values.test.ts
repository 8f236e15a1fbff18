import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { E_SERIES, isPreferredValue, nearestPreferredValue, seriesValues, type ESeries } from './preferred-values.ts';

// IEC 60063:2015, Table 1 (E6 to E24) and Table 2 (E48, E96); table numbers and values from memory.
const E6 = [1.0, 1.5, 2.2, 3.3, 4.7, 6.8];
const E12 = [1.0, 1.2, 1.5, 1.8, 2.2, 2.7, 3.3, 3.9, 4.7, 5.6, 6.8, 8.2];
const E24 = [1.0, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2.0, 2.2, 2.4, 2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 5.1, 5.6, 6.2, 6.8, 7.5, 8.2, 9.1];
const E96 = [
  1.0, 1.02, 1.05, 1.07, 1.1, 1.13, 1.15, 1.18, 1.21, 1.24, 1.27, 1.3, 1.33, 1.37, 1.4, 1.43, 1.47, 1.5, 1.54, 1.58, 1.62, 1.65, 1.69, 1.74,
  1.78, 1.82, 1.87, 1.91, 1.96, 2.0, 2.05, 2.1, 2.15, 2.21, 2.26, 2.32, 2.37, 2.43, 2.49, 2.55, 2.61, 2.67, 2.74, 2.8, 2.87, 2.94, 3.01,
  3.09, 3.16, 3.24, 3.32, 3.4, 3.48, 3.57, 3.65, 3.74, 3.83, 3.92, 4.02, 4.12, 4.22, 4.32, 4.42, 4.53, 4.64, 4.75, 4.87, 4.99, 5.11, 5.23,
  5.36, 5.49, 5.62, 5.76, 5.9, 6.04, 6.19, 6.34, 6.49, 6.65, 6.81, 6.98, 7.15, 7.32, 7.5, 7.68, 7.87, 8.06, 8.25, 8.45, 8.66, 8.87, 9.09,
  9.31, 9.53, 9.76,
];

describe('E-series tables (IEC 60063)', () => {
  it('E6, E12 and E24 match the standard', () => {
    expect(seriesValues('E6')).toEqual(E6);
    expect(seriesValues('E12')).toEqual(E12);
    expect(seriesValues('E24')).toEqual(E24);
  });

  it('E24 is not the rounded geometric series: the standard keeps historical values (IEC 60063:2015, Table 1)', () => {
    const formula = Array.from({ length: 24 }, (_, i) => Math.round(10 ** (i / 24) * 10) / 10);
    const differs = E24.filter((v, i) => v !== formula[i]);
    expect(differs).toEqual([2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 8.2]);
  });

  it('E96 matches the published table (from memory), 96 values', () => {
    expect(E96).toHaveLength(96);
    expect(seriesValues('E96')).toEqual(E96);
  });

  it('E48 is every second E96 value (IEC 60063 construction)', () => {
    expect(seriesValues('E48')).toEqual(E96.filter((_, i) => i % 2 === 0));
  });

  it('each coarser series is contained in the next finer (E6 ⊂ E12 ⊂ E24, E48 ⊂ E96)', () => {
    expect(E6.every((v) => E12.includes(v))).toBe(true);
    expect(E12.every((v) => E24.includes(v))).toBe(true);
  });
});

describe('nearestPreferredValue', () => {
  it('picks by ratio, in any decade', () => {
    expect(nearestPreferredValue(4_650, 'E12')).toBe(4_700);
    expect(nearestPreferredValue(2.44, 'E12')).toBe(2.7); // nearer 2.2 by difference, nearer 2.7 by ratio
    expect(nearestPreferredValue(9.8, 'E12')).toBe(10); // rounds into the next decade
    expect(nearestPreferredValue(0.00123, 'E96')).toBe(0.00124);
    expect(nearestPreferredValue(330e3, 'E24')).toBe(330e3);
  });

  it('a value exactly between two neighbours by ratio is a tie, and the lower neighbour wins (our rule)', () => {
    // √(1.5 × 2.2) ≈ 1.8166 is as far from 1.5 as from 2.2 by ratio; IEC 60063 sets no rule for ties.
    expect(nearestPreferredValue(Math.sqrt(1.5 * 2.2), 'E6')).toBe(1.5);
    expect(nearestPreferredValue(Math.sqrt(1.5 * 2.2) * (1 + 1e-9), 'E6')).toBe(2.2);
    // The midpoint by difference, 1.85, is no tie: by ratio it is nearer 2.2 (2.2/1.85 = 1.189 < 1.85/1.5 = 1.233).
    expect(nearestPreferredValue(1.85, 'E6')).toBe(2.2);
    // Every neighbouring pair of every series (the decade's top value next to 10 included), in several decades.
    const pairs = E_SERIES.flatMap((series) => {
      const decade = [...seriesValues(series), 10];
      return [-3, 0, 4].flatMap((e) =>
        decade.slice(1).map((upper, i) => ({ series, lower: Number(`${decade[i]}e${e}`), upper: Number(`${upper}e${e}`) })),
      );
    });
    expect(pairs).toHaveLength(3 * (6 + 12 + 24 + 48 + 96));
    for (const { series, lower, upper } of pairs) {
      expect(nearestPreferredValue(Math.sqrt(lower * upper), series)).toBe(lower);
      expect(nearestPreferredValue(Math.sqrt(lower * upper) * (1 + 1e-9), series)).toBe(upper);
    }
  });

  it('rounds up or down when asked', () => {
    expect(nearestPreferredValue(4_701, 'E12', 'up')).toBe(5_600);
    expect(nearestPreferredValue(4_699, 'E12', 'down')).toBe(3_900);
    expect(nearestPreferredValue(4_700, 'E12', 'up')).toBe(4_700);
    expect(nearestPreferredValue(9.5, 'E6', 'up')).toBe(10);
    expect(nearestPreferredValue(1.2, 'E6', 'down')).toBe(1.0);
  });

  it('refuses bad input', () => {
    expect(() => nearestPreferredValue(0, 'E12')).toThrow(expect.objectContaining({ code: 'out-of-range' }));
    expect(() => nearestPreferredValue(-47, 'E12')).toThrow(expect.objectContaining({ code: 'negative' }));
    expect(() => nearestPreferredValue(NaN, 'E12')).toThrow(expect.objectContaining({ code: 'not-a-number' }));
    expect(() => nearestPreferredValue(47, 'E7' as ESeries)).toThrow(expect.objectContaining({ code: 'unknown-code' }));
  });

  it('properties: members map to themselves; any value lands on a member no further than the widest half-step', () => {
    fc.assert(
      fc.property(fc.constantFrom(...E_SERIES), fc.double({ min: 1e-3, max: 1e9, noNaN: true }), (series, value) => {
        const decade = seriesValues(series);
        const nearest = nearestPreferredValue(value, series);
        expect(isPreferredValue(nearest, series)).toBe(true);
        const steps = [...decade, 10].slice(1).map((v, i) => v / (decade[i] ?? 1));
        const widest = Math.max(...steps);
        expect(Math.max(nearest / value, value / nearest)).toBeLessThanOrEqual(Math.sqrt(widest) * (1 + 1e-12));
        const up = nearestPreferredValue(value, series, 'up');
        const down = nearestPreferredValue(value, series, 'down');
        expect(down).toBeLessThanOrEqual(value);
        expect(up).toBeGreaterThanOrEqual(value);
        expect([up, down]).toContain(nearest);
      }),
    );
  });
});
