import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

/**
 * Terrain per site: one row per uploaded elevation grid. The grid itself lives
 * in the file store as a normalised Float32 GeoTIFF (`store_key`), beside its
 * hillshade picture (`hillshade_key`). A site has at most one active terrain;
 * replaced ones stay (inactive) because plan revisions refer to a terrain by
 * id and sha256.
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('site_terrains', {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    organization_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: 'organizations', key: 'id' },
      onDelete: 'RESTRICT',
    },
    site_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'sites', key: 'id' }, onDelete: 'RESTRICT' },
    active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    store_key: { type: DataTypes.STRING(64), allowNull: false },
    sha256: { type: DataTypes.STRING(64), allowNull: false },
    stored_bytes: { type: DataTypes.BIGINT, allowNull: false },
    original_name: { type: DataTypes.STRING(255), allowNull: false },
    original_format: { type: DataTypes.STRING(16), allowNull: false },
    original_bytes: { type: DataTypes.BIGINT, allowNull: false },
    width: { type: DataTypes.INTEGER, allowNull: false },
    height: { type: DataTypes.INTEGER, allowNull: false },
    cell_size_m: { type: DataTypes.DOUBLE, allowNull: false },
    xll_m: { type: DataTypes.DOUBLE, allowNull: false },
    yll_m: { type: DataTypes.DOUBLE, allowNull: false },
    epsg: { type: DataTypes.INTEGER, allowNull: true },
    crs_wkt: { type: DataTypes.TEXT, allowNull: true },
    crs_label: { type: DataTypes.STRING(255), allowNull: false },
    nodata_value: { type: DataTypes.DOUBLE, allowNull: true },
    nodata_cells: { type: DataTypes.BIGINT, allowNull: false },
    min_elevation_m: { type: DataTypes.DOUBLE, allowNull: false },
    max_elevation_m: { type: DataTypes.DOUBLE, allowNull: false },
    covers_boundary: { type: DataTypes.BOOLEAN, allowNull: true },
    hillshade_key: { type: DataTypes.STRING(64), allowNull: false },
    hillshade_width: { type: DataTypes.INTEGER, allowNull: false },
    hillshade_height: { type: DataTypes.INTEGER, allowNull: false },
    /** WGS84 corners of the grid: { northWest, northEast, southEast, southWest } as { latDeg, lonDeg }. */
    corners: { type: DataTypes.JSONB, allowNull: false },
    uploaded_by_id: { type: DataTypes.UUID, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  });
  await qi.sequelize.query(
    "ALTER TABLE site_terrains ADD CONSTRAINT site_terrains_format_check CHECK (original_format IN ('geotiff','esri-ascii'))",
  );
  await qi.sequelize.query('CREATE UNIQUE INDEX site_terrains_one_active ON site_terrains (site_id) WHERE active');
  await qi.addIndex('site_terrains', ['organization_id', 'site_id']);
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('site_terrains');
};
