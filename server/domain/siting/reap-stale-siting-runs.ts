import type { Sequelize } from 'sequelize';
import { REAP_EVERY_S, STALE_AFTER_S, repeatUnlessBusy } from '../coverage/run-heartbeat';

/** The reason a siting run whose worker stopped shows. */
export const SITING_WORKER_STOPPED =
  'The worker computing this run stopped (no sign of life for a while). Ask for the siting again; if it happens again, tell your administrator.';

/** The reason a queued siting run whose job the queue no longer holds shows. */
export const SITING_JOB_LOST =
  'The job queue no longer holds this run, so no worker will take it. Ask for the siting again; if it happens again, tell your administrator.';

/**
 * Fails the siting runs no worker will finish, with the reason:
 * - running, with neither a heartbeat nor a progress write for `staleAfterS`
 *   (the worker beats every 5 s; a run is computed again by asking again, as
 *   its inputs are frozen and reproducible);
 * - queued for more than `staleAfterS` while its pg-boss job is no longer
 *   waiting or held (failed, cancelled, completed, expired away or archived),
 *   looked up only where the `pgboss` schema exists.
 *
 * Each is one UPDATE guarded by the status it found, so two reapers never
 * both act on a run and a run a worker has just taken is left alone; a worker
 * that comes back finds its run ended and stores nothing (its writes are
 * guarded the same way).
 *
 * @returns the ids of the runs failed
 */
export async function reapStaleSitingRuns(
  db: Sequelize,
  { staleAfterS = STALE_AFTER_S }: { staleAfterS?: number } = {},
): Promise<{ failed: string[] }> {
  const [running] = await db.query(
    `UPDATE siting_runs
        SET status = 'failed', stage = 'Failed', error = :reason, finished_at = now(), updated_at = now()
      WHERE status = 'running'
        AND GREATEST(COALESCE(heartbeat_at, 'epoch'::timestamptz), updated_at) < now() - make_interval(secs => :staleAfterS)
      RETURNING id`,
    { replacements: { reason: SITING_WORKER_STOPPED, staleAfterS } },
  );
  const failed = (running as { id: string }[]).map((r) => r.id);
  const [[queue]] = (await db.query(`SELECT to_regclass('pgboss.job') IS NOT NULL AS present`)) as [
    { present: boolean }[],
    unknown,
  ];
  if (queue?.present) {
    const [lost] = await db.query(
      `UPDATE siting_runs r
          SET status = 'failed', stage = 'Failed', error = :reason, finished_at = now(), updated_at = now()
        WHERE r.status = 'queued' AND r.job_id IS NOT NULL
          AND GREATEST(COALESCE(r.heartbeat_at, 'epoch'::timestamptz), r.updated_at) < now() - make_interval(secs => :staleAfterS)
          AND NOT EXISTS (
            SELECT 1 FROM pgboss.job j
             WHERE j.id::text = r.job_id AND j.state IN ('created', 'retry', 'active'))
        RETURNING r.id`,
      { replacements: { reason: SITING_JOB_LOST, staleAfterS } },
    );
    failed.push(...(lost as { id: string }[]).map((r) => r.id));
  }
  if (failed.length) console.warn(`[kenning] failed ${failed.length} siting run(s) no worker will finish: ${failed.join(', ')}`);
  return { failed };
}

/** Looks for such runs every `everyS` seconds until stopped; errors (database away) are skipped. */
export function startStaleSitingReaper(
  db: Sequelize,
  { everyS = REAP_EVERY_S, staleAfterS = STALE_AFTER_S }: { everyS?: number; staleAfterS?: number } = {},
) {
  return repeatUnlessBusy(() => reapStaleSitingRuns(db, { staleAfterS }), everyS);
}
