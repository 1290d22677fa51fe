import path from 'node:path';
import { Worker } from 'node:worker_threads';
import {
  TerrainIngestError,
  type TerrainIngestErrorCode,
  type TerrainIngestRequest,
  type TerrainIngestResult,
  type TerrainIngestRunner,
} from '@/server/domain/ports/terrain-ingest';
export type { TerrainIngestRunner } from '@/server/domain/ports/terrain-ingest';

/** Error for an ingest worker that failed outside the ingest itself (crash, out of memory). */
export class TerrainWorkerError extends Error {
  constructor(message: string, options?: { cause?: unknown }) {
    super(message, options);
    this.name = 'TerrainWorkerError';
  }
}

const WORKER_ENTRY = path.join(__dirname, 'terrain-ingest-worker.mjs');

type Reply =
  | { type: 'result'; result: TerrainIngestResult }
  | { type: 'error'; name: string; code: TerrainIngestErrorCode | null; field: 'file' | 'prj' | 'epsg' | null; message: string };

/**
 * Creates a runner that reads, checks and shades an uploaded terrain in a
 * worker thread, so a 4000 × 4000 grid (seconds of parsing) never blocks the
 * server's request thread. Each ingest gets a fresh worker that ends with it,
 * so the memory of a large grid is returned at once; at most `concurrency`
 * run at a time (default 1 — ingests are rare and the machines have two cores),
 * later ones wait their turn.
 *
 * @param options concurrency (default 1)
 * @returns the runner; a rejected promise carries a `TerrainIngestError` for
 *   problems with the upload, a `TerrainWorkerError` otherwise
 * @example
 * const ingest = createTerrainIngestRunner();
 * const result = await ingest({ filePath, format: 'geotiff', prjPath: null, epsg: null, … });
 */
export function createTerrainIngestRunner(options: { concurrency?: number } = {}): TerrainIngestRunner {
  const concurrency = Math.max(1, options.concurrency ?? 1);
  let running = 0;
  const waiting: (() => void)[] = [];
  const turn = async (): Promise<void> => {
    if (running < concurrency) {
      running++;
      return;
    }
    await new Promise<void>((resolve) => waiting.push(resolve));
  };
  const done = (): void => {
    const next = waiting.shift();
    if (next) next();
    else running--;
  };

  const runOne = (request: TerrainIngestRequest): Promise<TerrainIngestResult> =>
    new Promise((resolve, reject) => {
      const worker = new Worker(WORKER_ENTRY, { workerData: request });
      let settled = false;
      const settle = (fn: () => void): void => {
        if (settled) return;
        settled = true;
        fn();
        void worker.terminate();
      };
      worker.once('message', (reply: Reply) => {
        if (reply.type === 'result') settle(() => resolve(reply.result));
        else if (reply.code !== null && reply.field !== null) {
          const error = new TerrainIngestError(reply.code, reply.field, reply.message);
          settle(() => reject(error));
        } else settle(() => reject(new TerrainWorkerError(`Terrain ingest failed: ${reply.message}`)));
      });
      worker.once('error', (cause) =>
        settle(() => reject(new TerrainWorkerError(`Terrain ingest worker failed: ${cause.message}`, { cause }))),
      );
      worker.once('exit', (code) =>
        settle(() => reject(new TerrainWorkerError(`Terrain ingest worker stopped (exit code ${code}).`))),
      );
    });

  return async (request) => {
    await turn();
    try {
      return await runOne(request);
    } finally {
      done();
    }
  };
}
