import { checkLatLon } from '@/shared/geo/check-lat-lon';
import { checkUtmArea } from '@/shared/geo/check-utm-area';
import { checkZoneReach } from '@/shared/geo/check-zone-reach';
import { CoordinateError } from '@/shared/geo/coordinate-error';
import { latitudeBand } from '@/shared/geo/latitude-band';
import type { LatLon, UtmPosition } from '@/shared/geo/types';
import { utmProjection } from '@/shared/geo/utm-projection';
import { utmZoneFor } from '@/shared/geo/utm-zone-for';

/**
 * Converts a WGS84 position to UTM: zone, hemisphere (`N` from the equator
 * northward, `S` south of it), easting and northing in metres (not rounded),
 * MGRS latitude band and EPSG code (32600 + zone north, 32700 + zone south).
 *
 * @param point - `{ latDeg, lonDeg }`, degrees; latitude within 80°S…84°N
 * @param zone - force this zone (integer 1–60) instead of the position's own
 *   (default: {@link utmZoneFor}, with the Norway/Svalbard exceptions); the
 *   position must lie within 9° of longitude of its central meridian
 * @returns a new object; `point` is not changed
 * @throws {CoordinateError} `not-finite`, `latitude-out-of-range`,
 *   `longitude-out-of-range`, `outside-utm-area`, `unknown-zone`, `outside-zone`
 *
 * Source: the projection is proj4's UTM on WGS84 (see `utmProjection`); EPSG
 * codes per the EPSG registry's "WGS 84 / UTM zone NN N|S" series, as proj4
 * defines them (EPSG:32633 = zone 33 north, EPSG:32733 = zone 33 south).
 *
 * @example
 * toUtm({ latDeg: 33.3, lonDeg: 44.4 });
 * // { zone: 38, hemisphere: 'N', band: 'S', easting: 444140.54…, northing: 3684706.36…, epsg: 32638 }
 */
export function toUtm(point: LatLon, zone?: number): UtmPosition {
  const { latDeg, lonDeg } = point;
  checkLatLon(latDeg, lonDeg);
  checkUtmArea(latDeg);
  if (zone !== undefined && !(Number.isInteger(zone) && zone >= 1 && zone <= 60)) {
    throw new CoordinateError('unknown-zone', 'zone', `UTM zones are whole numbers from 1 to 60; ${String(zone)} is not one.`);
  }
  const useZone = zone ?? utmZoneFor(latDeg, lonDeg);
  const hemisphere = latDeg >= 0 ? 'N' : 'S';
  const [easting, northing] = utmProjection(useZone, hemisphere).forward([lonDeg, latDeg]);
  checkZoneReach(useZone, lonDeg, easting);
  return {
    zone: useZone,
    hemisphere,
    band: latitudeBand(latDeg),
    easting,
    northing,
    epsg: (hemisphere === 'N' ? 32600 : 32700) + useZone,
  };
}
