import { Geodesic } from 'geographiclib-geodesic';
import type { Transaction } from 'sequelize';
import { evaluateVerticalAngleFix, type ResolvedFixBearing, type TerrainAlongBearing } from '@/shared/fixes';
import type { LatLon } from '@/shared/geo/types';
import { STANDARD_OPTICAL_K } from '@/shared/physics/constants';
import type { FixResult } from '@/shared/schemas/fix';
import type { GridProjection } from '@/shared/terrain/grid-projection';
import { elevationAt } from '@/shared/terrain/terrain-elevation';
import { TerrainInputError } from '@/shared/terrain/terrain-input-error';
import type { TerrainRaster } from '@/shared/terrain/terrain-raster';
import type { TerrainCache } from '@/server/domain/ports/terrain-cache';
import { siteView } from './fix-visibility';

/** The farthest a vertical-angle ray is followed over terrain, metres. */
const MAX_RAY_RANGE_M = 60_000;

/** Ground height at a WGS84 point of a terrain, or null off it / on nodata. */
function groundAt(terrain: TerrainRaster, projection: GridProjection, point: LatLon): number | null {
  const { x, y } = projection.toGrid(point);
  try {
    return elevationAt(terrain, x, y);
  } catch (error) {
    if (error instanceof TerrainInputError) return null;
    throw error;
  }
}

/**
 * The ground along a true bearing from a post, sampled on the site's active
 * terrain at geodesic points (the direct problem), and the k of the site's
 * latest coverage run nearest standard refraction (else standard optical
 * k 0.13) — the same terrain and k as the check of what each post sees.
 * Null terrain when the site has none, or the post stands off it.
 */
export async function terrainAlongBearing(
  cache: TerrainCache | undefined,
  organizationId: string,
  siteId: string | null,
  from: LatLon,
  trueBearingDeg: number,
  t?: Transaction,
): Promise<{ terrain: TerrainAlongBearing | null; k: number }> {
  if (!cache || !siteId) return { terrain: null, k: STANDARD_OPTICAL_K };
  const view = await siteView(cache, organizationId, siteId, t);
  if (!view.terrain || !view.projection) return { terrain: null, k: view.k };
  const { terrain, projection } = view;
  const groundAtPostM = groundAt(terrain, projection, from);
  if (groundAtPostM === null) return { terrain: null, k: view.k };
  const line = Geodesic.WGS84.DirectLine(from.latDeg, from.lonDeg, trueBearingDeg, MAX_RAY_RANGE_M);
  return {
    k: view.k,
    terrain: {
      groundAtPostM,
      stepM: terrain.cellSize / 2,
      maxRangeM: MAX_RAY_RANGE_M,
      groundAtM: (distanceM) => {
        const p = line.Position(distanceM, Geodesic.LATITUDE | Geodesic.LONGITUDE);
        return groundAt(terrain, projection, { latDeg: p.lat2 ?? from.latDeg, lonDeg: p.lon2 ?? from.lonDeg });
      },
    },
  };
}

/**
 * A one-post fix from a bearing and its vertical angle, over the post's
 * site's terrain when it has one, else a smooth earth (the fix says so).
 *
 * @param bearing resolved, with a true bearing or a magnetic one with its declination, and `verticalAngleDeg`
 * @throws {FixError} when the ray meets no ground
 */
export async function verticalAngleFix(
  cache: TerrainCache | undefined,
  organizationId: string,
  siteId: string | null,
  observedAt: string,
  bearing: ResolvedFixBearing,
  trueBearingDeg: number,
  t?: Transaction,
): Promise<FixResult> {
  const { terrain, k } = await terrainAlongBearing(cache, organizationId, siteId, bearing.from, trueBearingDeg, t);
  return evaluateVerticalAngleFix(observedAt, bearing, { k, terrain });
}
