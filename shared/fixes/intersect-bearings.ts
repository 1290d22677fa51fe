import type { LatLon } from '@/shared/geo/types';
import { adjustFix } from './adjust-fix';
import { wrapPi } from './angles';
import { planarCrossing } from './planar-crossing';
import { sightToPoint } from './sight-to-point';
import type { BearingLine } from './types';

/** Where two bearings cross, and at what angle. */
export interface BearingIntersection {
  /** The crossing, WGS84 degrees. */
  readonly position: LatLon;
  /** Angle between the two geodesics where they cross, radians, 0…π. */
  readonly cutAngleRad: number;
  /** Largest difference between a bearing and the geodesic azimuth from its post to `position`, radians. */
  readonly misclosureRad: number;
}

/**
 * The intersection of two geodesics, each leaving its post on its true
 * bearing, on the WGS84 ellipsoid: a first estimate in the azimuthal
 * equidistant plane of the first post, then Newton's method on the geodesic
 * azimuths (`adjustFix`) until both bearings from the posts to the point
 * match (to about 1e-9°). Also the cut angle: the angle between the two
 * geodesics at the crossing (0…π; 90° is the best cut).
 *
 * Source: Karney (2013) geodesics; the idea of solving in a projection and
 * refining on the ellipsoid follows C. F. F. Karney, "Geodesics on an
 * ellipsoid of revolution" (2011, arXiv:1102.1215), §8 (from memory).
 *
 * @param a first bearing line (radians)
 * @param b second bearing line (radians)
 * @param indexes the lines' indexes in the caller's list, for errors
 * @throws {FixError} `parallel`, `diverging`, `too-far`, `at-post`, `no-convergence`
 * @example
 * intersectBearings(
 *   { from: { latDeg: 0, lonDeg: 0 }, bearingRad: Math.PI / 4, sigmaRad: 0.01 },
 *   { from: { latDeg: 0, lonDeg: 0.2 }, bearingRad: -Math.PI / 4, sigmaRad: 0.01 },
 * ).cutAngleRad; // ≈ π/2
 */
export function intersectBearings(
  a: BearingLine,
  b: BearingLine,
  indexes: readonly [number, number] = [0, 1],
): BearingIntersection {
  const start = planarCrossing(a, b, indexes);
  const { position, residualsRad } = adjustFix([a, b], start);
  const toA = sightToPoint(a.from, position);
  const toB = sightToPoint(b.from, position);
  return {
    position,
    cutAngleRad: Math.abs(wrapPi(toA.azimuthAtPointRad - toB.azimuthAtPointRad)),
    misclosureRad: Math.max(...residualsRad.map(Math.abs)),
  };
}
