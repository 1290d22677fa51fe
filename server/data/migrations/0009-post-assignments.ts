import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

/** Watches: a person on a post for a stretch of time. */
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('post_assignments', {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    organization_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: 'organizations', key: 'id' },
      onDelete: 'RESTRICT',
    },
    post_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'posts', key: 'id' }, onDelete: 'RESTRICT' },
    user_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'RESTRICT' },
    starts_at: { type: DataTypes.DATE, allowNull: false },
    ends_at: { type: DataTypes.DATE, allowNull: true },
    note: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    deleted_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  });
  await qi.sequelize.query(
    'ALTER TABLE post_assignments ADD CONSTRAINT post_assignments_order CHECK (ends_at IS NULL OR ends_at > starts_at)',
  );
  await qi.addIndex('post_assignments', ['post_id', 'starts_at']);
  await qi.addIndex('post_assignments', ['user_id', 'starts_at']);
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('post_assignments');
};
