import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

const common = {
  id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
  organization_id: {
    type: DataTypes.UUID,
    allowNull: false,
    references: { model: 'organizations', key: 'id' },
    onDelete: 'RESTRICT',
  },
  name: { type: DataTypes.STRING(120), allowNull: false },
  version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
  deleted_at: { type: DataTypes.DATE, allowNull: true },
  created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
};

/** The organisation's libraries: target profiles and condition sets. */
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('target_profiles', {
    ...common,
    kind: { type: DataTypes.STRING(24), allowNull: false },
    height_m: { type: DataTypes.DOUBLE, allowNull: false },
    width_m: { type: DataTypes.DOUBLE, allowNull: false },
    required_visible_m: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
    period: { type: DataTypes.STRING(8), allowNull: false, defaultValue: 'day' },
  });
  await qi.sequelize.query(
    'ALTER TABLE target_profiles ADD CONSTRAINT target_required_part CHECK (required_visible_m <= height_m)',
  );
  await qi.createTable('condition_sets', {
    ...common,
    conditions: { type: DataTypes.JSONB, allowNull: false },
    visibility_m: { type: DataTypes.DOUBLE, allowNull: true },
    visibility_kind: { type: DataTypes.STRING(32), allowNull: false, defaultValue: 'mor-5pct' },
  });
  await qi.addIndex('target_profiles', ['organization_id']);
  await qi.addIndex('condition_sets', ['organization_id']);
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('condition_sets');
  await qi.dropTable('target_profiles');
};
