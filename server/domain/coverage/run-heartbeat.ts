import type { Sequelize } from 'sequelize';

/** How often the worker computing a run says it is alive, seconds. */
export const HEARTBEAT_EVERY_S = 5;
/** A running run with no heartbeat nor progress for this long has lost its worker, seconds. */
export const STALE_AFTER_S = 30;
/** How often servers and workers look for such runs, seconds. */
export const REAP_EVERY_S = 10;

/** How often a run is handed to a worker at most: a run whose worker died is queued again once. */
export const MAX_ATTEMPTS = 2;

/** The stage a run queued again shows. */
export const REQUEUED_STAGE = 'Waiting for a worker (the first one stopped; computing again from the start)';

/** The reason a reaped run shows. */
export const WORKER_STOPPED =
  'The workers computing this run stopped twice (no sign of life for a while). Request the coverage again; if it happens again, tell your administrator.';

/** Queues a run again for its new attempt (the coverage queue's `enqueue`). */
export type Requeue = (runId: string, attempt: number) => Promise<unknown>;

/**
 * Runs `work` for a run while writing its heartbeat every `everyS` seconds (at once
 * too). A failed heartbeat write (the database away for a moment) is logged once
 * and tried again at the next beat; it never fails the run. Given `attempt`, only
 * that attempt of the run is kept alive (a worker that went quiet and whose run was
 * queued again must not keep the new attempt looking alive).
 */
export async function withHeartbeat<T>(
  db: Sequelize,
  runId: string,
  work: () => Promise<T>,
  { everyS = HEARTBEAT_EVERY_S, attempt }: { everyS?: number; attempt?: number } = {},
): Promise<T> {
  let warned = false;
  const beat = () =>
    db
      .query(
        `UPDATE coverage_runs SET heartbeat_at = now()
          WHERE id = :runId AND status IN ('queued', 'running') AND (CAST(:attempt AS integer) IS NULL OR attempts = :attempt)`,
        { replacements: { runId, attempt: attempt ?? null } },
      )
      .then(() => {
        warned = false;
      })
      .catch((error: unknown) => {
        if (!warned) console.error(`[kenning] coverage run ${runId}: heartbeat not written:`, (error as Error).message);
        warned = true;
      });
  await beat();
  const timer = setInterval(() => void beat(), everyS * 1000);
  try {
    return await work();
  } finally {
    clearInterval(timer);
  }
}

const STALE = `status = 'running'
  AND GREATEST(COALESCE(heartbeat_at, 'epoch'::timestamptz), updated_at) < now() - make_interval(secs => :staleAfterS)`;

/**
 * Deals with every running run whose worker has stopped (no heartbeat and no
 * progress write for `staleAfterS`). With `requeue`, a run on its first attempt is
 * queued again for another worker (attempts + 1, from the start); a run that has
 * had {@link MAX_ATTEMPTS}, or any run without `requeue`, is failed with
 * {@link WORKER_STOPPED}. Each UPDATE claims its rows, so two reapers never both
 * act on one run. A worker that was only slow and comes back finds its attempt
 * over and stores nothing.
 */
export async function reapStaleRuns(
  db: Sequelize,
  { requeue, staleAfterS = STALE_AFTER_S }: { requeue?: Requeue; staleAfterS?: number } = {},
): Promise<{ requeued: string[]; failed: string[] }> {
  const requeued: string[] = [];
  if (requeue) {
    const [rows] = await db.query(
      `UPDATE coverage_runs
          SET status = 'queued', attempts = attempts + 1, progress = 0, stage = :stage, heartbeat_at = NULL,
              started_at = NULL, updated_at = now()
        WHERE ${STALE} AND attempts < :maxAttempts
        RETURNING id, attempts`,
      { replacements: { stage: REQUEUED_STAGE, staleAfterS, maxAttempts: MAX_ATTEMPTS } },
    );
    for (const { id, attempts } of rows as { id: string; attempts: number }[]) {
      try {
        await requeue(id, attempts);
        requeued.push(id);
      } catch (error) {
        // No job, no worker will take it: fail it rather than leave it queued for ever.
        console.error(`[kenning] coverage run ${id} could not be queued again:`, (error as Error).message);
        await db.query(
          `UPDATE coverage_runs SET status = 'failed', stage = 'Failed', error = :reason, finished_at = now(), updated_at = now()
            WHERE id = :id AND status = 'queued'`,
          {
            replacements: {
              id,
              reason:
                'The worker computing this run stopped and the job queue could not take it again. Request the coverage again.',
            },
          },
        );
      }
    }
    if (requeued.length)
      console.warn(`[kenning] queued again ${requeued.length} coverage run(s) whose worker stopped: ${requeued.join(', ')}`);
  }
  const [rows] = await db.query(
    `UPDATE coverage_runs
        SET status = 'failed', stage = 'Failed', error = :reason, finished_at = now(), updated_at = now()
      WHERE ${STALE}
      RETURNING id`,
    { replacements: { reason: WORKER_STOPPED, staleAfterS } },
  );
  const failed = (rows as { id: string }[]).map((r) => r.id);
  if (failed.length) console.warn(`[kenning] failed ${failed.length} coverage run(s) whose worker stopped: ${failed.join(', ')}`);
  return { requeued, failed };
}

/** Looks for runs of dead workers every `everyS` seconds until stopped; errors (database away) are skipped. */
export function startStaleRunReaper(
  db: Sequelize,
  {
    everyS = REAP_EVERY_S,
    staleAfterS = STALE_AFTER_S,
    requeue,
  }: { everyS?: number; staleAfterS?: number; requeue?: Requeue } = {},
) {
  return repeatUnlessBusy(() => reapStaleRuns(db, { requeue, staleAfterS }), everyS);
}

/**
 * Runs `task` every `everyS` seconds until stopped, skipping a turn while the last
 * one is still going; its errors (database away) are skipped. The timer does not
 * keep the process alive.
 */
export function repeatUnlessBusy(task: () => Promise<unknown>, everyS: number) {
  let busy = false;
  const timer = setInterval(() => {
    if (busy) return;
    busy = true;
    task()
      .catch(() => {})
      .finally(() => {
        busy = false;
      });
  }, everyS * 1000);
  timer.unref();
  return { stop: () => clearInterval(timer) };
}
