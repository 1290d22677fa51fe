import type { Sequelize } from 'sequelize';

/**
 * The group role the running application connects through (its login role, e.g.
 * `kenning_app`, is a member). Not a superuser and owning nothing in `public`, it
 * cannot TRUNCATE, ALTER or DISABLE TRIGGER, nor set `session_replication_role`:
 * the database's own guards (the revision trigger, the constraints) hold against it.
 * Migrations run as the owner.
 */
export const APPLICATION_ROLE = 'kenning_application';

/** The login role `npm start` and `npm test` give the server and the workers. */
export const APPLICATION_LOGIN = 'kenning_app';

/** Tables the application may read and add to but never change or delete from. */
export const APPEND_ONLY_TABLES = [
  'audit_events',
  'plan_revisions',
  'plan_reviews',
  'coverage_layers',
  'incident_entries',
] as const;

/** Tables the application only reads. */
const READ_ONLY_TABLES = ['spatial_ref_sys'] as const;

/**
 * Creates the group role when missing and (re)applies its grants on the current
 * database. Idempotent: the migration that introduced the role runs it, and
 * `prepare-database` runs it again after every migration run and every copy of a
 * template (database-level grants are not copied with a template). Needs a role
 * that may create roles (or the role made beforehand by a DBA) and that owns the
 * tables.
 */
export async function applyApplicationGrants(db: Sequelize): Promise<void> {
  const q = (sql: string) => db.query(sql);
  const role = APPLICATION_ROLE;
  await q(`
    DO $$ BEGIN
      IF NOT EXISTS (SELECT 1 FROM pg_roles WHERE rolname = '${role}') THEN
        BEGIN
          CREATE ROLE ${role} NOLOGIN NOSUPERUSER NOCREATEDB NOCREATEROLE NOBYPASSRLS;
        EXCEPTION WHEN duplicate_object OR unique_violation THEN NULL; -- made at the same moment elsewhere
        END;
      END IF;
    END $$`);

  await q(`GRANT USAGE ON SCHEMA public TO ${role}`);
  await q(`GRANT SELECT, INSERT, UPDATE, DELETE ON ALL TABLES IN SCHEMA public TO ${role}`);
  await q(`GRANT USAGE, SELECT, UPDATE ON ALL SEQUENCES IN SCHEMA public TO ${role}`);
  await q(`REVOKE TRUNCATE, REFERENCES, TRIGGER ON ALL TABLES IN SCHEMA public FROM ${role}`);
  await q(`REVOKE ALL ON TABLE schema_migrations FROM ${role}`);
  // A migration older than a table runs this too (0017 before 0019's incident log): revoke on what exists.
  for (const table of APPEND_ONLY_TABLES) {
    await q(`DO $$ BEGIN
      IF to_regclass('public.${table}') IS NOT NULL THEN
        REVOKE UPDATE, DELETE ON TABLE public.${table} FROM ${role};
      END IF;
    END $$`);
  }
  for (const table of READ_ONLY_TABLES) {
    await q(`DO $$ BEGIN
      IF to_regclass('public.${table}') IS NOT NULL THEN
        REVOKE INSERT, UPDATE, DELETE ON TABLE public.${table} FROM ${role};
      END IF;
    END $$`);
  }

  // The job queue (pg-boss) is the application's own working data: it owns the schema and,
  // installing pg-boss at its first start (CREATE SCHEMA IF NOT EXISTS checks the database
  // right first), may create schemas in this database.
  await q(`DO $$ BEGIN EXECUTE format('GRANT CREATE ON DATABASE %I TO ${role}', current_database()); END $$`);
  await q(`CREATE SCHEMA IF NOT EXISTS pgboss AUTHORIZATION ${role}`);
  await q(`
    DO $$
    DECLARE r record;
    BEGIN
      EXECUTE 'ALTER SCHEMA pgboss OWNER TO ${role}';
      FOR r IN SELECT c.oid::regclass AS name FROM pg_class c JOIN pg_namespace n ON n.oid = c.relnamespace
               WHERE n.nspname = 'pgboss' AND c.relkind IN ('r', 'p', 'v', 'm') LOOP
        EXECUTE format('ALTER TABLE %s OWNER TO ${role}', r.name);
      END LOOP;
      FOR r IN SELECT p.oid::regprocedure AS name FROM pg_proc p JOIN pg_namespace n ON n.oid = p.pronamespace
               WHERE n.nspname = 'pgboss' LOOP
        EXECUTE format('ALTER ROUTINE %s OWNER TO ${role}', r.name);
      END LOOP;
      FOR r IN SELECT t.oid::regtype AS name FROM pg_type t JOIN pg_namespace n ON n.oid = t.typnamespace
               WHERE n.nspname = 'pgboss' AND t.typtype IN ('e', 'd', 'c') AND t.typrelid = 0 LOOP
        EXECUTE format('ALTER TYPE %s OWNER TO ${role}', r.name);
      END LOOP;
    END $$`);
}

/**
 * Makes (or updates) the login role the server and workers connect as, a member of
 * {@link APPLICATION_ROLE}. Roles belong to the whole cluster.
 */
export async function ensureApplicationLogin(db: Sequelize, login: string, password: string): Promise<void> {
  if (!/^[a-z_][a-z0-9_]*$/.test(login)) throw new Error(`not a safe role name: ${login}`);
  const pw = db.escape(password);
  await db.query(`
    DO $$ BEGIN
      IF NOT EXISTS (SELECT 1 FROM pg_roles WHERE rolname = '${login}') THEN
        BEGIN
          CREATE ROLE ${login} LOGIN NOSUPERUSER NOCREATEDB NOCREATEROLE NOBYPASSRLS PASSWORD ${pw};
        EXCEPTION WHEN duplicate_object OR unique_violation THEN NULL;
        END;
      END IF;
    END $$`);
  await db.query(`ALTER ROLE ${login} LOGIN PASSWORD ${pw}`);
  await db.query(`GRANT ${APPLICATION_ROLE} TO ${login}`);
}
