/**
 * Worker-thread entry of the viewshed command line's second thread: sweeps
 * one half of one post (see `computeHiddenHeightHalf`) into the shared result
 * while the main thread sweeps the other half.
 *
 * Message in: `{ terrain (heights over a SharedArrayBuffer), post, conditions, half, out (Float32Array over a SharedArrayBuffer) }`.
 * Message out: `{ ok: true }`, or `{ ok: false, name, message }` when the sweep threw.
 */
import { parentPort } from 'node:worker_threads';
import {
  computeHiddenHeightHalf,
  type HiddenHeightHalf,
  type LookoutPost,
  type SightConditions,
} from '@/shared/terrain/hidden-height-raster';
import type { TerrainRaster } from '@/shared/terrain/terrain-raster';

interface HalfMessage {
  readonly terrain: TerrainRaster;
  readonly post: LookoutPost;
  readonly conditions: SightConditions;
  readonly half: HiddenHeightHalf;
  readonly out: Float32Array;
}

const port = parentPort;
if (!port) throw new Error('viewshed-half-worker.ts must run in a worker thread.');
port.on('message', (message: HalfMessage) => {
  try {
    computeHiddenHeightHalf(message.terrain, message.post, message.conditions, message.half, message.out);
    port.postMessage({ ok: true });
  } catch (error) {
    const e = error instanceof Error ? error : new Error(String(error));
    port.postMessage({ ok: false, name: e.name, message: e.message });
  }
});
