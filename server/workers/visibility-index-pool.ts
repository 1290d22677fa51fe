import os from 'node:os';
import path from 'node:path';
import { Worker } from 'node:worker_threads';
import type { ComputeVisibilityIndexSeen } from '@/server/domain/ports/visibility-index-queue';

const WORKER_ENTRY = path.join(__dirname, 'visibility-index-worker.mjs');

/** Bands per thread: small enough that a slow band does not leave the other threads idle at the end. */
const BANDS_PER_THREAD = 8;

const shared = <T extends Float32Array | Uint8Array>(values: T, make: (buffer: SharedArrayBuffer) => T): T => {
  if (values.buffer instanceof SharedArrayBuffer) return values;
  const copy = make(new SharedArrayBuffer(values.byteLength));
  copy.set(values);
  return copy;
};

/**
 * Computes a visibility index on `threads` worker threads started for the
 * call (a job takes seconds; starting a thread ≈ 0.1–0.3 s): the terrain and
 * the site mask are shared (SharedArrayBuffer), the index rows are dealt out
 * in bands, each thread takes the next band when it finishes one.
 *
 * @param threads worker threads; default the available cores
 * @returns the compute function the visibility index job uses
 * @example
 * const seen = await threadedVisibilityIndex()(terrain, { heightM: 20, radiusM: 8000, rays: 64, strideCells: 5, mask: null }, () => {});
 */
export function threadedVisibilityIndex(threads = os.availableParallelism()): ComputeVisibilityIndexSeen {
  return async (terrain, options, onProgress) => {
    const heights = shared(terrain.heights, (b) => new Float32Array(b));
    const mask = options.mask ? shared(options.mask, (b) => new Uint8Array(b)) : null;
    const width = Math.ceil(terrain.width / options.strideCells);
    const height = Math.ceil(terrain.height / options.strideCells);
    const seenM2 = new Float32Array(width * height);
    const count = Math.max(1, Math.min(threads, height));
    const bandRows = Math.max(1, Math.ceil(height / (count * BANDS_PER_THREAD)));
    const bands: [number, number][] = [];
    for (let r = 0; r < height; r += bandRows) bands.push([r, Math.min(height, r + bandRows)]);
    const total = bands.length;
    let done = 0;
    const workers = Array.from({ length: count }, () => new Worker(WORKER_ENTRY));
    try {
      await Promise.all(
        workers.map(
          (worker) =>
            new Promise<void>((resolve, reject) => {
              const next = () => {
                const band = bands.shift();
                if (band) worker.postMessage({ rows: band });
                else resolve();
              };
              worker.on(
                'message',
                (
                  message: { type: 'band'; rows: [number, number]; seenM2: Float32Array } | { type: 'error'; message: string },
                ) => {
                  if (message.type === 'error') {
                    reject(new Error(`Visibility index thread failed: ${message.message}`));
                    return;
                  }
                  seenM2.set(message.seenM2, message.rows[0] * width);
                  done++;
                  onProgress(done / total);
                  next();
                },
              );
              worker.on('error', reject);
              worker.on('exit', (code) => {
                if (bands.length > 0 || done < total) reject(new Error(`Visibility index thread stopped (exit code ${code}).`));
              });
              const { heights: _own, ...grid } = terrain;
              worker.postMessage({
                terrain: { ...grid, heights },
                mask,
                options: {
                  heightM: options.heightM,
                  radiusM: options.radiusM,
                  rays: options.rays,
                  strideCells: options.strideCells,
                },
              });
              next();
            }),
        ),
      );
    } finally {
      await Promise.all(workers.map((w) => w.terminate()));
    }
    return seenM2;
  };
}
