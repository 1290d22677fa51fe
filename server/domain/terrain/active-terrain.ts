import type { Readable } from 'node:stream';
import type { Site } from '@/shared/schemas/site';
import type { SiteTerrain } from '@/shared/schemas/terrain';
import { TerrainInputError } from '@/shared/terrain/terrain-input-error';
import { terrainRepository, type TerrainRecord } from '@/server/data/repositories/terrain-repository';
import type { Actor } from '@/server/domain/actor';
import { AppError } from '@/server/domain/app-error';
import { getSite } from '@/server/domain/sites/manage-sites';
import type { TerrainDeps } from './terrain-deps';
import { toSiteTerrain } from './to-site-terrain';

/** The site and its active terrain; 404 `no_terrain` when it has none. */
export async function activeTerrain(actor: Actor, siteId: string): Promise<{ site: Site; terrain: TerrainRecord }> {
  const site = await getSite(actor, siteId);
  const terrain = await terrainRepository.findActive(actor.organizationId, siteId);
  if (!terrain) {
    throw new AppError(404, 'no_terrain', `${site.name} has no terrain yet. A planner can upload a GeoTIFF or ESRI ASCII grid.`);
  }
  return { site, terrain };
}

/** The site's active terrain; 404 `no_terrain` when it has none. */
export async function getActiveTerrain(actor: Actor, siteId: string): Promise<SiteTerrain> {
  return toSiteTerrain((await activeTerrain(actor, siteId)).terrain);
}

/**
 * The hillshade PNG of the site's active terrain, or of one of its terrains by
 * id (replaced ones too: plan revisions keep referring to them).
 */
export async function openHillshade(
  deps: Pick<TerrainDeps, 'files'>,
  actor: Actor,
  siteId: string,
  terrainId?: string,
): Promise<{ stream: Readable; terrainId: string }> {
  let terrain: TerrainRecord;
  if (terrainId) {
    await getSite(actor, siteId);
    const found = await terrainRepository.findInSite(actor.organizationId, siteId, terrainId);
    if (!found) throw AppError.notFound('That terrain');
    terrain = found;
  } else {
    terrain = (await activeTerrain(actor, siteId)).terrain;
  }
  return { stream: await deps.files.open(terrain.hillshadeKey), terrainId: terrain.id };
}

/** Maps the terrain core's point errors to a 422 naming the fields. */
export function pointError(error: unknown, fields: string[], what: string): never {
  if (error instanceof TerrainInputError && (error.code === 'point-outside-raster' || error.code === 'point-on-nodata')) {
    const outside = error.code === 'point-outside-raster';
    const message = outside ? `The ${what} is outside the site’s terrain.` : `The terrain has no ground height at the ${what}.`;
    throw new AppError(
      422,
      outside ? 'outside_terrain' : 'no_elevation',
      message,
      Object.fromEntries(fields.map((f) => [f, message])),
    );
  }
  throw error;
}
