import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

/**
 * A coverage run that has ended (done, failed or cancelled) never changes again,
 * whoever asks: a trigger refuses UPDATE and DELETE of such a row (a revision
 * freezes a run's id and figures; the application's role cannot disable the
 * trigger, it owns no table). `attempts` counts how often the run was handed to a
 * worker: a run whose worker died is queued again once, then failed with the reason.
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.addColumn('coverage_runs', 'attempts', { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 });
  await qi.sequelize.query(`
    CREATE FUNCTION coverage_runs_refuse_finished_change() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      RAISE EXCEPTION 'coverage run % has ended (%) and cannot change', OLD.id, OLD.status;
    END $$;
    CREATE TRIGGER coverage_runs_finished_frozen
      BEFORE UPDATE OR DELETE ON coverage_runs
      FOR EACH ROW WHEN (OLD.status IN ('done', 'failed', 'cancelled'))
      EXECUTE FUNCTION coverage_runs_refuse_finished_change();
  `);
};

export const down: Migration = async ({ context: qi }) => {
  await qi.sequelize.query(`
    DROP TRIGGER IF EXISTS coverage_runs_finished_frozen ON coverage_runs;
    DROP FUNCTION IF EXISTS coverage_runs_refuse_finished_change();
  `);
  await qi.removeColumn('coverage_runs', 'attempts');
};
