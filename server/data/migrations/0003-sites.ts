import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('sites', {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    organization_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: 'organizations', key: 'id' },
      onDelete: 'RESTRICT',
    },
    name: { type: DataTypes.STRING(160), allowNull: false },
    kind: { type: DataTypes.ENUM('forest-district', 'coast-stretch', 'search-area'), allowNull: false },
    notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    deleted_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  });
  await qi.addIndex('sites', ['organization_id', 'name']);
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('sites');
  await qi.sequelize.query('DROP TYPE IF EXISTS enum_sites_kind');
};
