import { applyApplicationGrants } from '../application-role';
import type { Migration } from '../migrator';

/**
 * The application connects as a member of `kenning_application`: no superuser, no
 * owner, DML only where it needs it, audit events, revisions, reviews and coverage
 * layers append-only, no TRUNCATE anywhere. See server/data/application-role.ts.
 */
export const up: Migration = async ({ context: qi }) => {
  await applyApplicationGrants(qi.sequelize);
};

export const down: Migration = async ({ context: qi }) => {
  await qi.sequelize.query(
    'REVOKE ALL ON ALL TABLES IN SCHEMA public FROM kenning_application; REVOKE USAGE ON SCHEMA public FROM kenning_application',
  );
};
