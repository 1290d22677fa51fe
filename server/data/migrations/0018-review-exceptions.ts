import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

/**
 * Review integrity: a revision freezes its plan's verdict against the
 * standard and, when the plan fails it, the planner's exception note; a
 * review of a failing revision keeps the reviewer's written justification.
 * Reviews are frozen like revisions: the database refuses to change or remove
 * one. (Adding a column does not fire the revisions' UPDATE trigger; rows made
 * before this migration keep null: no verdict was frozen then.)
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.addColumn('plan_revisions', 'standard_verdict', { type: DataTypes.JSONB, allowNull: true });
  await qi.addColumn('plan_revisions', 'exception_note', { type: DataTypes.TEXT, allowNull: true });
  await qi.addColumn('plan_reviews', 'exception_justification', { type: DataTypes.TEXT, allowNull: true });
  await qi.sequelize.query(`
    CREATE FUNCTION plan_reviews_frozen() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN RAISE EXCEPTION 'plan reviews cannot be changed'; END $$;
    CREATE TRIGGER plan_reviews_frozen BEFORE UPDATE OR DELETE ON plan_reviews
      FOR EACH ROW EXECUTE FUNCTION plan_reviews_frozen();
  `);
};

export const down: Migration = async ({ context: qi }) => {
  await qi.sequelize.query(
    'DROP TRIGGER IF EXISTS plan_reviews_frozen ON plan_reviews; DROP FUNCTION IF EXISTS plan_reviews_frozen()',
  );
  await qi.removeColumn('plan_reviews', 'exception_justification');
  // Removing a column is not an UPDATE of rows: the revisions' trigger lets it through.
  await qi.removeColumn('plan_revisions', 'exception_note');
  await qi.removeColumn('plan_revisions', 'standard_verdict');
};
