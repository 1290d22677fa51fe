import type { Migration } from '../migrator';

/**
 * The sign-in limiter's counts (rate-limiter-flexible's PostgreSQL store, its own
 * table layout), shared by every server process. Made here so the application's
 * role needs no right to create tables.
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.sequelize.query(`
    CREATE TABLE sign_in_limits (
      key varchar(255) PRIMARY KEY,
      points integer NOT NULL DEFAULT 0,
      expire bigint
    )`);
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('sign_in_limits');
};
