/**
 * Worker-thread entry of the terrain ingest (see `terrain-ingest-runner.ts`).
 *
 * Message in: the `TerrainIngestRequest` (workerData). Message out, once:
 * - `{ type: 'result', result }`
 * - `{ type: 'error', name, code, field, message }`
 */
import { parentPort, workerData } from 'node:worker_threads';
import { ingestTerrainFile, TerrainIngestError, type TerrainIngestRequest } from '@/server/terrain/ingest-terrain-file';

const port = parentPort;
if (!port) throw new Error('terrain-ingest-worker.ts must run in a worker thread.');

ingestTerrainFile(workerData as TerrainIngestRequest).then(
  (result) => port.postMessage({ type: 'result', result }),
  (error: unknown) => {
    if (error instanceof TerrainIngestError) {
      port.postMessage({ type: 'error', name: error.name, code: error.code, field: error.field, message: error.message });
    } else {
      const e = error as { name?: string; message?: string; stack?: string };
      port.postMessage({
        type: 'error',
        name: e.name ?? 'Error',
        code: null,
        field: null,
        message: e.stack ?? e.message ?? String(error),
      });
    }
  },
);
