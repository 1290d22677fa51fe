import { Geodesic } from 'geographiclib-geodesic';
import type { LatLon } from '@/shared/geo/types';

/** Distance and direction from one WGS84 position to another. */
export interface GeodesicLeg {
  /** Length of the geodesic, metres. */
  readonly distanceM: number;
  /** Azimuth at the start, degrees clockwise from true north, 0…360. */
  readonly azimuthDeg: number;
}

/**
 * Solves the inverse geodesic problem on the WGS84 ellipsoid: the shortest
 * path's length and its starting azimuth. Accurate to a few nanometres.
 *
 * Source: C. F. F. Karney, "Algorithms for geodesics", J. Geodesy 87 (2013)
 * 43–55, as implemented by the `geographiclib-geodesic` package.
 *
 * @param from start position, degrees
 * @param to end position, degrees
 * @returns distance in metres and azimuth in degrees (0 when the points coincide)
 * @example
 * geodesicInverse({ latDeg: 0, lonDeg: 0 }, { latDeg: 0, lonDeg: 1 });
 * // { distanceM: 111319.49…, azimuthDeg: 90 }
 */
export function geodesicInverse(from: LatLon, to: LatLon): GeodesicLeg {
  const r = Geodesic.WGS84.Inverse(from.latDeg, from.lonDeg, to.latDeg, to.lonDeg, Geodesic.DISTANCE | Geodesic.AZIMUTH);
  const azimuth = r.azi1 ?? 0;
  return { distanceM: r.s12 ?? 0, azimuthDeg: azimuth < 0 ? azimuth + 360 : azimuth };
}
