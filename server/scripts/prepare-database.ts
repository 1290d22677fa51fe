/**
 * Creates (or reuses) a database with PostGIS, applies migrations and seeds the demo.
 *
 *   --database NAME   the database to prepare
 *   --fresh           drop it first
 *   --from TEMPLATE   copy an already prepared database instead of migrating
 *   --seed            seed the demo scenario (idempotent)
 *   --files DIR       the file store the demo terrain goes to (default .kenning/files, the server's default)
 *
 * Reads KENNING_ADMIN_DATABASE_URL (a URL to the maintenance database, as the owner).
 * With KENNING_APP_DATABASE_PASSWORD it also makes the login role the server and
 * workers connect as (`kenning_app`, a member of `kenning_application`).
 */
import path from 'node:path';
import { parseArgs } from 'node:util';
import { Client } from 'pg';
import { dataDir } from '../config';
import { createDatabase } from '../data/database';
import { APPLICATION_LOGIN, applyApplicationGrants, ensureApplicationLogin } from '../data/application-role';
import { migrate } from '../data/migrator';
import { seedDemo } from '../seeders/demo';
import { createDiskFileStore } from '../storage/file-store';

const { values } = parseArgs({
  options: {
    database: { type: 'string' },
    fresh: { type: 'boolean', default: false },
    from: { type: 'string' },
    seed: { type: 'boolean', default: false },
    files: { type: 'string' },
  },
});

const ident = (name: string) => {
  if (!/^[a-z_][a-z0-9_]*$/.test(name)) throw new Error(`not a safe database name: ${name}`);
  return `"${name}"`;
};

async function main() {
  const adminUrl = process.env.KENNING_ADMIN_DATABASE_URL;
  if (!adminUrl || !values.database) throw new Error('needs KENNING_ADMIN_DATABASE_URL and --database');
  const name = values.database;
  const admin = new Client({ connectionString: adminUrl });
  await admin.connect();
  try {
    if (values.fresh) await admin.query(`DROP DATABASE IF EXISTS ${ident(name)} WITH (FORCE)`);
    const exists = (await admin.query('SELECT 1 FROM pg_database WHERE datname = $1', [name])).rowCount === 1;
    if (!exists) {
      const template = values.from ? ` TEMPLATE ${ident(values.from)}` : '';
      await admin.query(`CREATE DATABASE ${ident(name)}${template}`);
    }
  } finally {
    await admin.end();
  }
  const url = new URL(adminUrl);
  url.pathname = `/${name}`;
  const db = createDatabase(url.toString());
  try {
    if (!values.from) {
      const applied = await migrate(db);
      if (applied.length) console.log(`[kenning] ${name}: applied ${applied.length} migration(s)`);
    }
    // Again after every run and copy: tables of later migrations, and database-level
    // grants (which a copy from a template does not carry).
    await applyApplicationGrants(db);
    const appPassword = process.env.KENNING_APP_DATABASE_PASSWORD;
    if (appPassword) await ensureApplicationLogin(db, APPLICATION_LOGIN, appPassword);
    if (values.from) return;
    if (values.seed) {
      const files = createDiskFileStore(path.resolve(values.files ?? path.join(dataDir, 'files')));
      const seeded = await seedDemo(db, { files });
      if (seeded) console.log(`[kenning] ${name}: seeded the demo scenario`);
    }
  } finally {
    await db.close();
  }
}

main().catch((err: unknown) => {
  console.error('[kenning] preparing the database failed:', err);
  process.exit(1);
});
