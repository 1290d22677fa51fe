/**
 * Wraps a longitude into −180° ≤ λ < 180° (so 180°E comes back as −180°).
 *
 * @param lonDeg - longitude, degrees east, any finite value
 * @returns the same meridian, degrees east, in [−180, 180)
 *
 * Source: longitude is periodic in 360° (common practice).
 *
 * @example
 * wrapLongitude(190);  // -170
 * wrapLongitude(-180); // -180
 */
export function wrapLongitude(lonDeg: number): number {
  const wrapped = ((((lonDeg + 180) % 360) + 360) % 360) - 180;
  return wrapped === 0 ? 0 : wrapped;
}
