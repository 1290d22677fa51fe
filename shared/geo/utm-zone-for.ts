import { checkLatLon } from '@/shared/geo/check-lat-lon';
import { checkUtmArea } from '@/shared/geo/check-utm-area';

/**
 * The standard UTM zone (1–60) of a WGS84 position, with the Norway and
 * Svalbard exceptions:
 * - 56°N–64°N: zone 32 is widened west to 3°E (so 3°E–12°E is zone 32);
 * - 72°N–84°N: zones 31 (0°–9°E), 33 (9°E–21°E), 35 (21°E–33°E) and
 *   37 (33°E–42°E) are widened, and zones 32, 34 and 36 are not used.
 *
 * Zones are 6° wide from 180°W, each zone's western edge belonging to it;
 * 180°E is the same meridian as 180°W and gets zone 1.
 *
 * @param latDeg - latitude, degrees north, within 80°S…84°N
 * @param lonDeg - longitude, degrees east, −180…180
 * @returns zone number 1–60
 * @throws {CoordinateError} `not-finite`, `latitude-out-of-range`,
 *   `longitude-out-of-range`, or `outside-utm-area` beyond 80°S/84°N
 *
 * Source: DMA TM 8358.1, chapter 3 (UTM zones and the grid-zone exceptions
 * 32V and 31X–37X); the exceptions as summarised in Apache SIS issue SIS-353.
 *
 * @example
 * utmZoneFor(61.2345, -149.8765); // 6
 * utmZoneFor(60, 4);              // 32 (southwest Norway)
 * utmZoneFor(78, 20);             // 33 (Svalbard)
 */
export function utmZoneFor(latDeg: number, lonDeg: number): number {
  checkLatLon(latDeg, lonDeg);
  checkUtmArea(latDeg);
  const lon = lonDeg >= 180 ? lonDeg - 360 : lonDeg;
  const zone = Math.min(Math.floor((lon + 180) / 6) + 1, 60);

  if (latDeg >= 56 && latDeg < 64 && lon >= 3 && lon < 12) return 32;
  if (latDeg >= 72) {
    if (lon >= 0 && lon < 9) return 31;
    if (lon >= 9 && lon < 21) return 33;
    if (lon >= 21 && lon < 33) return 35;
    if (lon >= 33 && lon < 42) return 37;
  }
  return zone;
}
