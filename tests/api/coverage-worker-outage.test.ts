import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import type { Express } from 'express';
import type { Sequelize } from 'sequelize';
import { createApp } from '@/server/app';
import { startStaleRunReaper } from '@/server/domain/coverage/run-heartbeat';
import { startCoverageBoss, type CoverageBoss } from '@/server/queue/coverage-queue';
import { createTestDatabase, scratchFileStore, TEST_CONFIG } from '@/tests/support/test-db';
import { DEMO, signedInAgent } from '@/tests/support/agents';
import { startTcpProxy } from '@/tests/support/tcp-proxy';

// A coverage worker process that loses PostgreSQL in the middle of a run (its
// connections reset, new ones refused, for a few seconds) must not crash on the
// rejected promises: it reconnects and carries on. The run it was computing ends
// done — by that worker or, if its writes were lost, queued again by the reaper
// and computed again — and a run requested afterwards is computed too.

let db: Sequelize;
let drop: () => Promise<void>;
let boss: CoverageBoss;
let app: Express;
let proxy: Awaited<ReturnType<typeof startTcpProxy>>;
let worker: ChildProcess;
let workerLog = '';

beforeAll(async () => {
  const database = await createTestDatabase();
  ({ db, drop } = database);
  const store = scratchFileStore();
  boss = await startCoverageBoss(database.url);
  app = createApp({ db, config: TEST_CONFIG, files: store.files, coverageQueue: boss.queue });
  const direct = new URL(database.url);
  proxy = await startTcpProxy({ host: direct.hostname, port: Number(direct.port || 5432) });
  const throughProxy = new URL(database.url);
  throughProxy.port = String(proxy.port);
  const root = path.resolve(__dirname, '../..');
  worker = spawn(process.execPath, ['--import', 'tsx', path.join(root, 'server/workers/coverage-worker.ts')], {
    cwd: root,
    env: {
      ...process.env,
      DATABASE_URL: throughProxy.toString(),
      FILE_STORE_DIR: store.filesDir,
      COVERAGE_WORKER_THREADS: '1',
      NODE_ENV: 'test',
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  worker.stdout!.on('data', (chunk: Buffer) => (workerLog += String(chunk)));
  worker.stderr!.on('data', (chunk: Buffer) => (workerLog += String(chunk)));
  const until = Date.now() + 60_000;
  while (!workerLog.includes('coverage worker ready')) {
    if (Date.now() > until || worker.exitCode !== null) throw new Error(`the worker did not start:\n${workerLog}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}, 90_000);
afterAll(async () => {
  if (worker.exitCode === null && worker.signalCode === null) worker.kill('SIGKILL');
  await boss.stop();
  await proxy.stop();
  await drop();
});

const runStatus = async (id: string) =>
  (
    (await db.query('SELECT status, attempts FROM coverage_runs WHERE id = :id', { replacements: { id }, plain: true })) as {
      status: string;
      attempts: number;
    }
  ).status;

async function waitUntil(id: string, done: (status: string) => boolean, ms: number) {
  const until = Date.now() + ms;
  let status = await runStatus(id);
  while (!done(status) && Date.now() < until) {
    await new Promise((r) => setTimeout(r, 200));
    status = await runStatus(id);
  }
  return status;
}

it('survives losing PostgreSQL mid-run, and the run and later runs are computed', async () => {
  const planner = await signedInAgent(app, DEMO.planner);
  const site = (await planner.get('/api/v1/sites')).body.items.find(
    (s: { name: string }) => s.name === 'Harrowmere Forest District',
  );
  const posts = (await planner.get(`/api/v1/sites/${site.id}/posts`)).body.items as { id: string }[];
  const targets = (await planner.get('/api/v1/targets')).body.items as { id: string }[];
  const sets = (await planner.get('/api/v1/conditions')).body.items as { id: string }[];
  const newPlan = async (title: string, postIds: string[]) => {
    const res = await planner
      .post('/api/v1/plans')
      .send({ siteId: site.id, title, postIds, targetIds: [targets[0]!.id], conditionSetIds: [sets[0]!.id] });
    expect(res.status).toBe(201);
    return res.body.plan.id as string;
  };

  const first = await newPlan(
    'Outage during the run',
    posts.map((p) => p.id),
  );
  const requested = await planner.post(`/api/v1/plans/${first}/coverage`).send({});
  expect(requested.status).toBe(202);
  const runId = requested.body.run.id as string;
  expect(await waitUntil(runId, (s) => s !== 'queued', 60_000)).not.toBe('queued');

  // PostgreSQL goes away for the worker for three seconds.
  await proxy.stop();
  await new Promise((r) => setTimeout(r, 3000));
  await proxy.start();

  // The API server's reaper, as server/start.ts runs it: a run whose writes were lost is queued again.
  const reaper = startStaleRunReaper(db, { requeue: (id, attempt) => boss.queue.enqueue(id, attempt) });
  try {
    expect(await waitUntil(runId, (s) => s === 'done' || s === 'failed', 150_000)).toBe('done');
    expect(worker.exitCode).toBeNull();
    expect(worker.signalCode).toBeNull();

    // It carries on: a run requested after the outage is computed as well.
    const second = await newPlan('After the outage', [posts[0]!.id]);
    const again = await planner.post(`/api/v1/plans/${second}/coverage`).send({});
    expect(again.status).toBe(202);
    expect(await waitUntil(again.body.run.id, (s) => s === 'done' || s === 'failed', 120_000)).toBe('done');
    expect(worker.exitCode).toBeNull();
  } finally {
    reaper.stop();
  }
}, 330_000);
