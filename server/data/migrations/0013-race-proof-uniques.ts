import type { Migration } from '../migrator';

/**
 * Duplicates that a check-then-insert lets through under concurrent requests are
 * refused by the database itself:
 * - one person cannot hold two watches whose times overlap (half-open ranges, like
 *   the roster's own clash check), an exclusion constraint over btree_gist;
 * - a plan has at most one queued or running coverage run for the same inputs.
 * Existing exact duplicates (what such races left behind) are cleared first.
 */
export const up: Migration = async ({ context: qi }) => {
  const q = (sql: string) => qi.sequelize.query(sql);
  await q('CREATE EXTENSION IF NOT EXISTS btree_gist');

  // Exact duplicate watches: keep the oldest, soft-delete the rest.
  await q(`
    UPDATE post_assignments a SET deleted_at = now()
    WHERE a.deleted_at IS NULL AND EXISTS (
      SELECT 1 FROM post_assignments b
      WHERE b.deleted_at IS NULL AND b.user_id = a.user_id AND b.post_id = a.post_id
        AND b.starts_at = a.starts_at AND b.ends_at IS NOT DISTINCT FROM a.ends_at
        AND (b.created_at, b.id) < (a.created_at, a.id))`);
  await q(`
    ALTER TABLE post_assignments ADD CONSTRAINT post_assignments_no_overlap
    EXCLUDE USING gist (user_id WITH =, tstzrange(starts_at, ends_at, '[)') WITH &&)
    WHERE (deleted_at IS NULL)`);

  // Duplicate active runs: keep the oldest, cancel the rest.
  await q(`
    UPDATE coverage_runs r SET status = 'cancelled', finished_at = now(), error = 'A duplicate of an earlier run.'
    WHERE r.status IN ('queued','running') AND EXISTS (
      SELECT 1 FROM coverage_runs o
      WHERE o.plan_id = r.plan_id AND o.inputs_hash = r.inputs_hash AND o.status IN ('queued','running')
        AND (o.created_at, o.id) < (r.created_at, r.id))`);
  await q(`
    CREATE UNIQUE INDEX coverage_runs_one_active_per_inputs ON coverage_runs (plan_id, inputs_hash)
    WHERE status IN ('queued','running')`);
};

export const down: Migration = async ({ context: qi }) => {
  await qi.sequelize.query('DROP INDEX IF EXISTS coverage_runs_one_active_per_inputs');
  await qi.sequelize.query('ALTER TABLE post_assignments DROP CONSTRAINT IF EXISTS post_assignments_no_overlap');
};
