import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

/**
 * A person's own unit system (metric, nautical, imperial) for every form and
 * read-out; null = follow each site's default units.
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.addColumn('users', 'unit_preference', { type: DataTypes.STRING(16), allowNull: true });
  await qi.sequelize.query(
    "ALTER TABLE users ADD CONSTRAINT users_unit_preference_known CHECK (unit_preference IN ('metric', 'nautical', 'imperial'))",
  );
};

export const down: Migration = async ({ context: qi }) => {
  await qi.removeColumn('users', 'unit_preference');
};
