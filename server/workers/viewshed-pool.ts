import os from 'node:os';
import path from 'node:path';
import { Worker } from 'node:worker_threads';
import { MEAN_EARTH_RADIUS_M, STANDARD_OPTICAL_K } from '@/shared/physics/constants';
import { TerrainInputError, type TerrainInputErrorCode } from '@/shared/terrain/terrain-input-error';
import type { TerrainRaster } from '@/shared/terrain/terrain-raster';
import type { ViewshedJob, ViewshedJobResult, ViewshedPool } from '@/server/domain/ports/viewshed-pool';
export type { ViewshedJob, ViewshedJobResult, ViewshedPool } from '@/server/domain/ports/viewshed-pool';

/** Settings of {@link createViewshedPool}. */
export interface ViewshedPoolOptions {
  /** Worker threads; default `os.availableParallelism()` (2 on the project machines). */
  readonly size?: number;
}

/** Error for a worker that failed outside the terrain core (crash, load failure). */
export class ViewshedPoolError extends Error {
  constructor(message: string, options?: { cause?: unknown }) {
    super(message, options);
    this.name = 'ViewshedPoolError';
  }
}

interface Pending {
  resolve: (value: { hidden: Float32Array; eyeElevation: number; elapsedMs: number }) => void;
  reject: (reason: unknown) => void;
}

interface Slot {
  worker: Worker;
  terrainIds: Set<number>;
  busy: Map<number, Pending>;
}

const WORKER_ENTRY = path.join(__dirname, 'viewshed-worker.mjs');

/**
 * Starts a pool of worker threads that compute hidden-height rasters (the
 * CPU-heavy part of a lookout plan) off the calling thread, one job per
 * worker at a time. The terrain's heights are placed once in a
 * SharedArrayBuffer that every worker reads (no per-job copy); each result's
 * buffer is transferred back (no copy either).
 *
 * The worker entry is TypeScript, loaded through a small `.mjs` shim that
 * registers tsx, so the pool works under tsx, under Jest and from plain Node.
 *
 * @param options pool size (default: available cores)
 * @returns the pool; call `close()` when done
 * @example
 * const pool = createViewshedPool();
 * const results = await pool.run(terrain, [
 *   { post: { col: 100, row: 200, eyeHeight: 15 }, conditions: { refractionCoefficient: 0.13 } },
 *   { post: { col: 100, row: 200, eyeHeight: 15 }, conditions: { refractionCoefficient: 0 } },
 * ]);
 * await pool.close();
 */
export function createViewshedPool(options: ViewshedPoolOptions = {}): ViewshedPool {
  const size = Math.max(1, Math.floor(options.size ?? os.availableParallelism()));
  let nextJobId = 1;
  let nextTerrainId = 1;
  let closed = false;
  const shared = new WeakMap<TerrainRaster, { id: number; heights: Float32Array }>();

  const startWorker = (): Slot => {
    const worker = new Worker(WORKER_ENTRY);
    const slot: Slot = { worker, terrainIds: new Set(), busy: new Map() };
    worker.on('message', (message: WorkerReply) => {
      const pending = slot.busy.get(message.jobId);
      if (!pending) return;
      slot.busy.delete(message.jobId);
      if (slot.busy.size === 0) worker.unref();
      if (message.type === 'result') {
        pending.resolve(message);
      } else if (message.name === 'TerrainInputError' && message.code) {
        pending.reject(new TerrainInputError(message.code as TerrainInputErrorCode, message.message));
      } else {
        pending.reject(new ViewshedPoolError(`Viewshed worker failed: ${message.message}`));
      }
    });
    const fail = (cause: unknown): void => {
      for (const pending of slot.busy.values()) {
        pending.reject(new ViewshedPoolError(`Viewshed worker stopped: ${String(cause)}`, { cause }));
      }
      slot.busy.clear();
      const index = slots.indexOf(slot);
      if (index >= 0 && !closed) slots[index] = startWorker();
    };
    worker.on('error', fail);
    worker.on('exit', (code) => {
      if (!closed) fail(new Error(`exit code ${code}`));
    });
    worker.unref(); // an idle pool does not keep the process alive
    return slot;
  };
  const slots: Slot[] = Array.from({ length: size }, startWorker);

  const shareTerrain = (terrain: TerrainRaster): { id: number; heights: Float32Array } => {
    const known = shared.get(terrain);
    if (known) return known;
    let heights = terrain.heights;
    if (!(heights.buffer instanceof SharedArrayBuffer)) {
      heights = new Float32Array(new SharedArrayBuffer(terrain.heights.length * 4));
      heights.set(terrain.heights);
    }
    const entry = { id: nextTerrainId++, heights };
    shared.set(terrain, entry);
    return entry;
  };

  const dispatch = (
    slot: Slot,
    terrain: TerrainRaster,
    sharedTerrain: { id: number; heights: Float32Array },
    job: ViewshedJob,
  ): Promise<{ hidden: Float32Array; eyeElevation: number; elapsedMs: number }> => {
    if (!slot.terrainIds.has(sharedTerrain.id)) {
      slot.worker.postMessage({
        type: 'terrain',
        terrainId: sharedTerrain.id,
        heights: sharedTerrain.heights,
        width: terrain.width,
        height: terrain.height,
        cellSize: terrain.cellSize,
        xll: terrain.xll,
        yll: terrain.yll,
        nodata: terrain.nodata,
        crs: terrain.crs,
      });
      slot.terrainIds.clear(); // the worker keeps only the latest terrain
      slot.terrainIds.add(sharedTerrain.id);
    }
    const jobId = nextJobId++;
    return new Promise((resolve, reject) => {
      slot.busy.set(jobId, { resolve, reject });
      slot.worker.ref(); // keep the process alive while a job is out
      slot.worker.postMessage({
        type: 'job',
        jobId,
        terrainId: sharedTerrain.id,
        post: job.post,
        conditions: job.conditions ?? {},
      });
    });
  };

  return {
    size,
    async run(terrain, jobs, options = {}) {
      if (closed) throw new ViewshedPoolError('The viewshed pool is closed.');
      const sharedTerrain = shareTerrain(terrain);
      const results: ViewshedJobResult[] = new Array(jobs.length);
      let next = 0;
      const lane = async (laneIndex: number): Promise<void> => {
        while (next < jobs.length) {
          const index = next++;
          const job = jobs[index] as ViewshedJob;
          const slot = slots[laneIndex] as Slot;
          const reply = await dispatch(slot, terrain, sharedTerrain, job);
          const conditions = job.conditions ?? {};
          results[index] = {
            job,
            elapsedMs: reply.elapsedMs,
            raster: {
              width: terrain.width,
              height: terrain.height,
              cellSize: terrain.cellSize,
              xll: terrain.xll,
              yll: terrain.yll,
              crs: terrain.crs,
              hidden: reply.hidden,
              post: { ...job.post },
              eyeElevation: reply.eyeElevation,
              refractionCoefficient: conditions.refractionCoefficient ?? STANDARD_OPTICAL_K,
              earthRadius: conditions.earthRadius ?? MEAN_EARTH_RADIUS_M,
              maxDistance: conditions.maxDistance ?? Infinity,
            },
          };
          options.onResult?.(results[index], index);
        }
      };
      await Promise.all(slots.map((_, i) => lane(i)));
      return results;
    },
    async close() {
      closed = true;
      await Promise.all(slots.map((slot) => slot.worker.terminate()));
    },
  };
}

type WorkerReply =
  | { type: 'result'; jobId: number; hidden: Float32Array; eyeElevation: number; elapsedMs: number }
  | { type: 'error'; jobId: number; name: string; code: string | null; message: string };
