import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

const timestamps = {
  created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
};

/** Site geometry, priority zones, posts and the audit trail. */
export const up: Migration = async ({ context: qi }) => {
  await qi.addColumn('sites', 'boundary', { type: DataTypes.GEOMETRY('POLYGON', 4326), allowNull: true });
  await qi.addColumn('sites', 'default_units', { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'metric' });
  await qi.addColumn('sites', 'time_zone', { type: DataTypes.STRING(64), allowNull: false, defaultValue: 'UTC' });

  await qi.createTable('priority_zones', {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    site_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'sites', key: 'id' }, onDelete: 'CASCADE' },
    name: { type: DataTypes.STRING(120), allowNull: false },
    weight: { type: DataTypes.INTEGER, allowNull: false },
    area: { type: DataTypes.GEOMETRY('POLYGON', 4326), allowNull: false },
    position: { type: DataTypes.INTEGER, allowNull: false },
    ...timestamps,
  });
  await qi.addIndex('priority_zones', ['site_id']);

  await qi.createTable('posts', {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    organization_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: 'organizations', key: 'id' },
      onDelete: 'RESTRICT',
    },
    site_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'sites', key: 'id' }, onDelete: 'RESTRICT' },
    name: { type: DataTypes.STRING(120), allowNull: false },
    kind: { type: DataTypes.STRING(16), allowNull: false },
    location: { type: DataTypes.GEOMETRY('POINT', 4326), allowNull: false },
    ground_elevation_m: { type: DataTypes.DOUBLE, allowNull: false },
    structure_height_m: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
    eye_height_m: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 1.6 },
    sector_from_deg: { type: DataTypes.DOUBLE, allowNull: true },
    sector_to_deg: { type: DataTypes.DOUBLE, allowNull: true },
    status: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'existing' },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    deleted_at: { type: DataTypes.DATE, allowNull: true },
    ...timestamps,
  });
  await qi.addIndex('posts', ['site_id']);
  await qi.sequelize.query('CREATE INDEX posts_location_gist ON posts USING GIST (location)');
  await qi.sequelize.query(
    "ALTER TABLE posts ADD CONSTRAINT posts_kind_check CHECK (kind IN ('tower','hilltop','shore-post','vessel','aircraft'))",
  );
  await qi.sequelize.query("ALTER TABLE posts ADD CONSTRAINT posts_status_check CHECK (status IN ('existing','proposed'))");

  await qi.createTable('audit_events', {
    id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
    organization_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: 'organizations', key: 'id' },
      onDelete: 'RESTRICT',
    },
    actor_id: { type: DataTypes.UUID, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    action: { type: DataTypes.STRING(40), allowNull: false },
    entity_type: { type: DataTypes.STRING(40), allowNull: false },
    entity_id: { type: DataTypes.UUID, allowNull: false },
    /** { before?, after? } summaries of what changed. */
    summary: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  });
  await qi.addIndex('audit_events', ['organization_id', 'entity_type', 'entity_id']);
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('audit_events');
  await qi.dropTable('posts');
  await qi.dropTable('priority_zones');
  await qi.removeColumn('sites', 'time_zone');
  await qi.removeColumn('sites', 'default_units');
  await qi.removeColumn('sites', 'boundary');
};
