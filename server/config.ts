import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { z } from 'zod';

/** The project root: server/ lives one level below it. */
export const projectRoot = path.resolve(__dirname, '..');

/** Local, ignored state: database cluster, secrets, uploads, caches. */
export const dataDir = path.join(projectRoot, '.kenning');

const EnvSchema = z.object({
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  HOST: z.string().min(1).default('127.0.0.1'),
  PORT: z.coerce.number().int().min(0).max(65535).default(8080),
  DATABASE_URL: z.url({ protocol: /^postgres(ql)?$/ }),
  /** iron-session needs at least 32 characters. */
  SESSION_SECRET: z.string().min(32).optional(),
  /** Folder where uploaded files (attachments, terrain) are kept. */
  FILE_STORE_DIR: z.string().min(1).default(path.join(dataDir, 'files')),
  /** Largest terrain upload, bytes (default 400 MB: a 4000 × 4000 ESRI ASCII grid is about 150 MB). */
  TERRAIN_MAX_UPLOAD_BYTES: z.coerce.number().int().positive().default(400_000_000),
  /** Largest terrain grid, cells (default 25 million, e.g. 5000 × 5000). */
  TERRAIN_MAX_CELLS: z.coerce.number().int().positive().max(100_000_000).default(25_000_000),
  /** Memory for terrains held by the server (LRU), MiB (default 512: eight 4000 × 4000 grids). */
  TERRAIN_CACHE_MB: z.coerce.number().int().positive().default(512),
  /** Where terrain uploads are received before they are checked (default beside the file store, so moving them in is a rename). */
  TERRAIN_UPLOAD_DIR: z.string().min(1).default(path.join(dataDir, 'uploads')),
  /** Viewshed threads of one coverage worker process; default every core. */
  COVERAGE_WORKER_THREADS: z.coerce.number().int().positive().max(64).optional(),
  /** API processes (one per core by default; they share the port). 1 serves from one process. */
  WEB_CONCURRENCY: z.coerce.number().int().positive().max(64).optional(),
  /**
   * How long each API process keeps a signed-in user after loading it, seconds (0: load on every
   * request). Sign-out and the rest reach every process at once through PostgreSQL notifications.
   */
  SESSION_CACHE_SECONDS: z.coerce.number().min(0).max(60).default(5),
  /** Folder holding the exported web app; the API runs without it. */
  WEB_DIST_DIR: z.string().default(path.join(projectRoot, 'dist', 'web')),
  /**
   * The address people reach Kenning at (e.g. https://kenning.example.org): links in
   * invitation and review mail are built from it, never from the request's Host header.
   * Required in production; elsewhere it defaults to http://HOST:PORT.
   */
  PUBLIC_URL: z.url({ protocol: /^https?$/, error: 'Give the full address, e.g. https://kenning.example.org' }).optional(),
  /** Set when a reverse proxy terminates TLS in front of the server. */
  TRUST_PROXY: z
    .enum(['0', '1', 'true', 'false'])
    .default('0')
    .transform((v) => v === '1' || v === 'true'),
  /** Failed sign-ins from one client address per window before progressive delays begin. */
  SIGN_IN_LIMIT_PER_ADDRESS: z.coerce.number().int().positive().default(30),
  /** Failed sign-ins on one account per window before progressive delays begin. */
  SIGN_IN_LIMIT_PER_ACCOUNT: z.coerce.number().int().positive().default(5),
  /** Where sign-in counts live: 'database' (shared by every server process) or 'memory' (one process). */
  SIGN_IN_STORE: z.enum(['database', 'memory']).default('database'),
  SIGN_IN_WINDOW_SECONDS: z.coerce
    .number()
    .int()
    .positive()
    .default(15 * 60),
  /** SMTP relay. Unset: the server sends no mail (the bootstrap points it at the local catcher). */
  SMTP_HOST: z.string().min(1).optional(),
  SMTP_PORT: z.coerce.number().int().min(1).max(65535).default(587),
  /** '1' for TLS from the first byte (port 465); otherwise STARTTLS when the server offers it. */
  SMTP_SECURE: z
    .enum(['0', '1', 'true', 'false'])
    .default('0')
    .transform((v) => v === '1' || v === 'true'),
  SMTP_USER: z.string().min(1).optional(),
  SMTP_PASSWORD: z.string().min(1).optional(),
  MAIL_FROM: z.string().min(3).default('Kenning <no-reply@demo.kenning.test>'),
  /** Base URL of the development mail catcher's HTTP API; enables GET /api/v1/caught-mail for admins. */
  CAUGHT_MAIL_URL: z.url({ protocol: /^http$/ }).optional(),
  LOG_REQUESTS: z
    .enum(['0', '1'])
    .default('0')
    .transform((v) => v === '1'),
});

export type Config = Omit<z.infer<typeof EnvSchema>, 'SESSION_SECRET' | 'PUBLIC_URL'> & {
  SESSION_SECRET: string;
  /** Without a trailing slash. */
  PUBLIC_URL: string;
};

export class ConfigError extends Error {
  override name = 'ConfigError';
}

/**
 * Development and test runs get a generated session secret kept in the ignored
 * data folder; production must supply one.
 */
function localSessionSecret(): string {
  const file = path.join(dataDir, 'session-secret');
  if (existsSync(file)) return readFileSync(file, 'utf8').trim();
  mkdirSync(dataDir, { recursive: true });
  const secret = randomBytes(32).toString('base64url');
  writeFileSync(file, secret + '\n', { mode: 0o600 });
  return secret;
}

/** Reads and validates the environment once. */
export function loadConfig(env: Record<string, string | undefined> = process.env): Config {
  const parsed = EnvSchema.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new ConfigError(`Invalid environment:\n${lines.join('\n')}`);
  }
  const cfg = parsed.data;
  if (!cfg.SESSION_SECRET && cfg.NODE_ENV === 'production') {
    throw new ConfigError('SESSION_SECRET must be set (32+ characters) when NODE_ENV=production');
  }
  if (!cfg.PUBLIC_URL && cfg.NODE_ENV === 'production') {
    throw new ConfigError('PUBLIC_URL must be set when NODE_ENV=production (the address mail links point to)');
  }
  if (cfg.CAUGHT_MAIL_URL && cfg.NODE_ENV === 'production') {
    throw new ConfigError('CAUGHT_MAIL_URL is for development and tests only; unset it when NODE_ENV=production');
  }
  if (Boolean(cfg.SMTP_USER) !== Boolean(cfg.SMTP_PASSWORD)) {
    throw new ConfigError('Set both SMTP_USER and SMTP_PASSWORD, or neither');
  }
  const publicUrl = (cfg.PUBLIC_URL ?? `http://${cfg.HOST}:${cfg.PORT}`).replace(/\/+$/, '');
  return { ...cfg, SESSION_SECRET: cfg.SESSION_SECRET ?? localSessionSecret(), PUBLIC_URL: publicUrl };
}

let cached: Config | undefined;

/** The process-wide configuration, read on first use. */
export function config(): Config {
  cached ??= loadConfig();
  return cached;
}
