import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import type { Express } from 'express';
import type { Sequelize } from 'sequelize';
import { createApp } from '@/server/app';
import { MAX_ATTEMPTS, REQUEUED_STAGE, startStaleRunReaper, WORKER_STOPPED } from '@/server/domain/coverage/run-heartbeat';
import { startCoverageBoss, type CoverageBoss } from '@/server/queue/coverage-queue';
import { createTestDatabase, scratchFileStore, TEST_CONFIG } from '@/tests/support/test-db';
import { DEMO, signedInAgent } from '@/tests/support/agents';

// A coverage worker process killed with SIGKILL in the middle of a run: its run
// must not stay "running" (which blocked submitting for half an hour). Its
// heartbeat stops, and within a minute the server's reaper queues the run again
// for another worker; when that one is killed too, the run fails with the reason
// within a minute, and the plan can be computed again.

let db: Sequelize;
let url: string;
let drop: () => Promise<void>;
let filesDir: string;
let boss: CoverageBoss;
let app: Express;
const workers: ChildProcess[] = [];

beforeAll(async () => {
  ({ db, url, drop } = await createTestDatabase());
  const store = scratchFileStore();
  filesDir = store.filesDir;
  boss = await startCoverageBoss(url);
  app = createApp({ db, config: TEST_CONFIG, files: store.files, coverageQueue: boss.queue });
});
afterAll(async () => {
  for (const w of workers) if (w.exitCode === null && w.signalCode === null) w.kill('SIGKILL');
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
  workers.push(child);
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
  (await db.query('SELECT status, error, stage, attempts, heartbeat_at FROM coverage_runs WHERE id = :id', {
    replacements: { id },
    plain: true,
  })) as { status: string; error: string | null; stage: string; attempts: number; heartbeat_at: Date | null };

/** Polls the run until `done` says so, at most `ms`; returns the last row. */
async function waitForRun(id: string, done: (row: Awaited<ReturnType<typeof runRow>>) => boolean, ms: number) {
  const until = Date.now() + ms;
  let row = await runRow(id);
  while (!done(row) && Date.now() < until) {
    await new Promise((r) => setTimeout(r, 200));
    row = await runRow(id);
  }
  return row;
}

it('queues the run of a worker killed mid-run again for another worker within a minute, and fails it with the reason when that one dies too', async () => {
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

  const first = await startWorkerProcess();
  const requested = await planner.post(`/api/v1/plans/${planId}/coverage`).send({});
  expect(requested.status).toBe(202);
  const runId = requested.body.run.id as string;

  // Wait until the worker is on it and beating, then kill it outright.
  const taken = await waitForRun(runId, (r) => r.status !== 'queued', 120_000);
  expect(taken).toMatchObject({ status: 'running', attempts: 1 });
  first.kill('SIGKILL');
  let killedAt = Date.now();
  // Another worker is there to take it again.
  const second = await startWorkerProcess();

  // The API server's reaper, as server/start.ts runs it.
  const reaper = startStaleRunReaper(db, { requeue: (id, attempt) => boss.queue.enqueue(id, attempt) });
  try {
    const retried = await waitForRun(runId, (r) => r.attempts === 2, 60_000);
    expect(Date.now() - killedAt).toBeLessThan(60_000);
    expect(retried.attempts).toBe(MAX_ATTEMPTS);
    expect(['queued', 'running']).toContain(retried.status);
    if (retried.status === 'queued') expect(retried.stage).toBe(REQUEUED_STAGE);
    // The second worker computes it from the start.
    const resumed = await waitForRun(runId, (r) => r.status === 'running' && r.heartbeat_at !== null, 30_000);
    expect(resumed).toMatchObject({ status: 'running', attempts: 2 });

    second.kill('SIGKILL');
    killedAt = Date.now();
    const failed = await waitForRun(runId, (r) => r.status !== 'running', 60_000);
    expect(failed.status).toBe('failed');
    expect(failed.error).toBe(WORKER_STOPPED);
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
}, 300_000);
