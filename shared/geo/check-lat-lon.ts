import { CoordinateError } from '@/shared/geo/coordinate-error';

/**
 * Checks that a WGS84 position is usable: both values finite, latitude in
 * −90…90°, longitude in −180…180° (both ends allowed). Nothing is wrapped:
 * a longitude of 190° is refused, not turned into −170°.
 *
 * @param latDeg - latitude, degrees north
 * @param lonDeg - longitude, degrees east
 * @throws {CoordinateError} `not-finite`, `latitude-out-of-range` or
 *   `longitude-out-of-range`
 *
 * Source: definition of geodetic latitude and longitude (common practice).
 *
 * @example
 * checkLatLon(61.2345, -149.8765); // returns nothing
 * checkLatLon(91, 0);              // throws CoordinateError 'latitude-out-of-range'
 */
export function checkLatLon(latDeg: number, lonDeg: number): void {
  if (typeof latDeg !== 'number' || !Number.isFinite(latDeg)) {
    throw new CoordinateError('not-finite', 'latitude', `Latitude must be a finite number of degrees, got ${String(latDeg)}.`);
  }
  if (typeof lonDeg !== 'number' || !Number.isFinite(lonDeg)) {
    throw new CoordinateError('not-finite', 'longitude', `Longitude must be a finite number of degrees, got ${String(lonDeg)}.`);
  }
  if (Math.abs(latDeg) > 90) {
    throw new CoordinateError(
      'latitude-out-of-range',
      'latitude',
      `Latitude ${latDeg}° is beyond 90°: latitudes run from 90°S (−90) to 90°N (90).`,
    );
  }
  if (Math.abs(lonDeg) > 180) {
    throw new CoordinateError(
      'longitude-out-of-range',
      'longitude',
      `Longitude ${lonDeg}° is beyond 180°: longitudes run from 180°W (−180) to 180°E (180).`,
    );
  }
}
