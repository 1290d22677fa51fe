import type { NextFunction, Request, Response } from 'express';
import { AppError } from '@/server/domain/app-error';

const SAFE = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Refuses state-changing requests (any method but GET, HEAD and OPTIONS, JSON and
 * multipart alike) that a browser sent from another site: the Origin header, when
 * present, must be Kenning's own public origin; without one, a Sec-Fetch-Site of
 * `cross-site` is refused too. Clients that are not browsers send neither and pass.
 * Runs before any body is read, so a foreign upload is refused before it arrives.
 */
export function originCheck(publicUrl: string) {
  const own = new URL(publicUrl).origin;
  return (req: Request, _res: Response, next: NextFunction) => {
    if (SAFE.has(req.method)) return next();
    const origin = req.get('origin');
    const foreign = origin ? origin !== own : req.get('sec-fetch-site') === 'cross-site';
    if (foreign) {
      throw new AppError(403, 'foreign_origin', 'This request came from another website and was refused.');
    }
    next();
  };
}
