import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

/**
 * The worker computing a run writes `heartbeat_at` every few seconds; a running
 * run whose heartbeat (and last progress write) has gone stale belongs to a worker
 * that died, and is failed with the reason instead of staying "running".
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.addColumn('coverage_runs', 'heartbeat_at', { type: DataTypes.DATE, allowNull: true });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.removeColumn('coverage_runs', 'heartbeat_at');
};
