import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

/**
 * Coast watch along a shore: a site's shoreline (a line of [lon, lat] from its
 * start, chainage 0), the offshore bands its supervisor names, the datum its
 * heights are measured from and the tide level(s) the coverage run uses.
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.addColumn('sites', 'shoreline', { type: DataTypes.JSONB, allowNull: true });
  await qi.addColumn('sites', 'bands', { type: DataTypes.JSONB, allowNull: false, defaultValue: [] });
  await qi.addColumn('sites', 'height_datum', { type: DataTypes.STRING(24), allowNull: false, defaultValue: 'mean-sea-level' });
  await qi.sequelize.query(
    "ALTER TABLE sites ADD CONSTRAINT sites_height_datum_known CHECK (height_datum IN ('mean-sea-level', 'chart-datum'))",
  );
  await qi.addColumn('sites', 'tide', { type: DataTypes.JSONB, allowNull: true });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.removeColumn('sites', 'tide');
  await qi.removeColumn('sites', 'height_datum');
  await qi.removeColumn('sites', 'bands');
  await qi.removeColumn('sites', 'shoreline');
};
