import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

/** Coverage plans, their frozen revisions and their reviews. */
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('plans', {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    organization_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: 'organizations', key: 'id' },
      onDelete: 'RESTRICT',
    },
    site_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'sites', key: 'id' }, onDelete: 'RESTRICT' },
    previous_id: { type: DataTypes.UUID, allowNull: true, references: { model: 'plans', key: 'id' }, onDelete: 'RESTRICT' },
    title: { type: DataTypes.STRING(200), allowNull: false },
    post_ids: { type: DataTypes.JSONB, allowNull: false },
    target_ids: { type: DataTypes.JSONB, allowNull: false },
    condition_set_ids: { type: DataTypes.JSONB, allowNull: false },
    standard: { type: DataTypes.JSONB, allowNull: false },
    status: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'draft' },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
    row_version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    prepared_by_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'RESTRICT' },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  });
  await qi.sequelize.query(
    "ALTER TABLE plans ADD CONSTRAINT plans_status_check CHECK (status IN ('draft','submitted','returned','approved','superseded'))",
  );
  await qi.addIndex('plans', ['organization_id', 'status']);
  await qi.createTable('plan_revisions', {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    plan_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'plans', key: 'id' }, onDelete: 'RESTRICT' },
    number: { type: DataTypes.INTEGER, allowNull: false },
    content_hash: { type: DataTypes.STRING(64), allowNull: false },
    snapshot: { type: DataTypes.JSONB, allowNull: false },
    submitted_by_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'RESTRICT' },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  });
  await qi.addIndex('plan_revisions', ['plan_id', 'number'], { unique: true });
  // Revisions are frozen: the database itself refuses to change or remove one.
  await qi.sequelize.query(`
    CREATE FUNCTION plan_revisions_frozen() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN RAISE EXCEPTION 'plan revisions cannot be changed'; END $$;
    CREATE TRIGGER plan_revisions_frozen BEFORE UPDATE OR DELETE ON plan_revisions
      FOR EACH ROW EXECUTE FUNCTION plan_revisions_frozen();
  `);
  await qi.createTable('plan_reviews', {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    plan_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'plans', key: 'id' }, onDelete: 'RESTRICT' },
    revision: { type: DataTypes.INTEGER, allowNull: false },
    decision: { type: DataTypes.STRING(8), allowNull: false },
    comment: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    reviewer_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'RESTRICT' },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('plan_reviews');
  await qi.sequelize.query(
    'DROP TRIGGER IF EXISTS plan_revisions_frozen ON plan_revisions; DROP FUNCTION IF EXISTS plan_revisions_frozen()',
  );
  await qi.dropTable('plan_revisions');
  await qi.dropTable('plans');
};
