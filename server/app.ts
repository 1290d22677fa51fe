import { existsSync } from 'node:fs';
import path from 'node:path';
import compression from 'compression';
import express from 'express';
import type { Sequelize } from 'sequelize';
import { DEFAULT_HILLSHADE_MAX_EDGE } from '@/shared/terrain/hillshade-image';
import type { Config } from './config';
import { createSignInLimiter } from './domain/auth/sign-in-limiter';
import { createErrorHandler, notFoundHandler } from './http/error-handler';
import { watchDatabaseOutage } from './http/database-outage';
import { originCheck } from './http/origin-check';
import { precompressedAssets } from './http/precompressed-assets';
import { securityHeaders } from './http/security-headers';
import { sessionMiddleware, type SessionUser } from './http/session';
import type { SessionUserCache } from './http/session-user-cache';
import { createCaughtMailClient } from './mail/caught-mail-client';
import type { Mailer } from './mail/mailer';
import type { FileStore } from './storage/file-store';
import { attachmentRoutes } from './routes/attachments';
import { auditRoutes } from './routes/audit';
import { calibrationRoutes } from './routes/calibrations';
import { drillRoutes } from './routes/drills';
import { caughtMailRoutes } from './routes/caught-mail';
import { courseRoutes } from './routes/courses';
import { coverageRoutes } from './routes/coverage';
import { exportRoutes } from './routes/exports';
import { fixRoutes } from './routes/fixes';
import { incidentRoutes } from './routes/incidents';
import { sitingRoutes } from './routes/siting';
import type { CoverageQueue } from './queue/coverage-queue';
import type { VisibilityIndexQueue } from './queue/visibility-index-queue';
import { authRoutes } from './routes/auth';
import { healthRoutes } from './routes/health';
import { libraryRoutes } from './routes/library';
import { planRoutes } from './routes/plans';
import { reportRoutes } from './routes/reports';
import { rosterRoutes } from './routes/roster';
import { sightlineRoutes } from './routes/sightline';
import { siteRoutes } from './routes/sites';
import { landmarkRoutes } from './routes/landmarks';
import { sweepWidthRoutes } from './routes/sweep-width';
import { terrainRoutes } from './routes/terrain';
import { createTerrainCache, type TerrainCache } from './terrain/terrain-cache';
import { createTerrainIngestRunner, type TerrainIngestRunner } from './workers/terrain-ingest-runner';
import { userRoutes } from './routes/users';
import { visibilityIndexRoutes } from './routes/visibility-index';

export interface AppDeps {
  db: Sequelize;
  /** Outgoing mail; null or absent: nothing is e-mailed (links are still shown where they matter). */
  mailer?: Mailer | null;
  /** Where uploaded bytes are kept (attachments, terrain). */
  files: FileStore;
  /** Folder for uploads still being received (default: `kenning-uploads` in the system temp folder). */
  uploadTempDir?: string;
  /** Terrain ingest off the request thread; default a worker-thread runner. */
  terrainIngest?: TerrainIngestRunner;
  /** Terrains held in memory; default a cache of TERRAIN_CACHE_MB. */
  terrainCache?: TerrainCache;
  /** The coverage job queue; null or absent: coverage runs cannot be started (they can still be read). */
  coverageQueue?: CoverageQueue | null;
  /** The siting job queue; null or absent: siting runs cannot be started (they can still be read). */
  sitingQueue?: CoverageQueue | null;
  /** The visibility index job queue; null or absent: only layers already computed can be read. */
  visibilityIndexQueue?: VisibilityIndexQueue | null;
  /** Signed-in users kept for a few seconds (`startSessionUserCache`); absent: loaded on every request. */
  sessionUsers?: SessionUserCache<SessionUser> | null;
  config: Pick<
    Config,
    | 'NODE_ENV'
    | 'SESSION_SECRET'
    | 'PUBLIC_URL'
    | 'TRUST_PROXY'
    | 'WEB_DIST_DIR'
    | 'SIGN_IN_LIMIT_PER_ADDRESS'
    | 'SIGN_IN_LIMIT_PER_ACCOUNT'
    | 'SIGN_IN_WINDOW_SECONDS'
    | 'SIGN_IN_STORE'
    | 'LOG_REQUESTS'
    | 'CAUGHT_MAIL_URL'
    | 'TERRAIN_MAX_UPLOAD_BYTES'
    | 'TERRAIN_MAX_CELLS'
    | 'TERRAIN_CACHE_MB'
    | 'TERRAIN_UPLOAD_DIR'
  >;
}

/** Builds the Express app (API + the exported web app) without listening. */
export function createApp({
  db,
  config,
  mailer = null,
  files,
  uploadTempDir,
  terrainIngest,
  terrainCache,
  coverageQueue = null,
  sitingQueue = null,
  visibilityIndexQueue = null,
  sessionUsers = null,
}: AppDeps) {
  const app = express();
  app.disable('x-powered-by');
  const outage = watchDatabaseOutage(db);
  // Links in mail use the configured address: a request's Host header is the client's to choose.
  const publicUrl = () => config.PUBLIC_URL;
  app.set('trust proxy', config.TRUST_PROXY ? 1 : false);

  // The web bundle is ~2 MB of JavaScript; gzip brings it under 0.5 MB for phones.
  app.use(compression());
  app.use(securityHeaders({ production: config.NODE_ENV === 'production' }));
  if (config.LOG_REQUESTS) {
    app.use((req, res, next) => {
      const started = process.hrtime.bigint();
      res.on('finish', () => {
        const ms = Number(process.hrtime.bigint() - started) / 1e6;
        console.log(`${req.method} ${req.originalUrl} ${res.statusCode} ${ms.toFixed(1)} ms`);
      });
      next();
    });
  }

  const limiter = createSignInLimiter({
    perAddress: config.SIGN_IN_LIMIT_PER_ADDRESS,
    perAccount: config.SIGN_IN_LIMIT_PER_ACCOUNT,
    windowSeconds: config.SIGN_IN_WINDOW_SECONDS,
    store: config.SIGN_IN_STORE === 'memory' ? 'memory' : db,
  });

  const api = express.Router();
  // Production refuses writes a browser sent from another site (before any body is read).
  if (config.NODE_ENV === 'production') api.use(originCheck(config.PUBLIC_URL));
  api.use(express.json({ limit: '1mb' }));
  api.use(sessionMiddleware(config.SESSION_SECRET, sessionUsers));
  api.use((_req, res, next) => {
    res.setHeader('Cache-Control', 'no-store');
    next();
  });
  api.use(healthRoutes(db));
  api.use(authRoutes(db, limiter));

  const v1 = express.Router();
  const cache = terrainCache ?? createTerrainCache({ files, maxBytes: config.TERRAIN_CACHE_MB * 2 ** 20 });
  v1.use(sightlineRoutes());
  v1.use(siteRoutes(db));
  v1.use(landmarkRoutes(db));
  v1.use(
    terrainRoutes(
      {
        db,
        files,
        ingest: terrainIngest ?? createTerrainIngestRunner(),
        cache,
        maxCells: config.TERRAIN_MAX_CELLS,
        hillshadeMaxEdge: DEFAULT_HILLSHADE_MAX_EDGE,
      },
      { tmpDir: config.TERRAIN_UPLOAD_DIR, maxBytes: config.TERRAIN_MAX_UPLOAD_BYTES },
    ),
  );
  v1.use(libraryRoutes(db));
  v1.use(sweepWidthRoutes(db));
  v1.use(calibrationRoutes(db));
  v1.use(drillRoutes(db, cache));
  v1.use(courseRoutes(db, cache));
  v1.use(fixRoutes(cache));
  v1.use(planRoutes(db, publicUrl, mailer));
  v1.use(exportRoutes({ terrainCache: cache }));
  v1.use(reportRoutes(db, files));
  v1.use(incidentRoutes(db, publicUrl, mailer, cache));
  v1.use(coverageRoutes({ db, queue: coverageQueue }));
  v1.use(sitingRoutes({ db, queue: sitingQueue }));
  v1.use(visibilityIndexRoutes({ queue: visibilityIndexQueue }));
  v1.use(rosterRoutes(db));
  v1.use(attachmentRoutes(db, files, uploadTempDir));
  v1.use(userRoutes(db, publicUrl, mailer));
  v1.use(auditRoutes());
  v1.use(caughtMailRoutes(config.CAUGHT_MAIL_URL ? createCaughtMailClient(config.CAUGHT_MAIL_URL) : null));
  api.use('/v1', v1);

  api.use(notFoundHandler);
  app.use('/api', api);

  // The single-page web app: hashed assets cached long, every other path gets index.html.
  const webDir = config.WEB_DIST_DIR;
  const index = path.join(webDir, 'index.html');
  if (existsSync(index)) {
    app.use(precompressedAssets(webDir));
    app.use(
      express.static(webDir, {
        index: false,
        setHeaders(res, file) {
          if (file.includes(`${path.sep}_expo${path.sep}`) || file.includes(`${path.sep}assets${path.sep}`)) {
            res.setHeader('Cache-Control', 'public, max-age=31536000, immutable');
          } else if (file.endsWith(`${path.sep}sw.js`) || file.endsWith('.webmanifest')) {
            // The field-mode worker and manifest are checked on every start, so a new build reaches phones at once.
            res.setHeader('Cache-Control', 'no-cache');
          }
        },
      }),
    );
    app.get(/.*/, (_req, res) => {
      res.setHeader('Cache-Control', 'no-cache');
      res.sendFile(index);
    });
  }

  app.use(createErrorHandler(outage));
  return app;
}
