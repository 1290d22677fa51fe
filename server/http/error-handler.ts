import type { NextFunction, Request, Response } from 'express';
import { AppError } from './app-error';

/** The one error middleware: consistent `{ error: { code, message, fields? } }` bodies. */
export function errorHandler(err: unknown, req: Request, res: Response, _next: NextFunction) {
  if (err instanceof AppError) {
    res.status(err.status).json({ error: { code: err.code, message: err.message, ...(err.fields && { fields: err.fields }) } });
    return;
  }
  // Body-parser failures carry a status and a type.
  const e = err as { status?: number; type?: string };
  if (e.type === 'entity.parse.failed') {
    res.status(400).json({ error: { code: 'malformed_json', message: 'The request body is not valid JSON.' } });
    return;
  }
  if (e.type === 'entity.too.large') {
    res.status(413).json({ error: { code: 'too_large', message: 'The request body is too large.' } });
    return;
  }
  console.error(`[kenning] ${req.method} ${req.originalUrl} failed:`, err);
  res.status(500).json({ error: { code: 'internal', message: 'Something went wrong on the server. It has been logged.' } });
}

export function notFoundHandler(req: Request, res: Response) {
  res.status(404).json({ error: { code: 'not_found', message: `No API route ${req.method} ${req.path}.` } });
}
