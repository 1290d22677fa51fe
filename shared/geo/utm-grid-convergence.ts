import { toUtm } from '@/shared/geo/to-utm';
import type { LatLon } from '@/shared/geo/types';
import { utmProjection } from '@/shared/geo/utm-projection';

/** Half the latitude step of the numerical derivative, degrees (about 11 m). */
const STEP_DEG = 1e-4;

/**
 * Grid convergence of UTM at a position: the angle γ from true north
 * clockwise to grid north, radians. East of the zone's central meridian in
 * the northern hemisphere grid north lies east of true north (γ > 0); west of
 * it, or in the southern hemisphere east of it, γ < 0. Turn a true bearing
 * into a grid bearing with β_grid = β_true − γ.
 *
 * Computed from the projection itself: the meridian through the position is
 * projected a few metres either side (proj4's UTM on WGS84, see
 * `utmProjection`), and γ is minus the grid bearing of that true-north
 * direction. For the sphere this equals the closed form
 * γ = atan(tan Δλ · sin φ) (Δλ longitude from the central meridian, φ
 * latitude); on the ellipsoid it differs from it by less than 1e-5 rad within
 * a zone.
 *
 * Source: definition of meridian (grid) convergence of a conformal map
 * projection; the closed form of the spherical transverse Mercator, e.g.
 * J. P. Snyder, Map Projections — A Working Manual, USGS Professional Paper
 * 1395 (1987), transverse Mercator chapter (from memory).
 *
 * @param point WGS 84 position, degrees
 * @param zone UTM zone to use (default: the position's own, as `toUtm` picks it)
 * @returns γ, radians
 * @throws CoordinateError as `toUtm` does (position outside the UTM area, bad zone…)
 * @example
 * utmGridConvergence({ latDeg: 51.6, lonDeg: 16 }); // ≈ +0.0137 rad (+0.78°): 1° east of zone 33's central meridian
 */
export function utmGridConvergence(point: LatLon, zone?: number): number {
  const utm = toUtm(point, zone);
  const projection = utmProjection(utm.zone, utm.hemisphere);
  const [e0, n0] = projection.forward([point.lonDeg, point.latDeg - STEP_DEG]);
  const [e1, n1] = projection.forward([point.lonDeg, point.latDeg + STEP_DEG]);
  // Grid bearing of true north is atan2(dE, dN) = −γ.
  return -Math.atan2(e1 - e0, n1 - n0);
}
