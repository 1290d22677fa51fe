import type { LatLon } from '@/shared/geo/types';
import type { GridProjection } from '@/shared/terrain/grid-projection';

/** Half the latitude step of the numerical derivative, degrees (about 11 m). */
const STEP_DEG = 1e-4;

/**
 * Grid convergence of any terrain grid's projection at a position: the angle
 * γ from true north clockwise to grid north, radians (the convention of
 * `utmGridConvergence`, which this equals for UTM grids). A true bearing
 * becomes a grid bearing as β_grid = β_true − γ; on a north-up grid map, true
 * north points γ anticlockwise from the top.
 *
 * Computed from the projection itself: the meridian through the position is
 * projected a few metres either side, and γ is minus the grid bearing of that
 * true-north direction — so it holds for every CRS `gridProjection` accepts,
 * not only UTM.
 *
 * Source: definition of meridian (grid) convergence of a map projection
 * (common practice, no source).
 *
 * @param projection the grid's conversion (from `gridProjection`)
 * @param point WGS 84 position, degrees (latitude within ±89.9°)
 * @returns γ, radians
 * @example
 * gridConvergence(gridProjection({ epsg: 32633, wkt: null }), { latDeg: 51.6, lonDeg: 16 }); // ≈ +0.0137 rad
 */
export function gridConvergence(projection: GridProjection, point: LatLon): number {
  const south = projection.toGrid({ latDeg: point.latDeg - STEP_DEG, lonDeg: point.lonDeg });
  const north = projection.toGrid({ latDeg: point.latDeg + STEP_DEG, lonDeg: point.lonDeg });
  // Grid bearing of true north is atan2(dx, dy) = −γ.
  return -Math.atan2(north.x - south.x, north.y - south.y);
}
