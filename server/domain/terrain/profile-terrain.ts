import type { TerrainProfileRequest, TerrainProfileResponse } from '@/shared/schemas/terrain';
import { MEAN_EARTH_RADIUS_M } from '@/shared/physics/constants';
import { refractionFromCondition } from '@/shared/sightline/refraction-from-condition';
import { gridProjection, TerrainCrsError } from '@/shared/terrain/grid-projection';
import { TerrainInputError } from '@/shared/terrain/terrain-input-error';
import { terrainProfile } from '@/shared/terrain/terrain-profile';
import { postsRepository } from '@/server/data/repositories/posts-repository';
import type { Actor } from '@/server/domain/actor';
import { AppError } from '@/server/domain/app-error';
import { activeTerrain, pointError } from './active-terrain';
import type { TerrainDeps } from './terrain-deps';

/** Standing cautions of every terrain profile. */
const PROFILE_CAUTIONS = [
  {
    code: 'estimates-only',
    message:
      'Estimates from the terrain grid with a uniform refraction: trees, buildings and the grid’s own errors are not included, and the ground between cell centres is interpolated.',
  },
  {
    code: 'refraction-varies',
    message:
      'Refraction close to the ground varies widely and quickly (heated slopes, inversions in valleys); compare several conditions before relying on a line of sight.',
  },
  {
    code: 'visibility-not-detection',
    message: 'A target in line of sight is not necessarily detected: haze, contrast, lighting and the observer decide that.',
  },
  {
    code: 'follow-procedures',
    message: 'Use these figures to support, not replace, your agency’s procedures, local regulations and licensed practice.',
  },
];

/**
 * The terrain profile from a post (or a position with an eye height) to a
 * target, under each refraction condition.
 */
export async function profileTerrain(
  deps: Pick<TerrainDeps, 'cache'>,
  actor: Actor,
  siteId: string,
  request: TerrainProfileRequest,
): Promise<TerrainProfileResponse> {
  const { terrain: record } = await activeTerrain(actor, siteId);
  let observer: { latDeg: number; lonDeg: number; eyeHeightM: number; postId: string | null; recorded: number | null };
  if (request.postId) {
    const post = await postsRepository.findInSite(actor.organizationId, siteId, request.postId);
    if (!post)
      throw new AppError(404, 'not_found', 'That post was not found on this site.', { postId: 'No such post on this site.' });
    observer = {
      ...post.location,
      eyeHeightM: post.structureHeightM + post.eyeHeightM,
      postId: post.id,
      recorded: post.groundElevationM,
    };
  } else {
    const given = request.observer as NonNullable<TerrainProfileRequest['observer']>;
    observer = { ...given, postId: null, recorded: null };
  }
  const terrain = await deps.cache.loadTerrain(record);
  let projection;
  try {
    projection = gridProjection(terrain.crs);
  } catch (error) {
    if (error instanceof TerrainCrsError) throw new AppError(500, 'terrain_crs', error.message);
    throw error;
  }
  const from = projection.toGrid(observer);
  const to = projection.toGrid(request.target);
  const earthRadius = request.earthRadiusM ?? MEAN_EARTH_RADIUS_M;
  const ks = request.conditions.map((c) => refractionFromCondition(c, earthRadius));
  let profile;
  try {
    profile = terrainProfile(terrain, {
      observer: { ...from, eyeHeight: observer.eyeHeightM },
      target: { ...to, height: request.targetHeightM },
      conditions: ks.map((k) => ({ refractionCoefficient: k, earthRadius })),
    });
  } catch (error) {
    if (
      error instanceof TerrainInputError &&
      error.code === 'invalid-option' &&
      /same point|at the observer/.test(error.message)
    ) {
      throw new AppError(422, 'same_point', 'The target is where the observer is: pick a target elsewhere.', {
        target: 'Pick a target away from the observer.',
      });
    }
    const observerFields = request.postId ? ['postId'] : ['observer.latDeg', 'observer.lonDeg'];
    const isObserver = error instanceof TerrainInputError && /observer/.test(error.message);
    pointError(error, isObserver ? observerFields : ['target.latDeg', 'target.lonDeg'], isObserver ? 'observer' : 'target');
  }
  const finite = (v: number): number | null => (Number.isFinite(v) ? v : null);
  const point = (p: { distance: number; ground: number; lowered: number } | null) =>
    p && { distanceM: p.distance, groundElevationM: p.ground, loweredElevationM: p.lowered };
  const bearing = ((Math.atan2(to.x - from.x, to.y - from.y) * 180) / Math.PI + 360) % 360;
  return {
    terrainId: record.id,
    observer: {
      latDeg: observer.latDeg,
      lonDeg: observer.lonDeg,
      postId: observer.postId,
      groundElevationM: profile.observerGround,
      recordedGroundElevationM: observer.recorded,
      eyeHeightM: observer.eyeHeightM,
      eyeElevationM: profile.eyeElevation,
    },
    target: {
      latDeg: request.target.latDeg,
      lonDeg: request.target.lonDeg,
      groundElevationM: profile.targetGround,
      heightM: request.targetHeightM,
    },
    distanceM: profile.distance,
    gridBearingDeg: bearing,
    spacingM: profile.spacing,
    samples: Array.from(profile.sampleDistances, (d, i) => ({
      distanceM: d,
      groundElevationM: finite(profile.sampleGround[i] as number),
    })),
    results: profile.conditions.map((c) => ({
      k: c.refractionCoefficient,
      effectiveRadiusM: c.refractionCoefficient < 1 ? c.earthRadius / (1 - c.refractionCoefficient) : null,
      loweredGroundM: Array.from(c.loweredGround, finite),
      sightLine: { eyeElevationM: profile.eyeElevation, targetTopElevationM: c.targetTopLowered },
      hiddenHeightM: c.hiddenHeight,
      horizon: point(c.horizon),
      firstObstruction: point(c.firstObstruction),
      groundSeen: c.groundSeen,
      targetTopSeen: c.targetTopSeen,
    })),
    cautions: PROFILE_CAUTIONS,
  };
}
