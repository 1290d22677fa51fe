import type { Sequelize } from 'sequelize';

/** How often the worker computing a run says it is alive, seconds. */
export const HEARTBEAT_EVERY_S = 5;
/** A running run with no heartbeat nor progress for this long has lost its worker, seconds. */
export const STALE_AFTER_S = 30;
/** How often servers and workers look for such runs, seconds. */
export const REAP_EVERY_S = 10;

/** The reason a reaped run shows. */
export const WORKER_STOPPED =
  'The worker computing this run stopped (no sign of life for a while). Request the coverage again; if it happens again, tell your administrator.';

/**
 * Runs `work` for a run while writing its heartbeat every `everyS` seconds (at once
 * too). A failed heartbeat write (the database away for a moment) is logged once
 * and tried again at the next beat; it never fails the run.
 */
export async function withHeartbeat<T>(
  db: Sequelize,
  runId: string,
  work: () => Promise<T>,
  everyS = HEARTBEAT_EVERY_S,
): Promise<T> {
  let warned = false;
  const beat = () =>
    db
      .query("UPDATE coverage_runs SET heartbeat_at = now() WHERE id = :runId AND status IN ('queued', 'running')", {
        replacements: { runId },
      })
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

/**
 * Fails every running run whose worker has stopped: no heartbeat and no progress
 * write for `staleAfterS`. Returns the ids it failed. A worker that was only slow
 * and comes back finds its run failed and stores nothing (its writes need a run
 * that is still running).
 */
export async function failStaleRuns(db: Sequelize, staleAfterS = STALE_AFTER_S): Promise<string[]> {
  const [rows] = await db.query(
    `UPDATE coverage_runs
        SET status = 'failed', stage = 'Failed', error = :reason, finished_at = now(), updated_at = now()
      WHERE status = 'running'
        AND GREATEST(COALESCE(heartbeat_at, 'epoch'::timestamptz), updated_at) < now() - make_interval(secs => :staleAfterS)
      RETURNING id`,
    { replacements: { reason: WORKER_STOPPED, staleAfterS } },
  );
  const ids = (rows as { id: string }[]).map((r) => r.id);
  if (ids.length) console.warn(`[kenning] failed ${ids.length} coverage run(s) whose worker stopped: ${ids.join(', ')}`);
  return ids;
}

/** Looks for runs of dead workers every `everyS` seconds until stopped; errors (database away) are skipped. */
export function startStaleRunReaper(db: Sequelize, { everyS = REAP_EVERY_S, staleAfterS = STALE_AFTER_S } = {}) {
  let busy = false;
  const timer = setInterval(() => {
    if (busy) return;
    busy = true;
    failStaleRuns(db, staleAfterS)
      .catch(() => {})
      .finally(() => {
        busy = false;
      });
  }, everyS * 1000);
  timer.unref();
  return { stop: () => clearInterval(timer) };
}
