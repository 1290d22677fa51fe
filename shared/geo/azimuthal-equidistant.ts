import { geodesicInverse } from '@/shared/geo/geodesic-inverse';
import type { LatLon } from '@/shared/geo/types';

/**
 * Projects WGS84 positions onto a plane centred on `centre` so that every
 * point keeps its true (geodesic) distance and azimuth from the centre: the
 * ellipsoidal azimuthal equidistant projection. x is metres east, y metres
 * north. Straight lines in this plane stand in for geodesics; over the tens
 * of kilometres a lookout sees, the difference is centimetres.
 *
 * Source: J. P. Snyder, "Map Projections — A Working Manual", USGS
 * Professional Paper 1395 (1987), azimuthal equidistant projection; the
 * ellipsoidal form from the geodesic distance and azimuth (Karney 2013).
 *
 * @param centre the projection's centre (the lookout), degrees
 * @param points positions to project, degrees (not modified)
 * @returns [x, y] metres for each point, in order
 * @example
 * projectAzimuthalEquidistant({ latDeg: 0, lonDeg: 0 }, [{ latDeg: 0, lonDeg: 1 }]);
 * // [[111319.49…, 0]]
 */
export function projectAzimuthalEquidistant(centre: LatLon, points: readonly LatLon[]): [number, number][] {
  return points.map((p) => {
    const { distanceM, azimuthDeg } = geodesicInverse(centre, p);
    const a = (azimuthDeg * Math.PI) / 180;
    return [distanceM * Math.sin(a), distanceM * Math.cos(a)];
  });
}
