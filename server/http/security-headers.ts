import type { NextFunction, Request, Response } from 'express';

/**
 * The Content-Security-Policy of the exported web app. Scripts only from Kenning
 * itself (the export loads its bundles and lazy chunks with <script src>, no eval);
 * styles may be inline because react-native-web writes its styles at run time;
 * images also from data: and blob: URLs (icons, picked photos, canvas snapshots).
 */
export const CONTENT_SECURITY_POLICY = [
  "default-src 'self'",
  "script-src 'self'",
  "style-src 'self' 'unsafe-inline'",
  "img-src 'self' data: blob:",
  "font-src 'self' data:",
  "connect-src 'self'",
  "worker-src 'self' blob:",
  "object-src 'none'",
  "base-uri 'self'",
  "form-action 'self'",
  "frame-ancestors 'none'",
].join('; ');

/** One year, the usual HSTS lifetime. */
const HSTS = 'max-age=31536000; includeSubDomains';

/**
 * Headers every answer carries; in production also the CSP and, on requests that
 * arrived over TLS (directly or through a proxy trusted with TRUST_PROXY), HSTS.
 * A route may still set a stricter CSP of its own (attachment bytes are sandboxed).
 */
export function securityHeaders({ production }: { production: boolean }) {
  return (req: Request, res: Response, next: NextFunction) => {
    res.setHeader('X-Content-Type-Options', 'nosniff');
    res.setHeader('Referrer-Policy', 'same-origin');
    res.setHeader('X-Frame-Options', 'DENY');
    if (production) {
      res.setHeader('Content-Security-Policy', CONTENT_SECURITY_POLICY);
      if (req.secure) res.setHeader('Strict-Transport-Security', HSTS);
    }
    next();
  };
}
