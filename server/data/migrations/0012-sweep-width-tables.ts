import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

/**
 * Sweep-width tables: an organisation's library of sweep widths per search
 * object × visibility × height, each naming the edition and source it was
 * taken from; retired tables are kept for the record.
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('sweep_width_tables', {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    organization_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: 'organizations', key: 'id' },
      onDelete: 'RESTRICT',
    },
    name: { type: DataTypes.STRING(120), allowNull: false },
    edition: { type: DataTypes.STRING(120), allowNull: false },
    source_name: { type: DataTypes.STRING(200), allowNull: false },
    is_example: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    rows: { type: DataTypes.JSONB, allowNull: false },
    retired_at: { type: DataTypes.DATE, allowNull: true },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  });
  await qi.sequelize.query(
    `ALTER TABLE sweep_width_tables ADD CONSTRAINT sweep_width_table_names CHECK (length(trim(edition)) > 0 AND length(trim(source_name)) > 0)`,
  );
  await qi.addIndex('sweep_width_tables', ['organization_id']);
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('sweep_width_tables');
};
