import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

/**
 * Trainer drills: a question set for one person from a seed, with its
 * solution kept back until the one answer. Answered once, by the database:
 * the answer is a conditional update (`answered_at IS NULL`), and a trigger
 * refuses any change to an answered drill.
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('trainer_drills', {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    organization_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: 'organizations', key: 'id' },
      onDelete: 'RESTRICT',
    },
    user_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'RESTRICT' },
    post_id: { type: DataTypes.UUID, allowNull: true, references: { model: 'posts', key: 'id' }, onDelete: 'RESTRICT' },
    kind: { type: DataTypes.STRING(40), allowNull: false },
    seed: { type: DataTypes.INTEGER, allowNull: false },
    units: { type: DataTypes.STRING(20), allowNull: false },
    question: { type: DataTypes.JSONB, allowNull: false },
    solution: { type: DataTypes.JSONB, allowNull: false },
    answer: { type: DataTypes.JSONB, allowNull: true },
    score: { type: DataTypes.DOUBLE, allowNull: true },
    answered_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  });
  await qi.sequelize.query(`
    ALTER TABLE trainer_drills
      ADD CONSTRAINT trainer_drills_answered CHECK ((answered_at IS NULL) = (score IS NULL) AND (answered_at IS NULL) = (answer IS NULL)),
      ADD CONSTRAINT trainer_drills_score CHECK (score IS NULL OR (score >= 0 AND score <= 1)),
      ADD CONSTRAINT trainer_drills_seed CHECK (seed >= 0)`);
  await qi.sequelize.query(`
    CREATE FUNCTION trainer_drills_answered_frozen() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      IF OLD.answered_at IS NOT NULL THEN
        RAISE EXCEPTION 'trainer drill % is answered and cannot change', OLD.id USING ERRCODE = 'integrity_constraint_violation';
      END IF;
      RETURN CASE WHEN TG_OP = 'DELETE' THEN OLD ELSE NEW END;
    END $$`);
  await qi.sequelize.query(`
    CREATE TRIGGER trainer_drills_answered_frozen BEFORE UPDATE OR DELETE ON trainer_drills
      FOR EACH ROW EXECUTE FUNCTION trainer_drills_answered_frozen()`);
  await qi.addIndex('trainer_drills', ['organization_id', 'user_id', 'created_at']);
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('trainer_drills');
  await qi.sequelize.query('DROP FUNCTION IF EXISTS trainer_drills_answered_frozen()');
};
