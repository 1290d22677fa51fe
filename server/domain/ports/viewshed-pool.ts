/* Port: what the coverage use cases need of the viewshed workers (worker threads in server/workers/viewshed-pool). */

import type { HiddenHeightRaster, LookoutPost, SightConditions } from '@/shared/terrain/hidden-height-raster';
import type { TerrainRaster } from '@/shared/terrain/terrain-raster';

/** One viewshed to compute: a post under one set of conditions. */
export interface ViewshedJob {
  readonly post: LookoutPost;
  readonly conditions?: SightConditions;
}

/** Result of one job, in the order the jobs were given. */
export interface ViewshedJobResult {
  readonly job: ViewshedJob;
  readonly raster: HiddenHeightRaster;
  /** Compute time inside the worker, milliseconds. */
  readonly elapsedMs: number;
}

/** A pool of viewshed worker threads. */
export interface ViewshedPool {
  /** Number of worker threads. */
  readonly size: number;
  /**
   * Computes every job on the terrain, spreading them over the workers. The
   * heights are copied into shared memory once per terrain object (unless they
   * already live in a SharedArrayBuffer) and reused by later runs on the same
   * object, so treat the terrain as immutable, as the whole core does.
   */
  run(
    terrain: TerrainRaster,
    jobs: readonly ViewshedJob[],
    options?: { readonly onResult?: (result: ViewshedJobResult, index: number) => void },
  ): Promise<ViewshedJobResult[]>;
  /** Stops the workers; pending runs are rejected. */
  close(): Promise<void>;
}
