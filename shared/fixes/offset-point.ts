import { Geodesic } from 'geographiclib-geodesic';
import type { LatLon } from '@/shared/geo/types';

const DEG = 180 / Math.PI;

/**
 * The point `eastM`, `northM` away from `origin` in its local tangent plane,
 * placed on the ellipsoid by the direct geodesic problem (azimuth
 * atan2(east, north), distance √(east² + north²)): the azimuthal equidistant
 * projection about `origin`, inverted.
 *
 * Source: Karney (2013), direct problem; J. P. Snyder, "Map Projections — A
 * Working Manual", USGS PP 1395 (1987), azimuthal equidistant projection.
 *
 * @param origin WGS84 degrees
 * @param eastM metres east
 * @param northM metres north
 * @returns WGS84 degrees (longitude −180…180)
 * @example
 * offsetPoint({ latDeg: 0, lonDeg: 0 }, 111319.49, 0); // ≈ { latDeg: 0, lonDeg: 1 }
 */
export function offsetPoint(origin: LatLon, eastM: number, northM: number): LatLon {
  const s = Math.hypot(eastM, northM);
  if (s === 0) return { latDeg: origin.latDeg, lonDeg: origin.lonDeg };
  const r = Geodesic.WGS84.Direct(
    origin.latDeg,
    origin.lonDeg,
    Math.atan2(eastM, northM) * DEG,
    s,
    Geodesic.LATITUDE | Geodesic.LONGITUDE,
  );
  return { latDeg: r.lat2 ?? origin.latDeg, lonDeg: r.lon2 ?? origin.lonDeg };
}
