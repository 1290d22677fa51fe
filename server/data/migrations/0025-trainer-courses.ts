import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

/**
 * Trainer courses: a planner's drill set (kinds, posts, number of questions,
 * pass mark, validity), the people it is assigned to, and their attempts —
 * each a set of drills (`trainer_drills.attempt_id`) scored when the last is
 * answered. A person is qualified while a passed attempt is within the validity.
 */
export const up: Migration = async ({ context: qi }) => {
  const org = {
    type: DataTypes.UUID,
    allowNull: false,
    references: { model: 'organizations', key: 'id' },
    onDelete: 'RESTRICT',
  } as const;
  await qi.createTable('trainer_courses', {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    organization_id: org,
    name: { type: DataTypes.STRING(120), allowNull: false },
    kinds: { type: DataTypes.JSONB, allowNull: false },
    post_ids: { type: DataTypes.JSONB, allowNull: false },
    question_count: { type: DataTypes.INTEGER, allowNull: false },
    pass_mark_pct: { type: DataTypes.DOUBLE, allowNull: false },
    validity_days: { type: DataTypes.INTEGER, allowNull: false },
    units: { type: DataTypes.STRING(20), allowNull: false },
    created_by_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'RESTRICT' },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  });
  await qi.sequelize.query(`
    ALTER TABLE trainer_courses
      ADD CONSTRAINT trainer_courses_figures CHECK (
        question_count BETWEEN 1 AND 50 AND pass_mark_pct BETWEEN 0 AND 100 AND validity_days BETWEEN 1 AND 3650)`);
  await qi.addIndex('trainer_courses', ['organization_id']);

  await qi.createTable('trainer_course_assignees', {
    course_id: {
      type: DataTypes.UUID,
      allowNull: false,
      primaryKey: true,
      references: { model: 'trainer_courses', key: 'id' },
      onDelete: 'CASCADE',
    },
    user_id: {
      type: DataTypes.UUID,
      allowNull: false,
      primaryKey: true,
      references: { model: 'users', key: 'id' },
      onDelete: 'RESTRICT',
    },
    organization_id: org,
    assigned_by_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'RESTRICT' },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  });

  await qi.createTable('trainer_course_attempts', {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    organization_id: org,
    course_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: 'trainer_courses', key: 'id' },
      onDelete: 'RESTRICT',
    },
    user_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'RESTRICT' },
    seed: { type: DataTypes.INTEGER, allowNull: false },
    question_count: { type: DataTypes.INTEGER, allowNull: false },
    pass_mark_pct: { type: DataTypes.DOUBLE, allowNull: false },
    completed_at: { type: DataTypes.DATE, allowNull: true },
    score_pct: { type: DataTypes.DOUBLE, allowNull: true },
    passed: { type: DataTypes.BOOLEAN, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  });
  await qi.sequelize.query(`
    ALTER TABLE trainer_course_attempts
      ADD CONSTRAINT trainer_course_attempts_result CHECK (
        (completed_at IS NULL) = (score_pct IS NULL) AND (completed_at IS NULL) = (passed IS NULL))`);
  await qi.addIndex('trainer_course_attempts', ['course_id', 'user_id', 'completed_at']);

  await qi.addColumn('trainer_drills', 'attempt_id', {
    type: DataTypes.UUID,
    allowNull: true,
    references: { model: 'trainer_course_attempts', key: 'id' },
    onDelete: 'RESTRICT',
  });
  await qi.addColumn('trainer_drills', 'position', { type: DataTypes.INTEGER, allowNull: true });
  await qi.sequelize.query(
    'CREATE UNIQUE INDEX trainer_drills_one_per_position ON trainer_drills (attempt_id, position) WHERE attempt_id IS NOT NULL',
  );
};

export const down: Migration = async ({ context: qi }) => {
  await qi.removeColumn('trainer_drills', 'position');
  await qi.removeColumn('trainer_drills', 'attempt_id');
  await qi.dropTable('trainer_course_attempts');
  await qi.dropTable('trainer_course_assignees');
  await qi.dropTable('trainer_courses');
};
