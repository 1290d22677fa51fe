import type { PostMove, PostMoveResponse } from '@/shared/schemas/post-actions';
import type { Site } from '@/shared/schemas/site';
import { gridProjection } from '@/shared/terrain/grid-projection';
import { gridFootprintRing } from '@/shared/terrain/grid-footprint-ring';
import { elevationAt } from '@/shared/terrain/terrain-elevation';
import { TerrainInputError } from '@/shared/terrain/terrain-input-error';
import { auditRepository } from '@/server/data/repositories/audit-repository';
import { postsRepository } from '@/server/data/repositories/posts-repository';
import { sitesRepository } from '@/server/data/repositories/sites-repository';
import { terrainRepository } from '@/server/data/repositories/terrain-repository';
import { AppError } from '@/server/domain/app-error';
import { staleMessage } from '@/server/domain/audit/versioned-write';
import type { Actor } from '../actor';
import { getSite, refuseIfInFrozenPlan } from '../sites/manage-sites';
import type { TerrainDeps } from './manage-terrain';

const STALE = staleMessage();

/** Pieces per side of a footprint boundary (a grid line is slightly curved in degrees). */
const FOOTPRINT_SEGMENTS = 8;

/**
 * Moves a post to a new position (a drag on the site map). The ground
 * elevation is read from the site's active terrain there (bilinear between
 * cell centres); a site without terrain keeps the recorded ground. Refused
 * for a post a submitted or approved plan uses; the version last seen is
 * checked; audited as a post update.
 */
export async function movePost(
  deps: Pick<TerrainDeps, 'db' | 'cache'>,
  actor: Actor,
  siteId: string,
  postId: string,
  move: PostMove,
): Promise<PostMoveResponse> {
  await getSite(actor, siteId);
  const record = await terrainRepository.findActive(actor.organizationId, siteId);
  let fromTerrain: { terrainId: string; elevationM: number } | null = null;
  if (record) {
    const terrain = await deps.cache.loadTerrain(record);
    const { x, y } = gridProjection(terrain.crs).toGrid(move.location);
    let elevation: number | null = null;
    let outside = false;
    try {
      elevation = elevationAt(terrain, x, y);
    } catch (error) {
      if (!(error instanceof TerrainInputError && error.code === 'point-outside-raster')) throw error;
      outside = true;
    }
    if (elevation === null) {
      const message = outside
        ? 'The new position is outside the site’s terrain, so its ground elevation cannot be read: drop the post on the terrain.'
        : 'The terrain has no ground height at the new position (a no-data cell): drop the post where it has one.';
      throw new AppError(422, outside ? 'outside_terrain' : 'no_elevation', message, { location: message });
    }
    fromTerrain = { terrainId: record.id, elevationM: Math.round(elevation * 10) / 10 };
  }
  return deps.db.transaction(async (t) => {
    const before = await postsRepository.findInSite(actor.organizationId, siteId, postId, t);
    if (!before) throw AppError.notFound('That post');
    await refuseIfInFrozenPlan(actor, postId, 'moved', t);
    const groundElevationM = fromTerrain ? fromTerrain.elevationM : before.groundElevationM;
    const after = await postsRepository.updateIfVersion(
      actor.organizationId,
      siteId,
      postId,
      move.version,
      { location: move.location, groundElevationM },
      t,
    );
    if (!after) throw AppError.conflict(STALE, 'stale_version');
    await auditRepository.record(actor, { action: 'update', entityType: 'post', entityId: postId, before, after }, t);
    return {
      post: after,
      ground: fromTerrain
        ? { from: 'terrain', ...fromTerrain, previousM: before.groundElevationM }
        : { from: 'kept', elevationM: groundElevationM },
    };
  });
}

/**
 * Makes the site's boundary the footprint of its active terrain: the grid's
 * rectangle through its outermost cell centres, reprojected to WGS 84
 * (`gridFootprintRing`). Replaces any boundary the site had; checks the
 * version last seen; audited as a site update. 404 `no_terrain` without one.
 */
export async function boundaryFromTerrain(
  deps: Pick<TerrainDeps, 'db'>,
  actor: Actor,
  siteId: string,
  version: number,
): Promise<{ site: Site; terrainId: string; corners: number }> {
  const site = await getSite(actor, siteId);
  const record = await terrainRepository.findActive(actor.organizationId, siteId);
  if (!record) {
    throw new AppError(404, 'no_terrain', `${site.name} has no terrain yet: upload one first, then use its extent.`);
  }
  if (record.width < 2 || record.height < 2) {
    throw new AppError(
      422,
      'terrain_too_small',
      'The terrain is narrower than two cells, so it has no area to use as a boundary.',
    );
  }
  const projection = gridProjection({ epsg: record.epsg, wkt: record.crsWkt });
  const ring = gridFootprintRing(
    { width: record.width, height: record.height, cellSize: record.cellSizeM, xll: record.xllM, yll: record.yllM },
    (x, y) => projection.toLatLon(x, y),
    FOOTPRINT_SEGMENTS,
  );
  return deps.db.transaction(async (t) => {
    const before = await sitesRepository.findInOrganization(actor.organizationId, siteId, t);
    if (!before) throw AppError.notFound('That site');
    const after = await sitesRepository.updateIfVersion(actor.organizationId, siteId, version, { boundary: ring }, t);
    if (!after) throw AppError.conflict(STALE, 'stale_version');
    await auditRepository.record(
      actor,
      { action: 'update', entityType: 'site', entityId: siteId, before, after: { ...after, boundaryFrom: record.id } },
      t,
    );
    return { site: after, terrainId: record.id, corners: ring.length };
  });
}
