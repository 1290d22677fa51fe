import type { LatLon } from '@/shared/geo/types';

/**
 * One line of position: a true bearing taken from a known point. Positions
 * are WGS84 degrees (the project's position convention, see `shared/geo`);
 * angles inside the fix core are radians.
 */
export interface BearingLine {
  /** Where the bearing was taken (the post or the observer), WGS84 degrees. */
  readonly from: LatLon;
  /** True bearing (geodesic azimuth at `from`), radians clockwise from true north. */
  readonly bearingRad: number;
  /** Standard uncertainty of the bearing, radians (> 0). */
  readonly sigmaRad: number;
}

/** The geodesic from a bearing's origin to a point, as the fix core needs it. */
export interface SightToPoint {
  /** Length of the geodesic, metres. */
  readonly distanceM: number;
  /** Azimuth at the origin, radians clockwise from true north, −π…π. */
  readonly azimuthAtFromRad: number;
  /** Azimuth of the geodesic where it arrives at the point, radians, −π…π. */
  readonly azimuthAtPointRad: number;
  /** Reduced length m12, metres: a sideways shift δ at the point turns the azimuth at the origin by δ/m12. */
  readonly reducedLengthM: number;
}
