import { wrap360Deg } from './angles';

/**
 * A magnetic bearing turned into a true bearing with the magnetic
 * declination (variation) at the post and date: true = magnetic +
 * declination, declination east positive. A true bearing passes through.
 * Degrees in and out (this is an edge: people read compasses in degrees).
 *
 * Source: NOAA NCEI, "Magnetic declination" (the convention east positive,
 * true = magnetic + declination) — common practice of land and sea
 * navigation (from memory).
 *
 * @param bearingDeg the bearing as read, degrees
 * @param reference `true` or `magnetic`
 * @param declinationDeg declination, degrees, east positive (required for magnetic)
 * @returns the true bearing, degrees 0…360
 * @throws {RangeError} for a magnetic bearing without a finite declination
 * @example
 * trueBearingDeg(350, 'magnetic', 12); // 2
 */
export function trueBearingDeg(bearingDeg: number, reference: 'true' | 'magnetic', declinationDeg?: number): number {
  if (reference === 'true') return wrap360Deg(bearingDeg);
  if (declinationDeg === undefined || !Number.isFinite(declinationDeg)) {
    throw new RangeError('A magnetic bearing needs the declination at the post and date.');
  }
  return wrap360Deg(bearingDeg + declinationDeg);
}
