import type { Sequelize } from 'sequelize';
import { coverageRepository } from '@/server/data/repositories/coverage-repository';
import { poolViewsheds, processCoverageRun } from '@/server/domain/coverage/process-coverage-run';
import type { TerrainCache } from '@/server/terrain/terrain-cache';
import type { ViewshedPool } from '@/server/workers/viewshed-pool';
import type { CoverageQueue } from './coverage-queue';

/**
 * A queue that computes each run as it is queued, in this process, and
 * throws unless the run is done: the stand-in for pg-boss and the worker
 * processes where one process does everything in order (the demo seeder,
 * tests of other features).
 */
export function inlineCoverageQueue(deps: { db: Sequelize; cache: TerrainCache; pool: ViewshedPool }): CoverageQueue {
  return {
    async enqueue(runId) {
      const outcome = await processCoverageRun(
        { db: deps.db, cache: deps.cache, computeViewsheds: poolViewsheds(deps.pool) },
        runId,
      );
      if (outcome !== 'done') {
        const run = await coverageRepository.findById(runId);
        throw new Error(`coverage run ${runId} ended ${outcome}: ${run?.error ?? ''}`);
      }
      return 'inline';
    },
    async cancel() {},
  };
}
