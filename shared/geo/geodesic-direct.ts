import { Geodesic } from 'geographiclib-geodesic';
import type { LatLon } from '@/shared/geo/types';

/**
 * Solves the direct geodesic problem on the WGS84 ellipsoid: the point
 * `distanceM` from `from` along the geodesic leaving it on `azimuthDeg` —
 * e.g. "1.2 km at 040° from Crag Hut".
 *
 * Source: C. F. F. Karney, "Algorithms for geodesics", J. Geodesy 87 (2013)
 * 43–55, as implemented by the `geographiclib-geodesic` package.
 *
 * @param from start position, degrees
 * @param azimuthDeg true bearing at the start, degrees clockwise from north
 * @param distanceM length of the geodesic, metres (≥ 0)
 * @returns the end point, degrees (longitude −180…180)
 * @throws {RangeError} on a negative or non-finite distance or a non-finite azimuth
 * @example
 * geodesicDirect({ latDeg: 40.63972222, lonDeg: -73.77888889 }, 53.5, 5850e3); // ≈ { latDeg: 49.01467, lonDeg: 2.56106 }
 */
export function geodesicDirect(from: LatLon, azimuthDeg: number, distanceM: number): LatLon {
  if (!(distanceM >= 0) || !Number.isFinite(distanceM)) throw new RangeError('The distance must be 0 m or more.');
  if (!Number.isFinite(azimuthDeg)) throw new RangeError('The bearing must be a number of degrees.');
  const r = Geodesic.WGS84.Direct(from.latDeg, from.lonDeg, azimuthDeg, distanceM, Geodesic.LATITUDE | Geodesic.LONGITUDE);
  return { latDeg: r.lat2 ?? from.latDeg, lonDeg: r.lon2 ?? from.lonDeg };
}
