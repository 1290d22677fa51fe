import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

/**
 * Visibility index layers ("where would a tower see the most?"): one row per
 * site terrain, tower height and radius, computed by a queued job. The seen
 * areas are kept as raw little-endian Float32 (m² per index cell) on the
 * index grid in `grid`; the map gets them in classes. A failed row stays for
 * the record; the partial unique index lets the same parameters be asked again.
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('visibility_index_layers', {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    organization_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: 'organizations', key: 'id' },
      onDelete: 'RESTRICT',
    },
    site_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'sites', key: 'id' }, onDelete: 'CASCADE' },
    terrain_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: 'site_terrains', key: 'id' },
      onDelete: 'CASCADE',
    },
    height_m: { type: DataTypes.DOUBLE, allowNull: false },
    radius_m: { type: DataTypes.DOUBLE, allowNull: false },
    rays: { type: DataTypes.INTEGER, allowNull: false },
    stride_cells: { type: DataTypes.INTEGER, allowNull: true },
    status: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'queued' },
    progress: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
    error: { type: DataTypes.TEXT, allowNull: true },
    job_id: { type: DataTypes.STRING(64), allowNull: true },
    grid: { type: DataTypes.JSONB, allowNull: true },
    seen_m2: { type: DataTypes.BLOB, allowNull: true },
    site_area_m2: { type: DataTypes.DOUBLE, allowNull: true },
    elapsed_s: { type: DataTypes.DOUBLE, allowNull: true },
    requested_by_id: { type: DataTypes.UUID, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    finished_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  });
  await qi.sequelize.query(
    `ALTER TABLE visibility_index_layers ADD CONSTRAINT visibility_index_layers_status
       CHECK (status IN ('queued', 'running', 'done', 'failed'))`,
  );
  await qi.sequelize.query(
    `CREATE UNIQUE INDEX visibility_index_layers_one_live ON visibility_index_layers (terrain_id, height_m, radius_m)
       WHERE status <> 'failed'`,
  );
  await qi.addIndex('visibility_index_layers', ['organization_id', 'site_id']);
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('visibility_index_layers');
};
