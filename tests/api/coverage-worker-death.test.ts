import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import type { Express } from 'express';
import type { Sequelize } from 'sequelize';
import { createApp } from '@/server/app';
import { startStaleRunReaper, WORKER_STOPPED } from '@/server/domain/coverage/run-heartbeat';
import { startCoverageBoss, type CoverageBoss } from '@/server/queue/coverage-queue';
import { createTestDatabase, scratchFileStore, TEST_CONFIG } from '@/tests/support/test-db';
import { DEMO, signedInAgent } from '@/tests/support/agents';

// A coverage worker process killed with SIGKILL in the middle of a run: its run
// must not stay "running" (which blocked submitting for half an hour). Its
// heartbeat stops, and the server's reaper fails the run with the reason within a
// minute; the plan can then be computed again.

let db: Sequelize;
let url: string;
let drop: () => Promise<void>;
let filesDir: string;
let boss: CoverageBoss;
let app: Express;
let worker: ChildProcess | null = null;

beforeAll(async () => {
  ({ db, url, drop } = await createTestDatabase());
  const store = scratchFileStore();
  filesDir = store.filesDir;
  boss = await startCoverageBoss(url);
  app = createApp({ db, config: TEST_CONFIG, files: store.files, coverageQueue: boss.queue });
});
afterAll(async () => {
  if (worker && worker.exitCode === null && worker.signalCode === null) worker.kill('SIGKILL');
  await boss.stop();
  await drop();
});

/** `npm run worker` as its own process, on this test's database and file store. */
function startWorkerProcess(): Promise<ChildProcess> {
  const root = path.resolve(__dirname, '../..');
  const child = spawn(process.execPath, ['--import', 'tsx', path.join(root, 'server/workers/coverage-worker.ts')], {
    cwd: root,
    env: { ...process.env, DATABASE_URL: url, FILE_STORE_DIR: filesDir, COVERAGE_WORKER_THREADS: '1', NODE_ENV: 'test' },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  return new Promise((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error('the worker did not start')), 60_000);
    child.stdout!.on('data', (chunk: Buffer) => {
      if (String(chunk).includes('coverage worker ready')) {
        clearTimeout(timer);
        resolve(child);
      }
    });
    child.stderr!.on('data', () => {});
    child.once('exit', (code) => reject(new Error(`the worker exited with ${code}`)));
  });
}

const runRow = async (id: string) =>
  (await db.query('SELECT status, error, heartbeat_at FROM coverage_runs WHERE id = :id', {
    replacements: { id },
    plain: true,
  })) as { status: string; error: string | null; heartbeat_at: Date | null };

it('fails the run of a worker killed mid-run within a minute, with the reason, and computes it again on request', async () => {
  const planner = await signedInAgent(app, DEMO.planner);
  const sites = (await planner.get('/api/v1/sites')).body.items;
  const site = sites.find((s: { name: string }) => s.name === 'Harrowmere Forest District');
  const posts = (await planner.get(`/api/v1/sites/${site.id}/posts`)).body.items;
  const targets = (await planner.get('/api/v1/targets')).body.items;
  const sets = (await planner.get('/api/v1/conditions')).body.items;
  // Every post, target and condition: a run long enough to be caught in the middle.
  const plan = await planner.post('/api/v1/plans').send({
    siteId: site.id,
    title: 'Killed worker',
    postIds: posts.map((p: { id: string }) => p.id),
    targetIds: targets.map((t: { id: string }) => t.id),
    conditionSetIds: sets.map((s: { id: string }) => s.id),
  });
  expect(plan.status).toBe(201);
  const planId = plan.body.plan.id;

  worker = await startWorkerProcess();
  const requested = await planner.post(`/api/v1/plans/${planId}/coverage`).send({});
  expect(requested.status).toBe(202);
  const runId = requested.body.run.id as string;

  // Wait until the worker is on it and beating, then kill it outright.
  for (let i = 0; ; i++) {
    const row = await runRow(runId);
    if (row.status === 'running' && row.heartbeat_at) break;
    if (i > 600 || row.status !== 'queued') throw new Error(`the run never ran: ${row.status}`);
    await new Promise((r) => setTimeout(r, 50));
  }
  worker.kill('SIGKILL');
  const killedAt = Date.now();

  // The API server's reaper (as server/start.ts runs it).
  const reaper = startStaleRunReaper(db);
  try {
    let row = await runRow(runId);
    while (row.status === 'running' && Date.now() - killedAt < 60_000) {
      await new Promise((r) => setTimeout(r, 500));
      row = await runRow(runId);
    }
    expect(row.status).toBe('failed');
    expect(row.error).toBe(WORKER_STOPPED);
    expect(Date.now() - killedAt).toBeLessThan(60_000);
  } finally {
    reaper.stop();
  }

  // The run shows as failed through the API, and asking again queues a new run.
  const viaPlanner = (await planner.get(`/api/v1/coverage-runs/${runId}`)).body.run;
  expect(viaPlanner).toMatchObject({ status: 'failed', error: WORKER_STOPPED });
  const again = await planner.post(`/api/v1/plans/${planId}/coverage`).send({});
  expect(again.status).toBe(202);
  expect(again.body.run.id).not.toBe(runId);
}, 150_000);
