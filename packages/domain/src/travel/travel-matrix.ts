import { DomainError } from '../errors.ts';
import { requirePositive } from '../input-checks.ts';
import { haversineKm, requireGeoPoint, type GeoPoint } from './haversine.ts';

/**
 * Square matrices of distance or travel time between stops, index 0 usually the start. Any source will do (haversine
 * here, a road-routing service elsewhere), so the planner can also be checked on TSPLIB instances.
 */

export type Matrix = readonly (readonly number[])[];

export function validateMatrix(matrix: Matrix, field = 'matrix'): Matrix {
  if (!Array.isArray(matrix) || matrix.length === 0) {
    throw new DomainError('invalid-matrix', `${field} must be a non-empty square list of rows`, field);
  }
  const n = matrix.length;
  matrix.forEach((row, i) => {
    if (!Array.isArray(row) || row.length !== n) {
      throw new DomainError('invalid-matrix', `${field} row ${i} has ${Array.isArray(row) ? row.length : 0} entries, expected ${n}`, field);
    }
    row.forEach((value, j) => {
      if (typeof value !== 'number' || !Number.isFinite(value) || value < 0) {
        throw new DomainError('invalid-matrix', `${field}[${i}][${j}] must be a finite, non-negative number (got ${value})`, field);
      }
    });
  });
  return matrix;
}

export function isSymmetric(matrix: Matrix): boolean {
  for (let i = 0; i < matrix.length; i++) {
    for (let j = i + 1; j < matrix.length; j++) {
      if (matrix[i]?.[j] !== matrix[j]?.[i]) return false;
    }
  }
  return true;
}

export function distanceMatrixKm(points: readonly GeoPoint[]): number[][] {
  if (!Array.isArray(points)) throw new DomainError('missing-input', 'points must be a list', 'points');
  const checked = points.map((p, i) => requireGeoPoint(p, `points[${i}]`));
  return checked.map((a) => checked.map((b) => haversineKm(a, b)));
}

export interface TravelEstimate {
  /** Average road speed, km/h. */
  speedKmh: number;
  /** Road distance over straight-line distance; about 1.2–1.4 in towns (common practice). Default 1.3. */
  detourFactor?: number;
}

/** Travel minutes estimated from straight-line distance, for when no road-routing service is to hand. */
export function travelMinutesMatrix(points: readonly GeoPoint[], estimate: TravelEstimate): number[][] {
  const speed = requirePositive(estimate?.speedKmh, 'speedKmh');
  const detour = estimate.detourFactor === undefined ? 1.3 : requirePositive(estimate.detourFactor, 'detourFactor');
  if (detour < 1)
    throw new DomainError('out-of-range', `a road cannot be shorter than the straight line (detour ${detour})`, 'detourFactor');
  return distanceMatrixKm(points).map((row) => row.map((km) => ((km * detour) / speed) * 60));
}
