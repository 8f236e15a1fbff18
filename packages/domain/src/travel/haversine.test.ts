import distance from '@turf/distance';
import fc from 'fast-check';
import { Geodesic } from 'geographiclib-geodesic';
import { describe, expect, it } from 'vitest';
import { EARTH_MEAN_RADIUS_KM, haversineKm } from './haversine.ts';

const point = fc.record({
  lat: fc.double({ min: -90, max: 90, noNaN: true }),
  lon: fc.double({ min: -180, max: 180, noNaN: true }),
});

describe('haversineKm', () => {
  it('1° of latitude is 111.195 km on R1 = 6371.0088 km (Moritz, Geodetic Reference System 1980, Bulletin Géodésique 54, 1980)', () => {
    expect(EARTH_MEAN_RADIUS_KM).toBe(6371.0088);
    expect(haversineKm({ lat: 0, lon: 0 }, { lat: 1, lon: 0 })).toBeCloseTo(111.195, 3);
  });

  it('near-antipodal points: agrees with @turf/distance to a micrometre', () => {
    const a = { lat: -6.037091348628667e-7, lon: 0 };
    const b = { lat: 0, lon: -179.9998378953848 };
    expect(Math.abs(haversineKm(a, b) - distance([a.lon, a.lat], [b.lon, b.lat]))).toBeLessThan(1e-9);
  });

  it('a quarter meridian and a half circumference (πR/2, πR)', () => {
    expect(haversineKm({ lat: 0, lon: 0 }, { lat: 90, lon: 0 })).toBeCloseTo((Math.PI * 6371.0088) / 2, 6);
    expect(haversineKm({ lat: 0, lon: 0 }, { lat: 0, lon: 180 })).toBeCloseTo(Math.PI * 6371.0088, 6);
  });

  it('agrees with @turf/distance, which uses the same radius (property)', () => {
    fc.assert(
      fc.property(point, point, (a, b) => {
        const turf = distance([a.lon, a.lat], [b.lon, b.lat], { units: 'kilometers' });
        expect(Math.abs(haversineKm(a, b) - turf)).toBeLessThanOrEqual(1e-9 * Math.max(1, turf));
      }),
      { numRuns: 5000 },
    );
  });

  it('is within 0.6 % of the WGS84 ellipsoidal geodesic (geographiclib-geodesic; the sphere errs by up to ≈0.56 %)', () => {
    fc.assert(
      fc.property(point, point, (a, b) => {
        const s = (Geodesic.WGS84.Inverse(a.lat, a.lon, b.lat, b.lon).s12 ?? NaN) / 1000;
        fc.pre(s > 0.01);
        expect(Math.abs(haversineKm(a, b) / s - 1)).toBeLessThan(0.006);
      }),
      { numRuns: 2000 },
    );
  });

  it('across a city (Berlin Alexanderplatz to Zoologischer Garten) it is within 0.5 % of the ellipsoid', () => {
    const alex = { lat: 52.5219, lon: 13.4132 };
    const zoo = { lat: 52.5069, lon: 13.3323 };
    const s = (Geodesic.WGS84.Inverse(alex.lat, alex.lon, zoo.lat, zoo.lon).s12 ?? NaN) / 1000;
    expect(Math.abs(haversineKm(alex, zoo) / s - 1)).toBeLessThan(0.005);
  });

  it('refuses latitudes and longitudes out of range, and NaN', () => {
    expect(() => haversineKm({ lat: 91, lon: 0 }, { lat: 0, lon: 0 })).toThrow(
      expect.objectContaining({ code: 'out-of-range', field: 'from.lat' }),
    );
    expect(() => haversineKm({ lat: 0, lon: 0 }, { lat: 0, lon: 181 })).toThrow(expect.objectContaining({ field: 'to.lon' }));
    expect(() => haversineKm({ lat: NaN, lon: 0 }, { lat: 0, lon: 0 })).toThrow(expect.objectContaining({ code: 'not-a-number' }));
  });
});
