import { CoordinateError } from '@/shared/geo/coordinate-error';

/** Southern limit of the UTM grid, degrees (80°S). */
export const UTM_SOUTH_LIMIT_DEG = -80;
/** Northern limit of the UTM grid, degrees (84°N). */
export const UTM_NORTH_LIMIT_DEG = 84;
/** How far the UTM grid overlaps the polar grids beyond those limits, degrees (30′). */
export const UTM_POLAR_OVERLAP_DEG = 0.5;

/**
 * Checks that a latitude lies inside the UTM area, 80°S to 84°N (both
 * limits included). Beyond them the polar grids (UPS) apply, which Kenning
 * does not read or write. Positions *read* from UTM may use the grid's 30′
 * overlap with the polar grids (80°30′S to 84°30′N), so that a position
 * written on a limit and rounded to the metre still reads back.
 *
 * @param latDeg - latitude, degrees north (already checked finite and within ±90°)
 * @param overlap - accept the 30′ polar overlap (default false)
 * @throws {CoordinateError} `outside-utm-area`
 *
 * Source: Lantmäteriet (Swedish mapping authority), "UTM" page: UPS is used
 * north of 84°N and south of 80°S; the same limits are DMA TM 8358.2's
 * (from memory). The overlap to 84.5°N and 80.5°S: apsalin.com UTM
 * converter notes ("extends to 84.5 N and 80.5 S to overlap with UPS").
 *
 * @example
 * checkUtmArea(61);   // returns nothing
 * checkUtmArea(84.2, true); // returns nothing (in the polar overlap)
 * checkUtmArea(86.5); // throws CoordinateError 'outside-utm-area'
 */
export function checkUtmArea(latDeg: number, overlap = false): void {
  const slack = overlap ? UTM_POLAR_OVERLAP_DEG : 0;
  if (latDeg < UTM_SOUTH_LIMIT_DEG - slack || latDeg > UTM_NORTH_LIMIT_DEG + slack) {
    const where = latDeg < 0 ? `${Math.abs(latDeg).toFixed(2)}°S` : `${latDeg.toFixed(2)}°N`;
    throw new CoordinateError(
      'outside-utm-area',
      'latitude',
      `${where} is outside UTM, which covers 80°S to 84°N; the polar grids (UPS) are not supported — use latitude and longitude there.`,
    );
  }
}
