import { Geodesic } from 'geographiclib-geodesic';
import type { LatLon } from '@/shared/geo/types';
import type { SightToPoint } from './types';

const RAD = Math.PI / 180;

/**
 * The geodesic from `from` to `to` on the WGS84 ellipsoid: its length, its
 * azimuths at both ends and its reduced length m12 (the lever arm that turns
 * a sideways shift at `to` into a change of the azimuth at `from`).
 *
 * Source: C. F. F. Karney, "Algorithms for geodesics", J. Geodesy 87 (2013)
 * 43–55 (inverse problem; reduced length, eq. 9 and §3), as implemented by
 * `geographiclib-geodesic`.
 *
 * @param from start, WGS84 degrees
 * @param to end, WGS84 degrees
 * @returns metres and radians (azimuths −π…π, clockwise from true north)
 * @example
 * sightToPoint({ latDeg: 0, lonDeg: 0 }, { latDeg: 0, lonDeg: 1 }).azimuthAtFromRad; // π/2
 */
export function sightToPoint(from: LatLon, to: LatLon): SightToPoint {
  const r = Geodesic.WGS84.Inverse(
    from.latDeg,
    from.lonDeg,
    to.latDeg,
    to.lonDeg,
    Geodesic.DISTANCE | Geodesic.AZIMUTH | Geodesic.REDUCEDLENGTH,
  );
  return {
    distanceM: r.s12 ?? 0,
    azimuthAtFromRad: (r.azi1 ?? 0) * RAD,
    azimuthAtPointRad: (r.azi2 ?? 0) * RAD,
    reducedLengthM: r.m12 ?? 0,
  };
}
