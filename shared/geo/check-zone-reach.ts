import { CoordinateError } from '@/shared/geo/coordinate-error';
import { utmCentralMeridian } from '@/shared/geo/utm-central-meridian';
import { wrapLongitude } from '@/shared/geo/wrap-longitude';

/**
 * Farthest a position may lie from a zone's central meridian and still be
 * written in that zone's grid, degrees: the zone's own 3° half-width plus one
 * neighbouring zone (6°). It covers the widened Norway and Svalbard zones
 * (at most 6° from their central meridian) and positions carried into an
 * adjacent zone.
 */
export const MAX_ZONE_REACH_DEG = 9;

/**
 * Checks that a position belongs near enough to a UTM zone for its grid:
 * within {@link MAX_ZONE_REACH_DEG} of longitude of the central meridian,
 * and with an easting strictly between 0 and 1 000 000 m (six digits, as UTM
 * eastings are written).
 *
 * @param zone - UTM zone, integer 1–60
 * @param lonDeg - longitude of the position, degrees east
 * @param easting - the position's easting in that zone, metres
 * @throws {CoordinateError} `outside-zone`
 *
 * Source: none beyond the UTM layout (6° zones, false easting 500 000 m);
 * the 9° reach is Kenning's choice, explained above.
 *
 * @example
 * checkZoneReach(33, 16, 553_912); // returns nothing
 * checkZoneReach(33, 40, 1e6);     // throws CoordinateError 'outside-zone'
 */
export function checkZoneReach(zone: number, lonDeg: number, easting: number): void {
  const centralMeridian = utmCentralMeridian(zone);
  const offset = Math.abs(wrapLongitude(lonDeg - centralMeridian));
  const meridian = `${Math.abs(centralMeridian)}°${centralMeridian < 0 ? 'W' : 'E'}`;
  if (offset > MAX_ZONE_REACH_DEG) {
    throw new CoordinateError(
      'outside-zone',
      'zone',
      `The position is ${offset.toFixed(1)}° of longitude from zone ${zone}'s central meridian (${meridian}); ` +
        `a zone's grid is used only up to ${MAX_ZONE_REACH_DEG}° from it. Check the zone number and the easting.`,
    );
  }
  if (!(easting > 0 && easting < 1_000_000)) {
    throw new CoordinateError(
      'outside-zone',
      'easting',
      `In zone ${zone} the position would have an easting of ${Math.round(easting)} m, outside the 0–1 000 000 m a UTM grid is written in. ` +
        `Use the position's own zone.`,
    );
  }
}
