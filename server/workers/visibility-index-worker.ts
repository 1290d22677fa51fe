/**
 * Worker-thread entry of the visibility index threads (see `visibility-index-pool.ts`).
 *
 * Message in: `{ terrain (heights over a SharedArrayBuffer), mask (shared or null), options }` once,
 * then `{ rows: [from, to] }` per band of index rows.
 * Messages out: `{ type: 'band', rows, seenM2 (Float32Array of those rows, buffer transferred) }`,
 * `{ type: 'error', message }`.
 */
import { parentPort } from 'node:worker_threads';
import { prepareSweepTerrain, type SweepTerrain } from '@/shared/terrain/sweep-terrain';
import type { TerrainRaster } from '@/shared/terrain/terrain-raster';
import { computeVisibilityIndex, type VisibilityIndexOptions } from '@/shared/terrain/visibility-index';

const port = parentPort;
if (!port) throw new Error('visibility-index-worker.ts must run in a worker thread.');
let setup: { terrain: TerrainRaster; sweep: SweepTerrain; options: VisibilityIndexOptions } | null = null;

port.on(
  'message',
  (
    message: { terrain: TerrainRaster; mask: Uint8Array | null; options: VisibilityIndexOptions } | { rows: [number, number] },
  ) => {
    try {
      if ('terrain' in message) {
        setup = {
          terrain: message.terrain,
          sweep: prepareSweepTerrain(message.terrain),
          options: { ...message.options, mask: message.mask },
        };
        return;
      }
      if (!setup) throw new Error('No terrain was sent to this worker.');
      const index = computeVisibilityIndex(setup.terrain, { ...setup.options, indexRows: message.rows }, setup.sweep);
      const seenM2 = index.seenM2.slice(message.rows[0] * index.width, message.rows[1] * index.width);
      port.postMessage({ type: 'band', rows: message.rows, seenM2 }, [seenM2.buffer]);
    } catch (error) {
      port.postMessage({ type: 'error', message: error instanceof Error ? error.message : String(error) });
    }
  },
);
