import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

/**
 * Landmarks: named reference marks of a site (a hut, a summit cairn, a mast)
 * with their WGS84 position and, optionally, their height above the ground;
 * used to give a position as "distance and bearing from a landmark" and for
 * landmark-range drills. A name is unique within its site (case-insensitive).
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('site_landmarks', {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    organization_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: 'organizations', key: 'id' },
      onDelete: 'RESTRICT',
    },
    site_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'sites', key: 'id' }, onDelete: 'CASCADE' },
    name: { type: DataTypes.STRING(120), allowNull: false },
    lat_deg: { type: DataTypes.DOUBLE, allowNull: false },
    lon_deg: { type: DataTypes.DOUBLE, allowNull: false },
    height_m: { type: DataTypes.DOUBLE, allowNull: true },
    note: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  });
  await qi.sequelize.query(
    'ALTER TABLE site_landmarks ADD CONSTRAINT site_landmarks_position CHECK (lat_deg BETWEEN -90 AND 90 AND lon_deg BETWEEN -180 AND 180)',
  );
  await qi.sequelize.query('CREATE UNIQUE INDEX site_landmarks_site_name ON site_landmarks (site_id, lower(name))');
  await qi.addIndex('site_landmarks', ['organization_id']);
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('site_landmarks');
};
