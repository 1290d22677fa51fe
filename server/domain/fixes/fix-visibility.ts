import type { Transaction } from 'sequelize';
import { classAt, postSeesFix, type PostSeesFix } from '@/shared/fixes/post-sees-fix';
import { visibilitySentence } from '@/shared/fixes/visibility-sentence';
import type { LatLon } from '@/shared/geo/types';
import { STANDARD_OPTICAL_K } from '@/shared/physics/constants';
import type { FixVisibility } from '@/shared/schemas/fix';
import { decodeClassRaster } from '@/shared/terrain/decode-class-raster';
import { gridProjection, TerrainCrsError, type GridProjection } from '@/shared/terrain/grid-projection';
import { gridSpecFromM } from '@/shared/terrain/grid-spec';
import type { TerrainRaster } from '@/shared/terrain/terrain-raster';
import { coverageRepository, type CoverageRunRecord } from '@/server/data/repositories/coverage-repository';
import { terrainRepository } from '@/server/data/repositories/terrain-repository';
import type { TerrainCache } from '@/server/domain/ports/terrain-cache';

const NO_TERRAIN: PostSeesFix = { seesGround: null, minSmokeHeightM: null, basis: 'no-terrain' };

/** A place a bearing was taken from, for the visibility check. */
export interface VisibilityObserver {
  postId: string | null;
  postName: string | null;
  /** The post's site (its terrain and coverage runs); null for a typed position. */
  siteId: string | null;
  location: LatLon;
  /** Eye above the ground, metres (structure + eye for a post). */
  eyeHeightM: number;
}

export interface SiteView {
  terrain: TerrainRaster | null;
  projection: GridProjection | null;
  run: CoverageRunRecord | null;
  /** The run's case whose k is nearest standard optical refraction (the stored views do not depend on the target's height for the ground). */
  caseKey: string | null;
  k: number;
}

/** The site's terrain and its latest finished coverage run on it, once per site. */
export async function siteView(cache: TerrainCache, organizationId: string, siteId: string, t?: Transaction): Promise<SiteView> {
  const record = await terrainRepository.findActive(organizationId, siteId, t);
  if (!record) return { terrain: null, projection: null, run: null, caseKey: null, k: STANDARD_OPTICAL_K };
  const terrain = await cache.loadTerrain(record);
  let projection: GridProjection;
  try {
    projection = gridProjection(terrain.crs);
  } catch (error) {
    if (!(error instanceof TerrainCrsError)) throw error;
    return { terrain: null, projection: null, run: null, caseKey: null, k: STANDARD_OPTICAL_K };
  }
  const run = await coverageRepository.latestDoneOnTerrain(organizationId, siteId, record.id, t);
  const chosen = [...(run?.cases ?? [])]
    .filter((c) => c.refractionCoefficient < 1) // ducts are left out of runs anyway
    .sort(
      (a, b) => Math.abs(a.refractionCoefficient - STANDARD_OPTICAL_K) - Math.abs(b.refractionCoefficient - STANDARD_OPTICAL_K),
    )[0];
  return { terrain, projection, run, caseKey: chosen?.key ?? null, k: chosen?.refractionCoefficient ?? STANDARD_OPTICAL_K };
}

/**
 * Whether each reporting post sees the fix point: from the site's latest
 * finished coverage run on its active terrain where the run decided that
 * cell (that run's condition nearest standard refraction), else from a terrain
 * profile under standard optical refraction (k 0.13); the height a smoke must
 * rise to show always from the profile. Sites without terrain say so.
 *
 * @param cache the server's terrain cache
 * @param organizationId the caller's organisation (every read is scoped by it)
 * @param fix the fix point, WGS84 degrees
 * @param observers the places the bearings were taken from, in the fix's order
 * @param t the write's transaction, when called inside one
 */
export async function fixVisibility(
  cache: TerrainCache,
  organizationId: string,
  fix: LatLon,
  observers: readonly VisibilityObserver[],
  t?: Transaction,
): Promise<FixVisibility[]> {
  const views = new Map<string, SiteView>();
  const fallbackSite = observers.find((o) => o.siteId !== null)?.siteId ?? null;
  const out: FixVisibility[] = [];
  for (const o of observers) {
    const siteId = o.siteId ?? fallbackSite;
    let view: SiteView | null = null;
    if (siteId) {
      view = views.get(siteId) ?? (await siteView(cache, organizationId, siteId, t));
      views.set(siteId, view);
    }
    let runClass: number | null = null;
    let post = null;
    let at = null;
    if (view?.terrain && view.projection) {
      post = view.projection.toGrid(o.location);
      at = view.projection.toGrid(fix);
      if (view.run?.grid && view.caseKey && o.postId) {
        const encoded = await coverageRepository.layer(view.run.id, view.caseKey, 'post-visibility', o.postId, t);
        if (encoded) runClass = classAt(gridSpecFromM(view.run.grid, null), decodeClassRaster(encoded), at.x, at.y);
      }
    }
    const seen =
      view?.terrain && post && at
        ? postSeesFix({
            terrain: view.terrain,
            post: { ...post, eyeHeightM: o.eyeHeightM },
            at,
            refractionCoefficient: view.k,
            runClass,
          })
        : NO_TERRAIN;
    const round = (m: number | null) => (m === null ? null : Math.round(m * 10) / 10);
    const answer = { postId: o.postId, postName: o.postName, ...seen, minSmokeHeightM: round(seen.minSmokeHeightM) };
    out.push({
      ...answer,
      refractionK: seen.basis === 'no-terrain' ? null : (view?.k ?? null),
      message: visibilitySentence(answer),
    });
  }
  return out;
}
