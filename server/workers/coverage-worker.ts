import { config } from '@/server/config';
import { createDatabase } from '@/server/data/database';
import { poolViewsheds, processCoverageRun } from '@/server/domain/coverage/process-coverage-run';
import { startStaleRunReaper, withHeartbeat } from '@/server/domain/coverage/run-heartbeat';
import { startStaleSitingReaper } from '@/server/domain/siting/reap-stale-siting-runs';
import { cachingViewsheds } from '@/server/domain/coverage/viewshed-cache';
import { startCoverageBoss, workCoverageQueue, workSitingQueue } from '@/server/queue/coverage-queue';
import { processSitingRun } from '@/server/domain/siting/process-siting-run';
import { workVisibilityIndexQueue } from '@/server/queue/visibility-index-queue';
import { processVisibilityIndex } from '@/server/domain/visibility-index/process-visibility-index';
import { createDiskFileStore } from '@/server/storage/file-store';
import { createTerrainCache } from '@/server/terrain/terrain-cache';
import { createViewshedPool } from './viewshed-pool';
import { threadedVisibilityIndex } from './visibility-index-pool';

/**
 * A coverage worker process (`npm run worker`): takes plan coverage runs off
 * the PostgreSQL job queue and computes them with a pool of viewshed threads.
 * Start more of them, on this machine or others that reach the same database
 * and file store, to compute more plans at once.
 */
async function main() {
  const cfg = config();
  const db = createDatabase(cfg.DATABASE_URL);
  await db.authenticate();
  const files = createDiskFileStore(cfg.FILE_STORE_DIR);
  const cache = createTerrainCache({ files, maxBytes: cfg.TERRAIN_CACHE_MB * 2 ** 20 });
  const pool = createViewshedPool({ size: cfg.COVERAGE_WORKER_THREADS });
  // Viewsheds kept between runs: a plan changed in one post recomputes that post only.
  const computeViewsheds = cachingViewsheds(poolViewsheds(pool), cfg.TERRAIN_CACHE_MB * 2 ** 20);
  const { boss, queue, stop } = await startCoverageBoss(cfg.DATABASE_URL);
  await workCoverageQueue(boss, async (runId, attempt) => {
    const outcome = await withHeartbeat(db, runId, () => processCoverageRun({ db, cache, computeViewsheds }, runId, attempt), {
      attempt,
    });
    console.log(`[kenning] coverage run ${runId}: ${outcome}`);
  });
  await workSitingQueue(boss, async (runId) => {
    console.log(`[kenning] siting run ${runId}: ${await processSitingRun({ db, cache, computeViewsheds }, runId)}`);
  });
  // Visibility index layers (the siting heat map), on as many threads as the viewshed pool.
  const computeIndex = threadedVisibilityIndex(pool.size);
  await workVisibilityIndexQueue(boss, async (layerId) => {
    const outcome = await processVisibilityIndex({ cache, compute: computeIndex }, layerId);
    console.log(`[kenning] visibility index ${layerId}: ${outcome}`);
  });
  // Any live worker queues again (once), then fails, the runs of workers that died mid-run.
  const reaper = startStaleRunReaper(db, { requeue: (runId, next) => queue.enqueue(runId, next) });
  const sitingReaper = startStaleSitingReaper(db);
  console.log(`[kenning] coverage worker ready (${pool.size} viewshed threads)`);

  let stopping = false;
  const shutdown = (signal: string) => {
    if (stopping) return;
    stopping = true;
    console.log(`[kenning] coverage worker: ${signal}, closing`);
    setTimeout(() => process.exit(1), 12_000).unref();
    reaper.stop();
    sitingReaper.stop();
    void stop()
      .then(() => pool.close())
      .then(() => db.close())
      .finally(() => process.exit(0));
  };
  process.once('SIGINT', () => shutdown('SIGINT'));
  process.once('SIGTERM', () => shutdown('SIGTERM'));
  process.once('disconnect', () => shutdown('supervisor gone'));
}

// A lost database connection mid-run surfaces as rejected promises in the driver and the
// queue: log them and carry on (pg-boss reconnects; the run is retried or failed cleanly).
process.on('unhandledRejection', (reason) => {
  console.error('[kenning] coverage worker: unhandled rejection (carrying on):', reason);
});

main().catch((err: unknown) => {
  console.error('[kenning] coverage worker could not start:', err);
  process.exit(1);
});
