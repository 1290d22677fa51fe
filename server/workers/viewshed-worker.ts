/**
 * Worker-thread entry of the viewshed pool (see `viewshed-pool.ts`).
 *
 * Messages in:
 * - `{ type: 'terrain', terrainId, heights (Float32Array over a SharedArrayBuffer), width, height, cellSize, xll, yll, nodata, crs }`
 *   — the terrain for following jobs; shared, never copied or modified.
 * - `{ type: 'job', jobId, terrainId, post, conditions }`
 * Messages out:
 * - `{ type: 'result', jobId, hidden (Float32Array, buffer transferred), eyeElevation, elapsedMs }`
 * - `{ type: 'error', jobId, name, code, message }`
 */
import { parentPort } from 'node:worker_threads';
import { computeHiddenHeightRaster, type LookoutPost, type SightConditions } from '@/shared/terrain/hidden-height-raster';
import { prepareSweepTerrain, type SweepTerrain } from '@/shared/terrain/sweep-terrain';
import type { TerrainRaster } from '@/shared/terrain/terrain-raster';

interface TerrainMessage extends TerrainRaster {
  readonly type: 'terrain';
  readonly terrainId: number;
}
interface JobMessage {
  readonly type: 'job';
  readonly jobId: number;
  readonly terrainId: number;
  readonly post: LookoutPost;
  readonly conditions: SightConditions;
}

const port = parentPort;
if (!port) throw new Error('viewshed-worker.ts must run in a worker thread.');
const terrains = new Map<number, { terrain: TerrainRaster; sweep: SweepTerrain }>();

port.on('message', (message: TerrainMessage | JobMessage | { type: 'forget'; terrainId: number }) => {
  if (message.type === 'terrain') {
    const { type: _type, terrainId, ...terrain } = message;
    // One terrain at a time per worker; its sweep layout (nodata replaced) is made once.
    terrains.clear();
    terrains.set(terrainId, { terrain, sweep: prepareSweepTerrain(terrain) });
    return;
  }
  if (message.type === 'forget') {
    terrains.delete(message.terrainId);
    return;
  }
  const started = performance.now();
  try {
    const entry = terrains.get(message.terrainId);
    if (!entry) throw new Error(`Terrain ${message.terrainId} was not sent to this worker.`);
    const result = computeHiddenHeightRaster(entry.terrain, message.post, message.conditions, entry.sweep);
    port.postMessage(
      {
        type: 'result',
        jobId: message.jobId,
        hidden: result.hidden,
        eyeElevation: result.eyeElevation,
        elapsedMs: performance.now() - started,
      },
      [result.hidden.buffer as ArrayBuffer],
    );
  } catch (error) {
    const e = error as { name?: string; code?: string; message?: string };
    port.postMessage({
      type: 'error',
      jobId: message.jobId,
      name: e.name ?? 'Error',
      code: e.code ?? null,
      message: e.message ?? String(error),
    });
  }
});
