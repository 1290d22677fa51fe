import { CoordinateError } from '@/shared/geo/coordinate-error';

/** Southern limit of the UTM grid, degrees (80°S). */
export const UTM_SOUTH_LIMIT_DEG = -80;
/** Northern limit of the UTM grid, degrees (84°N). */
export const UTM_NORTH_LIMIT_DEG = 84;

/**
 * Checks that a latitude lies inside the UTM area, 80°S to 84°N (both
 * limits included). Beyond them the polar grids (UPS) apply, which Kenning
 * does not read or write.
 *
 * @param latDeg - latitude, degrees north (already checked finite and within ±90°)
 * @throws {CoordinateError} `outside-utm-area`
 *
 * Source: Lantmäteriet (Swedish mapping authority), "UTM" page: UPS is used
 * north of 84°N and south of 80°S; the same limits are DMA TM 8358.2's
 * (from memory).
 *
 * @example
 * checkUtmArea(61);   // returns nothing
 * checkUtmArea(86.5); // throws CoordinateError 'outside-utm-area'
 */
export function checkUtmArea(latDeg: number): void {
  if (latDeg < UTM_SOUTH_LIMIT_DEG || latDeg > UTM_NORTH_LIMIT_DEG) {
    const where = latDeg < 0 ? `${Math.abs(latDeg).toFixed(2)}°S` : `${latDeg.toFixed(2)}°N`;
    throw new CoordinateError(
      'outside-utm-area',
      'latitude',
      `${where} is outside UTM, which covers 80°S to 84°N; the polar grids (UPS) are not supported — use latitude and longitude there.`,
    );
  }
}
