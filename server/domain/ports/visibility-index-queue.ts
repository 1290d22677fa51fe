/* Port: the queue of visibility index jobs (pg-boss in server/queue, or computed in process). */

import type { TerrainRaster } from '@/shared/terrain/terrain-raster';

/** Hands a visibility index layer to a worker. */
export interface VisibilityIndexQueue {
  /** Queues the layer's job; resolves with the queue's job id. */
  enqueue(layerId: string): Promise<string>;
}

/**
 * Computes the seen areas of a visibility index on the worker threads, given
 * the terrain and the settings; reports the share done (0–1) as it goes.
 */
export type ComputeVisibilityIndexSeen = (
  terrain: TerrainRaster,
  options: {
    readonly heightM: number;
    readonly radiusM: number;
    readonly rays: number;
    readonly strideCells: number;
    readonly mask: Uint8Array | null;
  },
  onProgress: (share: number) => void,
) => Promise<Float32Array>;
