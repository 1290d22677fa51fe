import type { Migration } from '../migrator';

/** Spatial types for boundaries, posts and terrain footprints. */
export const up: Migration = async ({ context: qi }) => {
  await qi.sequelize.query('CREATE EXTENSION IF NOT EXISTS postgis');
};

export const down: Migration = async ({ context: qi }) => {
  await qi.sequelize.query('DROP EXTENSION IF EXISTS postgis');
};
