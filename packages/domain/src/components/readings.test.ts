import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { checkReading } from './readings.ts';
import { absoluteTolerance, percentTolerance } from './tolerance.ts';
import { toleranceForLetter } from './tolerance-letters.ts';

describe('checkReading (check values: common practice)', () => {
  it('600 Ω ±10 % read at 570 Ω passes, window 540–660 Ω', () => {
    const r = checkReading({ nominal: 600, tolerance: percentTolerance(10), measured: 570 });
    expect(r).toMatchObject({ verdict: 'pass', min: 540, max: 660, deviationPercent: -5, indicative: false });
  });

  it('100 kΩ read at exactly 100 kΩ passes with 0 % deviation', () => {
    expect(checkReading({ nominal: 100e3, tolerance: percentTolerance(1), measured: 100e3 })).toMatchObject({
      verdict: 'pass',
      deviationPercent: 0,
    });
  });

  it('edges are inclusive and floating-point safe: 10 % of 4.7k gives 4230–5170 exactly', () => {
    const tol = percentTolerance(10);
    expect(checkReading({ nominal: 4700, tolerance: tol, measured: 4230 })).toMatchObject({ verdict: 'pass', min: 4230, max: 5170 });
    expect(checkReading({ nominal: 4700, tolerance: tol, measured: 5170 }).verdict).toBe('pass');
    expect(checkReading({ nominal: 4700, tolerance: tol, measured: 4229.99 }).verdict).toBe('low');
    expect(checkReading({ nominal: 4700, tolerance: tol, measured: 5170.01 }).verdict).toBe('high');
    // 0.1 × 3 style noise: 1 % of 0.3 Ω; 0.297 and 0.303 are the edges as typed.
    expect(checkReading({ nominal: 0.3, tolerance: percentTolerance(1), measured: 0.297 }).verdict).toBe('pass');
    expect(checkReading({ nominal: 0.3, tolerance: percentTolerance(1), measured: 0.303 }).verdict).toBe('pass');
  });

  it('a low reading in circuit is indicative, not a definite fail; a high one stays definite (common practice)', () => {
    const low = checkReading({ nominal: 10e3, tolerance: percentTolerance(5), measured: 6_800, inCircuit: true });
    expect(low).toMatchObject({ verdict: 'low', indicative: true });
    expect(low.note).toMatch(/parallel/);
    const high = checkReading({ nominal: 10e3, tolerance: percentTolerance(5), measured: 12_000, inCircuit: true });
    expect(high).toMatchObject({ verdict: 'high', indicative: false });
  });

  it('takes asymmetric and absolute tolerances (Z +80/−20 %, IEC 60062)', () => {
    const z = checkReading({ nominal: 100e-9, tolerance: toleranceForLetter('Z'), measured: 175e-9 });
    expect(z).toMatchObject({ verdict: 'pass', min: 80e-9, max: 180e-9 });
    const abs = checkReading({ nominal: 4.7e-12, tolerance: absoluteTolerance(0.25e-12), measured: 5e-12 });
    expect(abs.verdict).toBe('high');
  });

  it('refuses a negative tolerance, a zero nominal, and NaN readings', () => {
    expect(() => checkReading({ nominal: 600, tolerance: percentTolerance(-10), measured: 570 })).toThrow(
      expect.objectContaining({ code: 'negative', field: 'tolerance' }),
    );
    expect(() => checkReading({ nominal: 600, tolerance: { kind: 'percent', plus: 5, minus: -5 }, measured: 570 })).toThrow(
      expect.objectContaining({ code: 'negative' }),
    );
    expect(() => checkReading({ nominal: 0, tolerance: percentTolerance(5), measured: 1 })).toThrow(
      expect.objectContaining({ field: 'nominal' }),
    );
    expect(() => checkReading({ nominal: 600, tolerance: percentTolerance(5), measured: NaN })).toThrow(
      expect.objectContaining({ code: 'not-a-number', field: 'measured' }),
    );
    expect(() => percentTolerance(120)).toThrow(expect.objectContaining({ code: 'out-of-range' }));
  });

  it('agrees with exact integer arithmetic on whole-number readings (property)', () => {
    // Oracle: measured is in [n(100−p)/100, n(100+p)/100] ⇔ 100·m ≥ n(100−p) and 100·m ≤ n(100+p), in integers.
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 10_000_000 }),
        fc.integer({ min: 0, max: 50 }),
        fc.integer({ min: 0, max: 20_000_000 }),
        (nominal, percent, measured) => {
          const expected =
            100 * measured < nominal * (100 - percent) ? 'low' : 100 * measured > nominal * (100 + percent) ? 'high' : 'pass';
          expect(checkReading({ nominal, tolerance: percentTolerance(percent), measured }).verdict).toBe(expected);
        },
      ),
    );
  });

  it('a reading exactly at an edge written in decimals always passes (property)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 99_999 }),
        fc.integer({ min: -3, max: 6 }),
        fc.constantFrom(0.1, 0.25, 0.5, 1, 2, 5, 10, 20),
        (digits, exp, p) => {
          const nominal = Number(`${digits}e${exp}`);
          const edge = Number((nominal * (1 - p / 100)).toPrecision(12));
          expect(checkReading({ nominal, tolerance: percentTolerance(p), measured: edge }).verdict).toBe('pass');
        },
      ),
    );
  });
});
