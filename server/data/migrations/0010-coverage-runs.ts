import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

/**
 * Terrain coverage runs of plans (queued on pg-boss, computed by workers) and
 * their layers. A finished run never changes: plan revisions refer to it.
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('coverage_runs', {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    organization_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: 'organizations', key: 'id' },
      onDelete: 'RESTRICT',
    },
    plan_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'plans', key: 'id' }, onDelete: 'RESTRICT' },
    site_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'sites', key: 'id' }, onDelete: 'RESTRICT' },
    terrain_id: {
      type: DataTypes.UUID,
      allowNull: true,
      references: { model: 'site_terrains', key: 'id' },
      onDelete: 'RESTRICT',
    },
    datum: { type: DataTypes.STRING(16), allowNull: false },
    inputs_hash: { type: DataTypes.STRING(64), allowNull: false },
    inputs: { type: DataTypes.JSONB, allowNull: false },
    status: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'queued' },
    progress: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
    stage: { type: DataTypes.STRING(200), allowNull: false, defaultValue: 'Waiting for a worker' },
    error: { type: DataTypes.TEXT, allowNull: true },
    job_id: { type: DataTypes.STRING(64), allowNull: true },
    requested_by_id: { type: DataTypes.UUID, allowNull: true, references: { model: 'users', key: 'id' } },
    grid: { type: DataTypes.JSONB, allowNull: true },
    cases: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
    elapsed_s: { type: DataTypes.DOUBLE, allowNull: true },
    started_at: { type: DataTypes.DATE, allowNull: true },
    finished_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  });
  await qi.sequelize.query(
    "ALTER TABLE coverage_runs ADD CONSTRAINT coverage_runs_status CHECK (status IN ('queued','running','done','failed','cancelled'))",
  );
  await qi.addIndex('coverage_runs', ['plan_id', 'created_at']);
  await qi.addIndex('coverage_runs', ['plan_id', 'inputs_hash']);

  await qi.createTable('coverage_layers', {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    run_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: 'coverage_runs', key: 'id' },
      onDelete: 'CASCADE',
    },
    case_key: { type: DataTypes.STRING(120), allowNull: false },
    layer: { type: DataTypes.STRING(32), allowNull: false },
    /** The post of a per-post layer; '' for whole-network layers. */
    post_id: { type: DataTypes.STRING(36), allowNull: false, defaultValue: '' },
    /** The EncodedClassRaster (kenning-rle8/1). */
    encoded: { type: DataTypes.JSONB, allowNull: false },
    sha256: { type: DataTypes.STRING(64), allowNull: false },
  });
  await qi.addIndex('coverage_layers', ['run_id', 'case_key', 'layer', 'post_id'], { unique: true });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('coverage_layers');
  await qi.dropTable('coverage_runs');
};
