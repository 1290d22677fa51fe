import { existsSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { brotliCompressSync, constants, gzipSync } from 'node:zlib';
import type { NextFunction, Request, Response } from 'express';

/** Encodings a build may hold beside a script, best first, with the file suffix each is stored under. */
const ENCODINGS = [
  { name: 'br', suffix: '.br' },
  { name: 'gzip', suffix: '.gz' },
] as const;

/**
 * Serves the web build's hashed scripts from the copies compressed once at
 * build time (`precompressWeb`: brotli at quality 11,
 * gzip at level 9) instead of compressing them on every request (the
 * `compression` middleware uses brotli quality 4, ≈ 20 % larger for the first
 * bundle). Only files under `_expo/static/` whose names carry a content hash,
 * so a stale copy cannot be served; anything else falls through to
 * `express.static` and `compression`.
 */
export function precompressedAssets(webDir: string) {
  const staticDir = path.join(webDir, '_expo', 'static');
  return (req: Request, res: Response, next: NextFunction) => {
    if ((req.method !== 'GET' && req.method !== 'HEAD') || !req.path.startsWith('/_expo/static/') || !req.path.endsWith('.js')) {
      return next();
    }
    const file = path.join(webDir, path.normalize(decodeURIComponent(req.path)));
    if (!file.startsWith(staticDir + path.sep)) return next();
    // Our order, not the client's: brotli whenever it is accepted (browsers list gzip first).
    const encoding = ENCODINGS.find((e) => req.acceptsEncodings(e.name) === e.name && existsSync(file + e.suffix));
    if (!encoding) return next();
    res.setHeader('Vary', 'Accept-Encoding');
    res.setHeader('Content-Encoding', encoding.name);
    res.setHeader('Cache-Control', 'public, max-age=31536000, immutable');
    res.type('application/javascript');
    res.sendFile(file + encoding.suffix, (error) => {
      if (error && !res.headersSent) next(error);
    });
  };
}

/**
 * Writes a brotli (quality 11, the slowest and smallest) and a gzip (level 9)
 * copy beside every script of the web build; returns the byte totals.
 * Seconds of CPU for a few MB, hence once per build, never per request.
 */
export function precompressWeb(webDir: string): { raw: number; br: number; gz: number } {
  const dir = path.join(webDir, '_expo', 'static', 'js', 'web');
  const totals = { raw: 0, br: 0, gz: 0 };
  for (const name of readdirSync(dir)) {
    if (!name.endsWith('.js')) continue;
    const file = path.join(dir, name);
    const body = readFileSync(file);
    const brotli = brotliCompressSync(body, {
      params: {
        [constants.BROTLI_PARAM_QUALITY]: constants.BROTLI_MAX_QUALITY,
        [constants.BROTLI_PARAM_MODE]: constants.BROTLI_MODE_TEXT,
        [constants.BROTLI_PARAM_SIZE_HINT]: body.length,
      },
    });
    const gzip = gzipSync(body, { level: 9 });
    writeFileSync(`${file}.br`, brotli);
    writeFileSync(`${file}.gz`, gzip);
    totals.raw += body.length;
    totals.br += brotli.length;
    totals.gz += gzip.length;
  }
  return totals;
}
