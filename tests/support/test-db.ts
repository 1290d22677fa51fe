import { randomBytes } from 'node:crypto';
import { cpSync, existsSync, mkdtempSync } from 'node:fs';
import { rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { Client } from 'pg';
import type { Sequelize } from 'sequelize';
import { createApp, type AppDeps } from '@/server/app';
import { createDatabase } from '@/server/data/database';
import { inlineCoverageQueue } from '@/server/queue/inline-coverage-queue';
import { createDiskFileStore } from '@/server/storage/file-store';
import { createTerrainCache } from '@/server/terrain/terrain-cache';
import { createViewshedPool } from '@/server/workers/viewshed-pool';

/**
 * A disposable database per test file, copied from the migrated and seeded
 * template that `npm test` prepares (KENNING_TEST_TEMPLATE_DB).
 */
export async function createTestDatabase(
  options: { connectThrough?: (url: URL) => URL } = {},
): Promise<{ db: Sequelize; url: string; drop: () => Promise<void> }> {
  const adminUrl = process.env.KENNING_ADMIN_DATABASE_URL;
  const template = process.env.KENNING_TEST_TEMPLATE_DB;
  if (!adminUrl || !template) {
    throw new Error(
      'API tests need the database that `npm test` prepares (KENNING_ADMIN_DATABASE_URL, KENNING_TEST_TEMPLATE_DB).',
    );
  }
  const name = `${template}_${randomBytes(4).toString('hex')}`;
  const admin = new Client({ connectionString: adminUrl });
  await admin.connect();
  try {
    // Two files copying the template at the same instant can collide; retry briefly.
    for (let attempt = 0; ; attempt++) {
      try {
        await admin.query(`CREATE DATABASE "${name}" TEMPLATE "${template}"`);
        break;
      } catch (e) {
        if (attempt >= 10) throw e;
        await new Promise((r) => setTimeout(r, 200 + Math.random() * 300));
      }
    }
  } finally {
    await admin.end();
  }
  const url = new URL(adminUrl);
  url.pathname = `/${name}`;
  // The app may reach it another way (a fault-injecting proxy); the drop goes direct.
  const db = createDatabase((options.connectThrough?.(new URL(url)) ?? url).toString());
  return {
    db,
    url: url.toString(),
    drop: async () => {
      await db.close();
      const c = new Client({ connectionString: adminUrl });
      await c.connect();
      await c.query(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`);
      await c.end();
    },
  };
}

export const TEST_CONFIG: AppDeps['config'] = {
  NODE_ENV: 'test',
  SESSION_SECRET: 'test-secret-'.padEnd(48, 'x'),
  PUBLIC_URL: 'https://kenning.test',
  TRUST_PROXY: false,
  WEB_DIST_DIR: '/nonexistent',
  SIGN_IN_LIMIT_PER_ADDRESS: 1000,
  SIGN_IN_LIMIT_PER_ACCOUNT: 1000,
  SIGN_IN_WINDOW_SECONDS: 900,
  // Each test app keeps its own counts; tests/api/sign-in-delays.test.ts checks the shared store.
  SIGN_IN_STORE: 'memory',
  LOG_REQUESTS: false,
  CAUGHT_MAIL_URL: undefined,
  TERRAIN_MAX_UPLOAD_BYTES: 400_000_000,
  TERRAIN_MAX_CELLS: 25_000_000,
  TERRAIN_CACHE_MB: 256,
  TERRAIN_UPLOAD_DIR: path.join(os.tmpdir(), 'kenning-test-uploads'),
};

/**
 * A file store in a new temporary folder (remove `filesDir` when done). It
 * starts as a copy of the run's seeded store (KENNING_TEST_FILES_DIR, which
 * holds the demo terrain the template database refers to), when there is one.
 */
export function scratchFileStore() {
  const filesDir = mkdtempSync(path.join(os.tmpdir(), 'kenning-files-'));
  const seeded = process.env.KENNING_TEST_FILES_DIR;
  if (seeded && existsSync(seeded)) cpSync(seeded, filesDir, { recursive: true });
  return { files: createDiskFileStore(filesDir), filesDir };
}

/**
 * An app on `db` (the test config, a scratch file store) whose coverage runs
 * are computed in this process as they are requested, on a one-worker viewshed
 * pool (close `pool` in afterAll); `deps` adds app dependencies (a mailer).
 */
export function appWithInlineCoverage(db: Sequelize, deps: Partial<Omit<AppDeps, 'db'>> = {}) {
  const { files } = scratchFileStore();
  const pool = createViewshedPool({ size: 1 });
  const coverageQueue = inlineCoverageQueue({ db, cache: createTerrainCache({ files, maxBytes: 2 ** 28 }), pool });
  return { app: createApp({ db, config: TEST_CONFIG, files, coverageQueue, ...deps }), pool };
}

/**
 * An app on a fresh database; call `close` in afterAll. Models are registered
 * on one Sequelize instance per process, so a test file opens one database and
 * builds further apps (other configs) on the same `db` with `createApp`.
 */
export async function createTestApp(config: Partial<AppDeps['config']> = {}) {
  const database = await createTestDatabase();
  const { files, filesDir } = scratchFileStore();
  const uploadsDir = mkdtempSync(path.join(os.tmpdir(), 'kenning-uploads-'));
  const app = createApp({ db: database.db, config: { ...TEST_CONFIG, TERRAIN_UPLOAD_DIR: uploadsDir, ...config }, files });
  return {
    app,
    db: database.db,
    files,
    filesDir,
    /** Where terrain uploads are received (per-request folders, removed after each request). */
    uploadsDir,
    close: async () => {
      await database.drop();
      await rm(filesDir, { recursive: true, force: true });
      await rm(uploadsDir, { recursive: true, force: true });
    },
  };
}
