import { checkUtmArea } from '@/shared/geo/check-utm-area';
import { checkZoneReach } from '@/shared/geo/check-zone-reach';
import { CoordinateError } from '@/shared/geo/coordinate-error';
import type { LatLon, UtmCoordinate } from '@/shared/geo/types';
import { utmProjection } from '@/shared/geo/utm-projection';
import { wrapLongitude } from '@/shared/geo/wrap-longitude';

/**
 * Converts a UTM grid position on WGS84 to latitude and longitude.
 *
 * The easting must lie strictly between 0 and 1 000 000 m, the northing
 * between 0 and 10 000 000 m; the position must fall inside the UTM area
 * with its polar overlap (80°30′S–84°30′N) and within 9° of longitude of
 * the zone's central meridian.
 *
 * @param utm - `{ zone, hemisphere, easting, northing }`; zone integer 1–60,
 *   hemisphere `N`/`S`, easting and northing in metres
 * @returns a new `{ latDeg, lonDeg }` in degrees, longitude in [−180, 180)
 * @throws {CoordinateError} `unknown-zone`, `unknown-zone-letter`,
 *   `not-finite`, `easting-out-of-range`, `northing-out-of-range`,
 *   `outside-utm-area`, `outside-zone`
 *
 * Source: proj4's inverse UTM on WGS84 (see `utmProjection`).
 *
 * @example
 * fromUtm({ zone: 38, hemisphere: 'N', easting: 444140.54, northing: 3684706.36 });
 * // { latDeg: 33.30000004, lonDeg: 44.39999995 }
 */
export function fromUtm(utm: UtmCoordinate): LatLon {
  const { zone, hemisphere, easting, northing } = utm;
  if (!(Number.isInteger(zone) && zone >= 1 && zone <= 60)) {
    throw new CoordinateError('unknown-zone', 'zone', `UTM zones are whole numbers from 1 to 60; ${String(zone)} is not one.`);
  }
  if (hemisphere !== 'N' && hemisphere !== 'S') {
    throw new CoordinateError('unknown-zone-letter', 'zone', `The hemisphere must be N or S, got ${String(hemisphere)}.`);
  }
  if (typeof easting !== 'number' || !Number.isFinite(easting)) {
    throw new CoordinateError('not-finite', 'easting', `The easting must be a finite number of metres, got ${String(easting)}.`);
  }
  if (typeof northing !== 'number' || !Number.isFinite(northing)) {
    throw new CoordinateError(
      'not-finite',
      'northing',
      `The northing must be a finite number of metres, got ${String(northing)}.`,
    );
  }
  if (!(easting > 0 && easting < 1_000_000)) {
    throw new CoordinateError(
      'easting-out-of-range',
      'easting',
      `Easting ${easting} m is not a UTM easting: eastings lie between 0 and 1 000 000 m (500 000 m on the zone's central meridian).`,
    );
  }
  if (!(northing >= 0 && northing <= 10_000_000)) {
    throw new CoordinateError(
      'northing-out-of-range',
      'northing',
      `Northing ${northing} m is not a UTM northing: northings lie between 0 and 10 000 000 m.`,
    );
  }
  const [lonRaw, latDeg] = utmProjection(zone, hemisphere).inverse([easting, northing]);
  checkUtmArea(latDeg, true);
  const lonDeg = wrapLongitude(lonRaw);
  checkZoneReach(zone, lonDeg, easting);
  return { latDeg, lonDeg };
}
