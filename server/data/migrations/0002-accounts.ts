import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

const timestamps = {
  created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
};

export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('organizations', {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    name: { type: DataTypes.STRING(160), allowNull: false },
    slug: { type: DataTypes.STRING(60), allowNull: false, unique: true },
    ...timestamps,
  });
  await qi.createTable('users', {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    organization_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: 'organizations', key: 'id' },
      onDelete: 'RESTRICT',
    },
    email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(120), allowNull: false },
    role: { type: DataTypes.ENUM('admin', 'planner', 'reviewer', 'observer'), allowNull: false },
    password_hash: { type: DataTypes.STRING(100), allowNull: true },
    active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    invite_token_hash: { type: DataTypes.STRING(64), allowNull: true, unique: true },
    invite_expires_at: { type: DataTypes.DATE, allowNull: true },
    last_sign_in_at: { type: DataTypes.DATE, allowNull: true },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    ...timestamps,
  });
  await qi.addIndex('users', ['organization_id']);
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('users');
  await qi.sequelize.query('DROP TYPE IF EXISTS enum_users_role');
  await qi.dropTable('organizations');
};
