import { gridProjection } from '@/shared/terrain/grid-projection';
import { rasterizePolygon } from '@/shared/terrain/rasterize-polygon';
import { visibilityIndexStride } from '@/shared/terrain/visibility-index';
import { sitesRepository } from '@/server/data/repositories/sites-repository';
import { terrainRepository } from '@/server/data/repositories/terrain-repository';
import { visibilityIndexRepository } from '@/server/data/repositories/visibility-index-repository';
import type { TerrainCache } from '@/server/domain/ports/terrain-cache';
import type { ComputeVisibilityIndexSeen } from '@/server/domain/ports/visibility-index-queue';
import { ringOnGrid } from '../coverage/compute-coverage';

/** What the visibility index job needs. */
export interface VisibilityIndexJobDeps {
  cache: TerrainCache;
  compute: ComputeVisibilityIndexSeen;
}

/** Progress is written at most this often, ms. */
const PROGRESS_EVERY_MS = 1000;

/**
 * Computes one queued visibility index layer: loads its terrain, rasterizes
 * the site's boundary (the whole grid counts when it has none), picks the
 * stride that bounds the work, computes on the worker threads and stores the
 * seen areas. Anything that goes wrong marks the layer failed with the reason.
 *
 * @returns 'done', 'failed', or 'skipped' when the layer was not queued
 */
export async function processVisibilityIndex(
  deps: VisibilityIndexJobDeps,
  layerId: string,
): Promise<'done' | 'failed' | 'skipped'> {
  const layer = await visibilityIndexRepository.findById(layerId);
  if (!layer || (layer.status !== 'queued' && layer.status !== 'running')) return 'skipped';
  const started = performance.now();
  try {
    const record = await terrainRepository.findInSite(layer.organizationId, layer.siteId, layer.terrainId);
    const site = await sitesRepository.findInOrganization(layer.organizationId, layer.siteId);
    if (!record || !site) throw new Error('The site or its terrain is gone.');
    const terrain = await deps.cache.loadTerrain(record);
    const mask = site.boundary ? rasterizePolygon(terrain, [ringOnGrid(gridProjection(terrain.crs), site.boundary)]) : null;
    let siteCells = 0;
    if (mask) for (const m of mask) siteCells += m;
    else siteCells = terrain.width * terrain.height;
    const strideCells = visibilityIndexStride(terrain, layer.radiusM, layer.rays);
    const width = Math.ceil(terrain.width / strideCells);
    const height = Math.ceil(terrain.height / strideCells);
    const grid = {
      width,
      height,
      cellSizeM: terrain.cellSize * strideCells,
      xllM: terrain.xll,
      yllM: terrain.yll + terrain.height * terrain.cellSize - height * strideCells * terrain.cellSize,
      epsg: terrain.crs?.epsg ?? null,
    };
    if (!(await visibilityIndexRepository.start(layer.id, strideCells, grid, siteCells * terrain.cellSize ** 2)))
      return 'skipped';
    let lastWrite = performance.now();
    const seenM2 = await deps.compute(
      terrain,
      { heightM: layer.heightM, radiusM: layer.radiusM, rays: layer.rays, strideCells, mask },
      (share) => {
        if (performance.now() - lastWrite < PROGRESS_EVERY_MS) return;
        lastWrite = performance.now();
        void visibilityIndexRepository.progress(layer.id, share).catch(() => undefined);
      },
    );
    await visibilityIndexRepository.finish(layer.id, seenM2, (performance.now() - started) / 1000);
    return 'done';
  } catch (error) {
    console.error(`[kenning] visibility index ${layerId} failed:`, error);
    await visibilityIndexRepository.fail(layer.id, error instanceof Error ? error.message : String(error));
    return 'failed';
  }
}
