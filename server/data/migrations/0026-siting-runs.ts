import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

/**
 * Siting runs of a site (queued on pg-boss, computed by the coverage workers):
 * the frozen inputs, status and progress, and — only once done, written in one
 * statement — the result (steps, chosen, the added-area layer). A cancelled or
 * failed run keeps no result. `plan_id` is the draft plan made from it.
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('siting_runs', {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    organization_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: 'organizations', key: 'id' },
      onDelete: 'RESTRICT',
    },
    site_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'sites', key: 'id' }, onDelete: 'RESTRICT' },
    terrain_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: 'site_terrains', key: 'id' },
      onDelete: 'RESTRICT',
    },
    inputs_hash: { type: DataTypes.STRING(64), allowNull: false },
    inputs: { type: DataTypes.JSONB, allowNull: false },
    status: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'queued' },
    progress: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
    stage: { type: DataTypes.STRING(200), allowNull: false, defaultValue: 'Waiting for a worker' },
    error: { type: DataTypes.TEXT, allowNull: true },
    job_id: { type: DataTypes.STRING(64), allowNull: true },
    requested_by_id: { type: DataTypes.UUID, allowNull: true, references: { model: 'users', key: 'id' } },
    result: { type: DataTypes.JSONB, allowNull: true },
    plan_id: { type: DataTypes.UUID, allowNull: true, references: { model: 'plans', key: 'id' }, onDelete: 'SET NULL' },
    elapsed_s: { type: DataTypes.DOUBLE, allowNull: true },
    heartbeat_at: { type: DataTypes.DATE, allowNull: true },
    started_at: { type: DataTypes.DATE, allowNull: true },
    finished_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  });
  await qi.sequelize.query(
    "ALTER TABLE siting_runs ADD CONSTRAINT siting_runs_status CHECK (status IN ('queued','running','done','failed','cancelled'))",
  );
  // Only a finished run has a result: a cancelled or failed one keeps nothing.
  await qi.sequelize.query(
    "ALTER TABLE siting_runs ADD CONSTRAINT siting_runs_result_when_done CHECK (result IS NULL OR status = 'done')",
  );
  await qi.addIndex('siting_runs', ['site_id', 'created_at']);
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('siting_runs');
};
