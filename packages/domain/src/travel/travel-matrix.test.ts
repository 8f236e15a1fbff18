import distance from '@turf/distance';
import { describe, expect, it } from 'vitest';
import { distanceMatrixKm, isSymmetric, travelMinutesMatrix, validateMatrix } from './travel-matrix.ts';

const points = [
  { lat: 52.52, lon: 13.405 },
  { lat: 52.4, lon: 13.5 },
  { lat: 52.6, lon: 13.2 },
];

describe('travel matrices', () => {
  it('distance matrix entries match @turf/distance, zero on the diagonal, symmetric', () => {
    const m = distanceMatrixKm(points);
    expect(m[0]?.[0]).toBe(0);
    expect(m[1]?.[2]).toBeCloseTo(distance([13.5, 52.4], [13.2, 52.6]), 9);
    expect(isSymmetric(m)).toBe(true);
  });

  it('travel minutes = km × detour ÷ speed × 60 (worked by hand)', () => {
    const km = distanceMatrixKm(points)[0]?.[1] ?? NaN;
    expect(travelMinutesMatrix(points, { speedKmh: 30, detourFactor: 1.5 })[0]?.[1]).toBeCloseTo(km * 3, 9);
  });

  it('refuses ragged, negative or non-finite matrices and nonsense speeds', () => {
    expect(() => validateMatrix([[0, 1], [1]])).toThrow(expect.objectContaining({ code: 'invalid-matrix' }));
    expect(() =>
      validateMatrix([
        [0, -1],
        [1, 0],
      ]),
    ).toThrow(expect.objectContaining({ code: 'invalid-matrix' }));
    expect(() =>
      validateMatrix([
        [0, NaN],
        [1, 0],
      ]),
    ).toThrow(expect.objectContaining({ code: 'invalid-matrix' }));
    expect(() => validateMatrix([])).toThrow(expect.objectContaining({ code: 'invalid-matrix' }));
    expect(() => travelMinutesMatrix(points, { speedKmh: 0 })).toThrow(expect.objectContaining({ field: 'speedKmh' }));
    expect(() => travelMinutesMatrix(points, { speedKmh: 30, detourFactor: 0.8 })).toThrow(
      expect.objectContaining({ code: 'out-of-range' }),
    );
  });
});
