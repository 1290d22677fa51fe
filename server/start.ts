import cluster, { type Worker } from 'node:cluster';
import type { Server } from 'node:http';
import { availableParallelism } from 'node:os';
import type { Sequelize } from 'sequelize';
import { createApp } from './app';
import { config, type Config } from './config';
import { createDatabase } from './data/database';
import { startStaleRunReaper } from './domain/coverage/run-heartbeat';
import { startStaleSitingReaper } from './domain/siting/reap-stale-siting-runs';
import { loadSessionUser } from './http/session';
import { startSessionUserCache } from './http/session-user-cache';
import { createMailer } from './mail/mailer';
import { startCoverageBoss, type CoverageQueue } from './queue/coverage-queue';
import { visibilityIndexQueue } from './queue/visibility-index-queue';
import { DEFAULT_ATTACHMENT_UPLOAD_DIR } from './routes/attachments';
import { cleanStaleUploads } from './storage/clean-stale-uploads';
import { createDiskFileStore } from './storage/file-store';

/**
 * Entry point. Serves the API and the web app from `WEB_CONCURRENCY` processes
 * (default: one per core) that share the port through Node's cluster module. The
 * primary process listens to no request: it starts the API processes, starts one
 * again when it dies (after 1 s, then 2, 4 … up to 30 s while it keeps dying), and
 * does the chores that must happen once (stale coverage runs, unfinished uploads).
 * With one process there is no primary: that process does everything.
 */
async function main() {
  const cfg = config();
  const processes = cfg.WEB_CONCURRENCY ?? availableParallelism();
  if (processes <= 1) return serveAlone(cfg);
  if (cluster.isPrimary) return supervise(cfg, processes);
  return serveApi(cfg, { chores: false });
}

/** The chores done once per server: runs of dead workers, unfinished uploads. */
async function startChores(cfg: Config, db: Sequelize, queue: CoverageQueue) {
  // Queues again (once), then fails, runs whose worker died, even when no worker is left to notice.
  const reaper = startStaleRunReaper(db, { requeue: (runId, attempt) => queue.enqueue(runId, attempt) });
  // Fails siting runs whose worker died or whose job the queue no longer holds.
  const sitingReaper = startStaleSitingReaper(db);
  // Uploads a killed server left half-received; again every half hour.
  const uploadRoots = [cfg.TERRAIN_UPLOAD_DIR, DEFAULT_ATTACHMENT_UPLOAD_DIR];
  const sweepUploads = () =>
    cleanStaleUploads(uploadRoots)
      .then(({ folders, bytes }) => {
        if (folders) console.log(`[kenning] removed ${folders} unfinished upload(s), ${(bytes / 2 ** 20).toFixed(1)} MB`);
      })
      .catch((error: unknown) => console.error('[kenning] could not clean unfinished uploads:', error));
  await sweepUploads();
  const uploadSweeper = setInterval(() => void sweepUploads(), 30 * 60 * 1000);
  uploadSweeper.unref();
  return {
    stop() {
      reaper.stop();
      sitingReaper.stop();
      clearInterval(uploadSweeper);
    },
  };
}

/** One API process: the app on the port (shared with its siblings under the cluster). */
async function serveApi(cfg: Config, { chores }: { chores: boolean }) {
  const db = createDatabase(cfg.DATABASE_URL);
  await db.authenticate();
  const mailer = cfg.SMTP_HOST
    ? createMailer({
        host: cfg.SMTP_HOST,
        port: cfg.SMTP_PORT,
        secure: cfg.SMTP_SECURE,
        from: cfg.MAIL_FROM,
        auth: cfg.SMTP_USER && cfg.SMTP_PASSWORD ? { user: cfg.SMTP_USER, pass: cfg.SMTP_PASSWORD } : undefined,
      })
    : null;
  // The API only queues coverage runs; `npm run worker` processes compute them.
  const coverage = await startCoverageBoss(cfg.DATABASE_URL);
  const sessionUsers = startSessionUserCache(cfg.DATABASE_URL, loadSessionUser, cfg.SESSION_CACHE_SECONDS);
  await sessionUsers.ready;
  // Models are bound to one Sequelize per process: the chores share the app's.
  const once = chores ? await startChores(cfg, db, coverage.queue) : null;
  const app = createApp({
    db,
    config: cfg,
    mailer,
    files: createDiskFileStore(cfg.FILE_STORE_DIR),
    coverageQueue: coverage.queue,
    sitingQueue: coverage.sitingQueue,
    visibilityIndexQueue: await visibilityIndexQueue(coverage.boss),
    sessionUsers: sessionUsers.cache,
  });
  const server: Server = await new Promise((resolve) => {
    const s = app.listen(cfg.PORT, cfg.HOST, () => resolve(s));
  });
  // A client that reuses a kept-alive socket just as the server closes it for idleness gets ECONNRESET (browsers,
  // proxies and test runners all reuse sockets). Idle sockets are kept longer than the 60 s that clients and
  // proxies commonly keep them, so the client closes first; headers must be allowed longer still (Node's rule).
  // Common practice, no source.
  server.keepAliveTimeout = 65_000;
  server.headersTimeout = 66_000;
  const address = server.address();
  const port = typeof address === 'object' && address ? address.port : cfg.PORT;
  if (!cluster.isWorker) console.log(`[kenning] serving on http://${cfg.HOST}:${port}`);

  let stopping = false;
  const stop = (signal: string) => {
    if (stopping) return;
    stopping = true;
    if (!cluster.isWorker) console.log(`[kenning] ${signal}: closing`);
    mailer?.close();
    // Answers in progress finish; idle keep-alive connections close now.
    once?.stop();
    server.close(() => {
      // A client that hung up leaves its request running: let it finish with the database first.
      void Promise.allSettled([coverage.stop(), sessionUsers.stop(), poolDrained(db, 4000)])
        .then(() => db.close())
        .finally(() => process.exit(0));
    });
    server.closeIdleConnections();
    setTimeout(() => {
      server.closeAllConnections();
      process.exit(1);
    }, 5000).unref();
  };
  process.once('SIGINT', () => stop('SIGINT'));
  process.once('SIGTERM', () => stop('SIGTERM'));
  // Started by the bootstrap (or the cluster's primary) with an IPC channel: stop when it is gone.
  process.once('disconnect', () => stop('supervisor gone'));
}

/** Resolves once no query holds or waits for a pooled connection, or after `timeoutMs`. */
async function poolDrained(db: Sequelize, timeoutMs: number) {
  const pool = (db.connectionManager as unknown as { pool?: { using?: number; waiting?: number } }).pool;
  const until = Date.now() + timeoutMs;
  while (pool && ((pool.using ?? 0) > 0 || (pool.waiting ?? 0) > 0) && Date.now() < until) {
    await new Promise((r) => setTimeout(r, 50));
  }
}

/** Without a cluster: one process serves and does the chores. */
function serveAlone(cfg: Config) {
  return serveApi(cfg, { chores: true });
}

/** The cluster's primary: keeps `processes` API processes running, does the chores, stops them all. */
async function supervise(cfg: Config, processes: number) {
  const db = createDatabase(cfg.DATABASE_URL);
  await db.authenticate();
  const coverage = await startCoverageBoss(cfg.DATABASE_URL);
  const chores = await startChores(cfg, db, coverage.queue);
  let stopping = false;
  let announced = false;
  const slots = Array.from({ length: processes }, () => ({ delayMs: 1000, startedAt: 0, worker: null as Worker | null }));

  const launch = (slot: (typeof slots)[number]) => {
    slot.startedAt = Date.now();
    const worker = cluster.fork();
    slot.worker = worker;
    worker.once('listening', (address) => {
      if (announced) return;
      announced = true;
      console.log(`[kenning] serving on http://${cfg.HOST}:${address.port} (${processes} processes)`);
    });
    worker.once('exit', (code, signal) => {
      slot.worker = null;
      if (stopping) return maybeDone();
      if (Date.now() - slot.startedAt > 60_000) slot.delayMs = 1000;
      console.error(
        `[kenning] API process ${worker.process.pid} stopped unexpectedly (${signal ?? `exit code ${code}`}); starting another in ${slot.delayMs / 1000} s`,
      );
      setTimeout(() => {
        if (!stopping) launch(slot);
      }, slot.delayMs);
      slot.delayMs = Math.min(slot.delayMs * 2, 30_000);
    });
  };
  slots.forEach(launch);

  let finish: () => void = () => {};
  const allStopped = new Promise<void>((resolve) => {
    finish = resolve;
  });
  function maybeDone() {
    if (slots.every((s) => !s.worker)) finish();
  }

  const stop = (signal: string) => {
    if (stopping) return;
    stopping = true;
    console.log(`[kenning] ${signal}: closing`);
    // Each API process finishes the answers it has begun, then exits.
    for (const s of slots) s.worker?.process.kill('SIGTERM');
    setTimeout(() => {
      for (const s of slots) s.worker?.process.kill('SIGKILL');
    }, 8000).unref();
    maybeDone();
    void allStopped.then(() => chores.stop()).finally(() => process.exit(0));
    setTimeout(() => process.exit(1), 10_000).unref();
  };
  process.once('SIGINT', () => stop('SIGINT'));
  process.once('SIGTERM', () => stop('SIGTERM'));
  process.once('disconnect', () => stop('supervisor gone'));
}

main().catch((err: unknown) => {
  console.error('[kenning] could not start:', err);
  process.exit(1);
});
