import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

/**
 * Patrol routes for vessel and aircraft posts: the waypoints (`[lon, lat]`
 * pairs, WGS84), the speed along them (m/s) and the cycle (minutes). All
 * three or none; only moving kinds patrol.
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.addColumn('posts', 'route', { type: DataTypes.JSONB, allowNull: true });
  await qi.addColumn('posts', 'speed_mps', { type: DataTypes.DOUBLE, allowNull: true });
  await qi.addColumn('posts', 'cycle_minutes', { type: DataTypes.DOUBLE, allowNull: true });
  await qi.sequelize.query(`
    ALTER TABLE posts ADD CONSTRAINT posts_patrol_fields CHECK (
      (route IS NULL AND speed_mps IS NULL AND cycle_minutes IS NULL)
      OR (route IS NOT NULL AND kind IN ('vessel', 'aircraft') AND speed_mps > 0 AND cycle_minutes > 0))`);
};

export const down: Migration = async ({ context: qi }) => {
  await qi.sequelize.query('ALTER TABLE posts DROP CONSTRAINT IF EXISTS posts_patrol_fields');
  await qi.removeColumn('posts', 'cycle_minutes');
  await qi.removeColumn('posts', 'speed_mps');
  await qi.removeColumn('posts', 'route');
};
