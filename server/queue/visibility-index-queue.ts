import type PgBoss from 'pg-boss';
import type { VisibilityIndexQueue } from '@/server/domain/ports/visibility-index-queue';
export type { VisibilityIndexQueue } from '@/server/domain/ports/visibility-index-queue';

/** The pg-boss queue of visibility index layers. */
export const VISIBILITY_INDEX_QUEUE = 'visibility-index';

/** Longest a worker may hold a job before pg-boss hands it to another worker, seconds. */
const JOB_EXPIRY_S = 15 * 60;

/**
 * Creates the visibility index queue on a started pg-boss (the coverage
 * queue's, see `startCoverageBoss`) and returns its sending side.
 *
 * @example
 * const queue = await visibilityIndexQueue(coverage.boss);
 * await queue.enqueue(layer.id);
 */
export async function visibilityIndexQueue(boss: PgBoss): Promise<VisibilityIndexQueue> {
  await boss.createQueue(VISIBILITY_INDEX_QUEUE, {
    name: VISIBILITY_INDEX_QUEUE,
    retryLimit: 1,
    retryDelay: 5,
    expireInSeconds: JOB_EXPIRY_S,
  });
  return {
    async enqueue(layerId) {
      const id = await boss.send(VISIBILITY_INDEX_QUEUE, { layerId });
      if (!id) throw new Error('The job queue did not accept the visibility index.');
      return id;
    },
  };
}

/** Takes visibility index jobs one at a time (each uses every core) and hands each layer id to `handle`. */
export async function workVisibilityIndexQueue(boss: PgBoss, handle: (layerId: string) => Promise<void>): Promise<string> {
  await visibilityIndexQueue(boss);
  return boss.work<{ layerId: string }>(VISIBILITY_INDEX_QUEUE, { batchSize: 1, pollingIntervalSeconds: 1 }, async ([job]) => {
    if (job) await handle(job.data.layerId);
  });
}

/** A queue that computes each layer as it is queued, in this process (the seeder, tests, one-process set-ups). */
export function inlineVisibilityIndexQueue(handle: (layerId: string) => Promise<unknown>): VisibilityIndexQueue {
  return {
    async enqueue(layerId) {
      await handle(layerId);
      return 'inline';
    },
  };
}
