import PgBoss from 'pg-boss';
import type { CoverageQueue } from '@/server/domain/ports/coverage-queue';
export type { CoverageQueue } from '@/server/domain/ports/coverage-queue';

/** The pg-boss queue of plan coverage runs. */
export const COVERAGE_QUEUE = 'plan-coverage';

/** The pg-boss queue of siting runs (computed by the same workers). */
export const SITING_QUEUE = 'site-siting';

/** Longest a worker may hold a job before pg-boss hands it to another worker, seconds. */
const JOB_EXPIRY_S = 30 * 60;

/** A started pg-boss with the coverage queue created. */
export interface CoverageBoss {
  readonly boss: PgBoss;
  readonly queue: CoverageQueue;
  /** The siting runs' queue (same port: enqueue a run id, cancel a job). */
  readonly sitingQueue: CoverageQueue;
  stop(): Promise<void>;
}

/**
 * Starts pg-boss on the application's database (its own `pgboss` schema,
 * created or migrated on first start) and makes sure the coverage queue
 * exists. Jobs live in PostgreSQL, so queued runs survive a restart of the
 * server or the workers; a job held by a worker that died is handed out
 * again after {@link JOB_EXPIRY_S}, once (the job then finds its run taken over, see processCoverageRun). A run whose worker
 * stopped beating is queued again much sooner by the reaper (server/domain/coverage/run-heartbeat.ts).
 *
 * @example
 * const { queue, stop } = await startCoverageBoss(config.DATABASE_URL);
 * await queue.enqueue(run.id);
 */
export async function startCoverageBoss(databaseUrl: string, options: { supervise?: boolean } = {}): Promise<CoverageBoss> {
  const boss = new PgBoss({ connectionString: databaseUrl, max: 4, supervise: options.supervise ?? true });
  boss.on('error', (error) => console.error('[kenning] job queue:', error));
  await boss.start();
  await boss.createQueue(COVERAGE_QUEUE, { name: COVERAGE_QUEUE, retryLimit: 1, retryDelay: 5, expireInSeconds: JOB_EXPIRY_S });
  const queue: CoverageQueue = {
    async enqueue(runId, attempt = 1) {
      const id = await boss.send(COVERAGE_QUEUE, { runId, attempt });
      if (!id) throw new Error('The job queue did not accept the run.');
      return id;
    },
    async cancel(jobId) {
      await boss.cancel(COVERAGE_QUEUE, jobId);
    },
  };
  await boss.createQueue(SITING_QUEUE, { name: SITING_QUEUE, retryLimit: 0, expireInSeconds: JOB_EXPIRY_S });
  const sitingQueue: CoverageQueue = {
    async enqueue(runId) {
      const id = await boss.send(SITING_QUEUE, { runId });
      if (!id) throw new Error('The job queue did not accept the run.');
      return id;
    },
    async cancel(jobId) {
      await boss.cancel(SITING_QUEUE, jobId);
    },
  };
  return { boss, queue, sitingQueue, stop: () => boss.stop({ graceful: true, timeout: 10_000 }) };
}

/**
 * Takes coverage jobs off the queue one at a time (a run already uses every
 * core through the viewshed pool) and hands each run id to `handle`.
 */
export async function workCoverageQueue(
  boss: PgBoss,
  handle: (runId: string, attempt: number | undefined) => Promise<void>,
): Promise<string> {
  return boss.work<{ runId: string; attempt?: number }>(
    COVERAGE_QUEUE,
    { batchSize: 1, pollingIntervalSeconds: 1 },
    async ([job]) => {
      if (job) await handle(job.data.runId, job.data.attempt);
    },
  );
}

/** Takes siting jobs off the queue one at a time and hands each run id to `handle`. */
export async function workSitingQueue(boss: PgBoss, handle: (runId: string) => Promise<void>): Promise<string> {
  return boss.work<{ runId: string }>(SITING_QUEUE, { batchSize: 1, pollingIntervalSeconds: 1 }, async ([job]) => {
    if (job) await handle(job.data.runId);
  });
}
