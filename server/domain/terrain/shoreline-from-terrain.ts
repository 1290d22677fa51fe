import { gridProjection } from '@/shared/terrain/grid-projection';
import { traceShoreline } from '@/shared/terrain/trace-shoreline';
import { terrainRepository } from '@/server/data/repositories/terrain-repository';
import { AppError } from '@/server/domain/app-error';
import type { Actor } from '../actor';
import { getSite } from '../sites/manage-sites';
import type { TerrainDeps } from './manage-terrain';

/**
 * A shoreline traced from the site's active terrain at `levelM` (metres, the
 * terrain's own heights): the longest stretch of that contour off the grid's
 * edge, sea on its left, as [lon, lat]. Nothing is saved: the site form puts
 * it in its shoreline field. 404 `no_terrain`; 422 `level_not_crossed` when
 * the level does not cross the terrain.
 */
export async function shorelineFromTerrain(
  deps: Pick<TerrainDeps, 'cache'>,
  actor: Actor,
  siteId: string,
  levelM: number,
): Promise<{ shoreline: [number, number][]; terrainId: string; levelM: number }> {
  const site = await getSite(actor, siteId);
  const record = await terrainRepository.findActive(actor.organizationId, siteId);
  if (!record) throw new AppError(404, 'no_terrain', `${site.name} has no terrain yet: upload one first, or draw the shoreline.`);
  const terrain = await deps.cache.loadTerrain(record);
  const line = traceShoreline(terrain, levelM);
  if (!line) {
    throw new AppError(422, 'level_not_crossed', `The terrain does not cross ${levelM} m: no shoreline at that level.`, {
      levelM: 'Choose a level between the terrain’s lowest and highest ground.',
    });
  }
  const projection = gridProjection(terrain.crs);
  const shoreline = line.map(([x, y]) => {
    const p = projection.toLatLon(x, y);
    return [Number(p.lonDeg.toFixed(7)), Number(p.latDeg.toFixed(7))] as [number, number];
  });
  return { shoreline, terrainId: record.id, levelM };
}
