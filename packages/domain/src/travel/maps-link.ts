import { requireGeoPoint, type GeoPoint } from './haversine.ts';

/**
 * A link that opens directions to a point in the phone's maps app: Google's "Maps URLs" directions form
 * (https://www.google.com/maps/dir/?api=1&destination=lat,lng), documented as cross-platform — it opens the Google
 * Maps app on Android and iOS when installed and the browser otherwise (Google Maps Platform, "Get started with Maps
 * URLs", Directions action; from memory of that page). Coordinates rather than an address, so a venue's name never
 * sends the driver to a namesake. Six decimals are about 0.1 m, finer than any door.
 */
export function directionsUrl(to: GeoPoint): string {
  const point = requireGeoPoint(to, 'destination');
  const destination = `${point.lat.toFixed(6)},${point.lon.toFixed(6)}`;
  return `https://www.google.com/maps/dir/?api=1&destination=${encodeURIComponent(destination)}&travelmode=driving`;
}
