import { mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Sequelize } from 'sequelize';
import { createApp } from '@/server/app';
import { createDatabase } from '@/server/data/database';
import { scratchFileStore, TEST_CONFIG } from '@/tests/support/test-db';
import { DEMO } from '@/tests/support/agents';
import { listen } from '@/tests/support/live-server';
import { startPrivatePostgres } from '@/tests/support/private-postgres';
import { waitFor } from '@/tests/support/wait';

// PostgreSQL itself stopped under load (pg_ctl stop -m fast: every connection told
// to go, new ones refused) and started again. The app runs on a cluster of this
// test's own, holding a copy of the seeded template, so the shared test cluster
// keeps serving the other test files. tests/api/database-outage.test.ts cuts the
// network instead.

let pg: Awaited<ReturnType<typeof startPrivatePostgres>>;
let db: Sequelize;
let live: Awaited<ReturnType<typeof listen>>;
let scratch: string;

beforeAll(async () => {
  const admin = process.env.KENNING_ADMIN_DATABASE_URL;
  const template = process.env.KENNING_TEST_TEMPLATE_DB;
  if (!admin || !template) throw new Error('needs the template database `npm test` prepares');
  pg = await startPrivatePostgres();
  scratch = mkdtempSync(path.join(os.tmpdir(), 'kenning-restart-'));
  const dump = path.join(scratch, 'template.dump');
  const templateUrl = new URL(admin);
  templateUrl.pathname = `/${template}`;
  await pg.client('pg_dump', ['-Fc', '-f', dump, templateUrl.toString()]);
  await pg.client('psql', ['-q', '-d', pg.url('postgres'), '-c', 'CREATE DATABASE kenning_restart']);
  // Owners and grants name roles this cluster does not have; the data is what matters here.
  await pg.client('pg_restore', ['--no-owner', '--no-privileges', '-d', pg.url('kenning_restart'), dump]).catch(() => {});
  db = createDatabase(pg.url('kenning_restart'));
  const { files } = scratchFileStore();
  live = await listen(createApp({ db, files, config: { ...TEST_CONFIG, TERRAIN_UPLOAD_DIR: path.join(scratch, 'uploads') } }));
}, 120_000);
afterAll(async () => {
  await live?.close();
  await db?.close();
  await pg?.destroy();
  rmSync(scratch, { recursive: true, force: true });
});

it('answers 503 with Retry-After while PostgreSQL is stopped under load, logs the outage once, and carries on when it is started again', async () => {
  const cookie = await live.signIn(DEMO.planner);
  expect((await live.call('GET', '/api/v1/sites', { cookie })).status).toBe(200);

  const errors = jest.spyOn(console, 'error').mockImplementation(() => {});
  const warnings = jest.spyOn(console, 'warn').mockImplementation(() => {});
  const answers: { status: number; code?: string; retryAfter: string | null }[] = [];
  let errorLines: string[] = [];
  let warningLines: string[] = [];
  let loading = true;
  // Eight clients asking without pause for the whole stop and start.
  const clients = Array.from({ length: 8 }, async (_, i) => {
    for (let n = 0; loading; n++) {
      const r =
        (i + n) % 3 === 0 ? await live.call('GET', '/api/me', { cookie }) : await live.call('GET', '/api/v1/sites', { cookie });
      answers.push({ status: r.status, code: r.body?.error?.code, retryAfter: r.headers.get('retry-after') });
    }
  });
  try {
    await new Promise((r) => setTimeout(r, 500));
    await pg.stop();
    await new Promise((r) => setTimeout(r, 2000));
    const health = await live.call('GET', '/api/health');
    expect(health.status).toBe(503);
    expect(health.body.db).toBe('down');
    expect(Number(health.headers.get('retry-after'))).toBeGreaterThan(0);

    await pg.start();
    expect(await waitFor(async () => (await live.call('GET', '/api/health')).status === 200, 20)).toBe(true);
    // The outage's end is logged by the recovery probe (once a second), which may come a moment after health answers.
    const recoveryLogged = () => warnings.mock.calls.some((c) => /reachable again/.test(String(c[0])));
    expect(await waitFor(async () => recoveryLogged(), 10)).toBe(true);
    await new Promise((r) => setTimeout(r, 500));
  } finally {
    loading = false;
    await Promise.all(clients);
    // mockRestore forgets the calls: keep them first.
    errorLines = errors.mock.calls.map((c) => String(c[0]));
    warningLines = warnings.mock.calls.map((c) => String(c[0]));
    errors.mockRestore();
    warnings.mockRestore();
  }

  // Every answer was a good one or a 503 that says why and when to come back: never a 500.
  const refused = answers.filter((a) => a.status === 503);
  expect(answers.filter((a) => a.status !== 200 && a.status !== 503)).toEqual([]);
  expect(refused.length).toBeGreaterThan(0);
  for (const a of refused) {
    expect(a.code).toBe('database_unavailable');
    expect(Number(a.retryAfter)).toBeGreaterThan(0);
  }
  // Answered again after the start, reads and writes.
  expect(answers.at(-1)!.status).toBe(200);
  const write = await live.call('POST', '/api/v1/targets', {
    cookie,
    json: { name: 'After the restart', kind: 'vehicle', heightM: 3, widthM: 2 },
  });
  expect(write.status).toBe(201);
  // One line for the outage and one for its end, not one per request.
  expect(errorLines.filter((line) => line.includes('database unavailable'))).toHaveLength(1);
  expect(errorLines.filter((line) => line.includes('failed:'))).toHaveLength(0);
  expect(warningLines.filter((line) => /reachable again/.test(line))).toHaveLength(1);
}, 120_000);
