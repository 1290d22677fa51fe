import type { HiddenHeightRaster } from '@/shared/terrain/hidden-height-raster';
import type { TerrainRaster } from '@/shared/terrain/terrain-raster';
import type { ComputeViewsheds, CoverageViewshedJob } from './compute-coverage';

/**
 * Keeps the hidden-height rasters a worker computed, keyed by everything
 * they depend on — the terrain, the post's cell and eye height, k, the earth
 * radius and the range limit — so a run that differs from an earlier one in
 * a target, a standard, a zone or one post computes only the viewsheds that
 * changed. Least recently used first out, bounded by the rasters' bytes.
 * Rasters are shared between runs: the core never modifies its inputs.
 *
 * Terrains are told apart by object (the terrain cache hands out one object
 * per stored terrain while it holds it); a terrain loaded again is a new
 * object, and its rasters are computed again.
 *
 * @param inner computes what is not held (the worker pool)
 * @param maxBytes bound on the held rasters' bytes (4 per cell)
 */
export function cachingViewsheds(inner: ComputeViewsheds, maxBytes: number): ComputeViewsheds & { held(): number } {
  const terrainIds = new WeakMap<TerrainRaster, number>();
  let nextTerrainId = 1;
  const held = new Map<string, HiddenHeightRaster>(); // insertion order = recency
  let bytes = 0;

  const keyOf = (terrainId: number, job: CoverageViewshedJob) => {
    const { post, conditions: c } = job;
    return [terrainId, post.col, post.row, post.eyeHeight, c.refractionCoefficient, c.earthRadius, c.maxDistance ?? ''].join(':');
  };
  const keep = (key: string, raster: HiddenHeightRaster) => {
    if (held.has(key)) return;
    held.set(key, raster);
    bytes += raster.hidden.byteLength;
    for (const [oldKey, old] of held) {
      if (bytes <= maxBytes) break;
      held.delete(oldKey);
      bytes -= old.hidden.byteLength;
    }
  };

  const compute: ComputeViewsheds = async (terrain, jobs, onDone) => {
    let terrainId = terrainIds.get(terrain);
    if (terrainId === undefined) {
      terrainId = nextTerrainId++;
      terrainIds.set(terrain, terrainId);
    }
    const keys = jobs.map((job) => keyOf(terrainId, job));
    const results: (HiddenHeightRaster | undefined)[] = keys.map((key) => {
      const hit = held.get(key);
      if (hit) {
        held.delete(key);
        held.set(key, hit);
      }
      return hit;
    });
    const missing = jobs.flatMap((job, i) => (results[i] ? [] : [{ job, index: i }]));
    results.forEach((r) => r && onDone());
    if (missing.length > 0) {
      const computed = await inner(
        terrain,
        missing.map((m) => m.job),
        onDone,
      );
      missing.forEach((m, j) => {
        results[m.index] = computed[j]!;
        keep(keys[m.index]!, computed[j]!);
      });
    }
    return results as HiddenHeightRaster[];
  };
  return Object.assign(compute, { held: () => held.size });
}
