import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

/**
 * Field calibrations ("k of the day"): the refraction coefficient solved from
 * a sighting (dip, reciprocal zenith angles, reference mark), logged with the
 * time, post, observer and weather, and the condition set it was saved as.
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('field_calibrations', {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    organization_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: 'organizations', key: 'id' },
      onDelete: 'RESTRICT',
    },
    post_id: { type: DataTypes.UUID, allowNull: true, references: { model: 'posts', key: 'id' }, onDelete: 'RESTRICT' },
    observer_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'RESTRICT' },
    observed_at: { type: DataTypes.DATE, allowNull: false },
    method: { type: DataTypes.STRING(20), allowNull: false },
    measurement: { type: DataTypes.JSONB, allowNull: false },
    weather: { type: DataTypes.JSONB, allowNull: true },
    notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    k: { type: DataTypes.DOUBLE, allowNull: true },
    k_min: { type: DataTypes.DOUBLE, allowNull: true },
    k_max: { type: DataTypes.DOUBLE, allowNull: true },
    result_kind: { type: DataTypes.STRING(20), allowNull: false },
    figures: { type: DataTypes.JSONB, allowNull: false },
    condition_set_id: {
      type: DataTypes.UUID,
      allowNull: true,
      references: { model: 'condition_sets', key: 'id' },
      onDelete: 'RESTRICT',
    },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  });
  await qi.sequelize.query(
    `ALTER TABLE field_calibrations ADD CONSTRAINT field_calibrations_method CHECK (method IN ('dip', 'reciprocal', 'mark'))`,
  );
  await qi.addIndex('field_calibrations', ['organization_id', 'observed_at']);
  await qi.addIndex('field_calibrations', ['post_id', 'observed_at']);
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('field_calibrations');
};
