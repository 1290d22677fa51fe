import type { ElevationQuery, ElevationResponse } from '@/shared/schemas/terrain';
import { gridProjection } from '@/shared/terrain/grid-projection';
import { elevationAt } from '@/shared/terrain/terrain-elevation';
import { TerrainInputError } from '@/shared/terrain/terrain-input-error';
import type { Actor } from '@/server/domain/actor';
import { activeTerrain, pointError } from './active-terrain';
import type { TerrainDeps } from './terrain-deps';

/** Ground elevation of the active terrain at a WGS84 position (bilinear between cell centres). */
export async function terrainElevation(
  deps: Pick<TerrainDeps, 'cache'>,
  actor: Actor,
  siteId: string,
  query: ElevationQuery,
): Promise<ElevationResponse> {
  const { terrain: record } = await activeTerrain(actor, siteId);
  const terrain = await deps.cache.loadTerrain(record);
  const { x, y } = gridProjection(terrain.crs).toGrid(query);
  let elevation: number | null;
  try {
    elevation = elevationAt(terrain, x, y);
  } catch (error) {
    pointError(error, ['latDeg', 'lonDeg'], 'position');
  }
  if (elevation === null) pointError(new TerrainInputError('point-on-nodata', ''), ['latDeg', 'lonDeg'], 'position');
  return { terrainId: record.id, latDeg: query.latDeg, lonDeg: query.lonDeg, xM: x, yM: y, elevationM: elevation };
}
