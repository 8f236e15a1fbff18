import { describe, expect, it } from 'vitest';
import { absoluteTolerance, percentTolerance, toleranceWindow } from './tolerance.ts';

describe('toleranceWindow', () => {
  it('percent, asymmetric and absolute windows (worked by hand)', () => {
    expect(toleranceWindow(4700, percentTolerance(10))).toEqual({ min: 4230, max: 5170 });
    expect(toleranceWindow(100, percentTolerance({ plus: 80, minus: 20 }))).toEqual({ min: 80, max: 180 });
    expect(toleranceWindow(4.7e-12, absoluteTolerance(0.25e-12))).toEqual({ min: 4.45e-12, max: 4.95e-12 });
  });

  it('refuses negative and impossible tolerances', () => {
    expect(() => percentTolerance(-1)).toThrow(expect.objectContaining({ code: 'negative', field: 'tolerance' }));
    expect(() => absoluteTolerance({ plus: 1, minus: -1 })).toThrow(expect.objectContaining({ field: 'tolerance.minus' }));
    expect(() => percentTolerance(101)).toThrow(expect.objectContaining({ code: 'out-of-range' }));
    expect(() => toleranceWindow(100, { kind: 'ppm' } as never)).toThrow(expect.objectContaining({ code: 'missing-input' }));
  });
});
