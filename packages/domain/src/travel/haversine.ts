import { DomainError } from '../errors.ts';
import { requireInRange } from '../input-checks.ts';

/**
 * Great-circle distance by the haversine formula on a sphere of the IUGG mean Earth radius
 * R1 = 6371.0088 km (Moritz, "Geodetic Reference System 1980": R1 = (2a + b) / 3). Good to about 0.5 % against the
 * ellipsoid, far better than road distance is to a straight line, and cheap enough for every pair of stops.
 */

export const EARTH_MEAN_RADIUS_KM = 6371.0088;

export interface GeoPoint {
  lat: number;
  lon: number;
}

export function requireGeoPoint(point: GeoPoint, field = 'point'): GeoPoint {
  if (point === null || typeof point !== 'object') {
    throw new DomainError('missing-input', `${field} must have lat and lon`, field);
  }
  return {
    lat: requireInRange(point.lat, -90, 90, `${field}.lat`),
    lon: requireInRange(point.lon, -180, 180, `${field}.lon`),
  };
}

const RADIANS = Math.PI / 180;

export function haversineKm(from: GeoPoint, to: GeoPoint): number {
  const a = requireGeoPoint(from, 'from');
  const b = requireGeoPoint(to, 'to');
  const dLat = (b.lat - a.lat) * RADIANS;
  const dLon = (b.lon - a.lon) * RADIANS;
  const h = Math.sin(dLat / 2) ** 2 + Math.cos(a.lat * RADIANS) * Math.cos(b.lat * RADIANS) * Math.sin(dLon / 2) ** 2;
  // The atan2 form stays accurate near antipodal points, where asin(√h) loses precision (and h may round above 1).
  const clamped = Math.min(1, h);
  return 2 * EARTH_MEAN_RADIUS_KM * Math.atan2(Math.sqrt(clamped), Math.sqrt(1 - clamped));
}
