import type { Server } from 'node:http';
import { createApp } from './app';
import { config } from './config';
import { createDatabase } from './data/database';
import { startStaleRunReaper } from './domain/coverage/run-heartbeat';
import { createMailer } from './mail/mailer';
import { startCoverageBoss } from './queue/coverage-queue';
import { DEFAULT_ATTACHMENT_UPLOAD_DIR } from './routes/attachments';
import { cleanStaleUploads } from './storage/clean-stale-uploads';
import { createDiskFileStore } from './storage/file-store';

/** Entry point: serves the API and the web app from one process. */
async function main() {
  const cfg = config();
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
  // Fails runs whose worker died, even when no worker is left to notice.
  const reaper = startStaleRunReaper(db);
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
  const app = createApp({
    db,
    config: cfg,
    mailer,
    files: createDiskFileStore(cfg.FILE_STORE_DIR),
    coverageQueue: coverage.queue,
  });
  const server: Server = await new Promise((resolve) => {
    const s = app.listen(cfg.PORT, cfg.HOST, () => resolve(s));
  });
  const address = server.address();
  const port = typeof address === 'object' && address ? address.port : cfg.PORT;
  console.log(`[kenning] serving on http://${cfg.HOST}:${port}`);

  const stop = (signal: string) => {
    console.log(`[kenning] ${signal}: closing`);
    mailer?.close();
    reaper.stop();
    clearInterval(uploadSweeper);
    server.close(() => {
      void coverage
        .stop()
        .then(() => db.close())
        .finally(() => process.exit(0));
    });
    server.closeAllConnections();
    setTimeout(() => process.exit(1), 5000).unref();
  };
  process.once('SIGINT', () => stop('SIGINT'));
  process.once('SIGTERM', () => stop('SIGTERM'));
  // Started by the bootstrap with an IPC channel: stop when the bootstrap is gone.
  process.once('disconnect', () => stop('supervisor gone'));
}

main().catch((err: unknown) => {
  console.error('[kenning] could not start:', err);
  process.exit(1);
});
