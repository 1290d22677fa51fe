import { checkUtmArea } from '@/shared/geo/check-utm-area';
import { CoordinateError } from '@/shared/geo/coordinate-error';

/** MGRS latitude band letters from south to north: 8° each from 80°S, X is 12° (72°N–84°N). */
export const LATITUDE_BANDS = 'CDEFGHJKLMNPQRSTUVWX';

/**
 * The MGRS latitude band letter of a latitude: C for 80°S–72°S up to X for
 * 72°N–84°N, skipping I and O. A latitude on a band edge belongs to the band
 * to its north; 84°N itself is in X.
 *
 * @param latDeg - latitude, degrees north, within 80°S…84°N
 * @returns one of `CDEFGHJKLMNPQRSTUVWX`
 * @throws {CoordinateError} `not-finite`, or `outside-utm-area` beyond 80°S/84°N
 *
 * Source: DMA TM 8358.1 (Datums, Ellipsoids, Grids, and Grid Reference
 * Systems), chapter 3, grid zone designations; band table as reprinted in the
 * PCI Geomatics help page "UTM GRID ZONES".
 *
 * @example
 * latitudeBand(61.2);  // 'V' (56°N–64°N)
 * latitudeBand(-33.9); // 'H' (40°S–32°S)
 */
export function latitudeBand(latDeg: number): string {
  if (typeof latDeg !== 'number' || !Number.isFinite(latDeg)) {
    throw new CoordinateError('not-finite', 'latitude', `Latitude must be a finite number of degrees, got ${String(latDeg)}.`);
  }
  checkUtmArea(latDeg);
  const index = Math.min(Math.floor((latDeg + 80) / 8), LATITUDE_BANDS.length - 1);
  return LATITUDE_BANDS.charAt(index);
}
