import type { Migration } from '../migrator';

/**
 * A siting run that has ended (done, failed or cancelled) never changes again,
 * as coverage runs (migration 0019): a trigger refuses DELETE of such a row
 * and any UPDATE of it but one — recording the draft plan made from it
 * (`plan_id` from null to a plan, once, or back to null when that plan is
 * removed; `updated_at` may follow). Its frozen inputs, status and result stay
 * as they were, whoever asks (the application's role cannot disable a trigger).
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.sequelize.query(`
    CREATE FUNCTION siting_runs_refuse_finished_change() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      IF TG_OP = 'UPDATE'
         AND (to_jsonb(NEW) - 'plan_id' - 'updated_at') = (to_jsonb(OLD) - 'plan_id' - 'updated_at')
         AND (OLD.plan_id IS NULL OR NEW.plan_id IS NULL OR NEW.plan_id = OLD.plan_id) THEN
        RETURN NEW;
      END IF;
      RAISE EXCEPTION 'siting run % has ended (%) and cannot change', OLD.id, OLD.status;
    END $$;
    CREATE TRIGGER siting_runs_finished_frozen
      BEFORE UPDATE OR DELETE ON siting_runs
      FOR EACH ROW WHEN (OLD.status IN ('done', 'failed', 'cancelled'))
      EXECUTE FUNCTION siting_runs_refuse_finished_change();
  `);
};

export const down: Migration = async ({ context: qi }) => {
  await qi.sequelize.query(`
    DROP TRIGGER IF EXISTS siting_runs_finished_frozen ON siting_runs;
    DROP FUNCTION IF EXISTS siting_runs_refuse_finished_change();
  `);
};
