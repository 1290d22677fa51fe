import { projectAzimuthalEquidistant } from '@/shared/geo/azimuthal-equidistant';
import type { LatLon } from '@/shared/geo/types';
import { FixError } from './fix-error';
import { offsetPoint } from './offset-point';
import type { BearingLine } from './types';

/** Bearings crossing farther than this from either post are refused (no lookout sees 500 km), metres. */
export const MAX_FIX_DISTANCE_M = 500_000;

/** Lines closer than this to parallel (sine of the angle between them) have no usable crossing. */
const MIN_SIN_CROSSING = Math.sin((0.05 * Math.PI) / 180);

/**
 * A first estimate of where two bearings cross: both lines drawn straight in
 * the azimuthal equidistant plane centred on the first line's origin (exact
 * for the first bearing, off by the projection's azimuth distortion at the
 * second — fractions of a degree over a lookout network), intersected there.
 * `intersectBearings` refines it on the ellipsoid.
 *
 * Source: plane intersection of two rays (common practice, no source); the
 * projection as in `shared/geo/azimuthal-equidistant.ts` (Snyder 1987; Karney 2013).
 *
 * @param a first line (radians)
 * @param b second line (radians)
 * @param indexes the two lines' indexes in the caller's list, for errors
 * @returns the crossing, WGS84 degrees
 * @throws {FixError} `same-position` (origins within 1 m), `parallel` (within 0.05° of parallel), `diverging` (the lines cross behind a post),
 *   `too-far` (beyond {@link MAX_FIX_DISTANCE_M})
 * @example
 * planarCrossing(
 *   { from: { latDeg: 0, lonDeg: 0 }, bearingRad: Math.PI / 4, sigmaRad: 0.01 },
 *   { from: { latDeg: 0, lonDeg: 0.2 }, bearingRad: -Math.PI / 4, sigmaRad: 0.01 },
 * ); // ≈ { latDeg: 0.1, lonDeg: 0.1 }
 */
export function planarCrossing(a: BearingLine, b: BearingLine, indexes: readonly [number, number] = [0, 1]): LatLon {
  const [[bx, by]] = projectAzimuthalEquidistant(a.from, [b.from]) as [[number, number]];
  if (Math.hypot(bx, by) < 1) {
    throw new FixError('same-position', 'These bearings were taken from the same place: they cannot fix a position.', indexes);
  }
  const ux = Math.sin(a.bearingRad);
  const uy = Math.cos(a.bearingRad);
  const vx = Math.sin(b.bearingRad);
  const vy = Math.cos(b.bearingRad);
  const cross = ux * vy - uy * vx;
  if (Math.abs(cross) < MIN_SIN_CROSSING) {
    throw new FixError('parallel', 'These bearings are (nearly) parallel: they do not cross at a usable point.', indexes);
  }
  // a.from + t·u = b.from + s·v
  const t = (bx * vy - by * vx) / cross;
  const s = (bx * uy - by * ux) / cross;
  if (t <= 0 || s <= 0) {
    throw new FixError('diverging', 'These bearings do not cross ahead of both posts: they point apart.', indexes);
  }
  if (t > MAX_FIX_DISTANCE_M || s > MAX_FIX_DISTANCE_M) {
    throw new FixError(
      'too-far',
      `These bearings cross more than ${MAX_FIX_DISTANCE_M / 1000} km away: they are too close to parallel to fix a position.`,
      indexes,
    );
  }
  return offsetPoint(a.from, t * ux, t * uy);
}
