import type { NextFunction, Request, Response } from 'express';
import { ConnectionAcquireTimeoutError, DatabaseError, ExclusionConstraintError, UniqueConstraintError } from 'sequelize';
import { AppError } from '@/server/domain/app-error';
import { isDatabaseAway, type DatabaseOutage } from './database-outage';

/** Seconds a client is asked to wait before retrying a 503. */
const RETRY_AFTER_S = 2;

/**
 * Constraints that refuse a duplicate a concurrent request slipped past the use
 * case's own check; anything else unique is a generic 409 `duplicate`.
 */
const CONSTRAINT_ANSWERS: Record<string, { code: string; message: string; fields?: Record<string, string> }> = {
  post_assignments_no_overlap: {
    code: 'assignment_overlap',
    message: 'This person already has a watch at that time. Reload the roster to see it.',
  },
  users_email_key: {
    code: 'email_taken',
    message: 'An account with this e-mail address already exists.',
    fields: { email: 'Already in use.' },
  },
};

function constraintOf(err: UniqueConstraintError | ExclusionConstraintError): string {
  const parent = (err as { parent?: { constraint?: string } }).parent;
  return parent?.constraint ?? ('constraint' in err ? String(err.constraint ?? '') : '');
}

/**
 * The one error middleware: consistent `{ error: { code, message, fields? } }` bodies.
 * With an outage watch, requests that fail because PostgreSQL is away are answered
 * 503 `database_unavailable` and logged once per outage, not once each.
 */
export function createErrorHandler(outage?: DatabaseOutage) {
  return (err: unknown, req: Request, res: Response, next: NextFunction) => handleError(err, req, res, next, outage);
}

/** The error middleware without an outage watch (every database outage is still a 503). */
export const errorHandler = createErrorHandler();

function handleError(err: unknown, req: Request, res: Response, _next: NextFunction, outage?: DatabaseOutage) {
  if (isDatabaseAway(err)) {
    outage?.refused(err);
    res.setHeader('Retry-After', String(RETRY_AFTER_S));
    res.status(503).json({
      error: { code: 'database_unavailable', message: 'The database cannot be reached right now. Try again shortly.' },
    });
    return;
  }
  if (err instanceof AppError) {
    if (err.retryAfterS) res.setHeader('Retry-After', String(err.retryAfterS));
    res.status(err.status).json({ error: { code: err.code, message: err.message, ...(err.fields && { fields: err.fields }) } });
    return;
  }
  if (err instanceof UniqueConstraintError || err instanceof ExclusionConstraintError) {
    const known = CONSTRAINT_ANSWERS[constraintOf(err)];
    const answer = known ?? {
      code: 'duplicate',
      message: 'That already exists (someone saved the same thing at the same moment).',
    };
    res.status(409).json({ error: { ...answer } });
    return;
  }
  if (err instanceof ConnectionAcquireTimeoutError) {
    res.setHeader('Retry-After', String(RETRY_AFTER_S));
    res.status(503).json({ error: { code: 'busy', message: 'The server is busy. Try again in a moment.' } });
    return;
  }
  if (err instanceof DatabaseError && (err.parent as { code?: string }).code === '22003') {
    // numeric_value_out_of_range: a number the schema let through does not fit its column.
    res.status(400).json({ error: { code: 'invalid_input', message: 'A number in the request is out of range.' } });
    return;
  }
  if (err instanceof DatabaseError && (err.parent as { code?: string }).code === '55P03') {
    // lock_not_available: another request is writing the same record right now (NOWAIT locks).
    res.setHeader('Retry-After', '1');
    res
      .status(409)
      .json({ error: { code: 'busy', message: 'Someone else is saving this right now. Reload and try again in a moment.' } });
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
  if (e.type === 'charset.unsupported') {
    res.status(415).json({ error: { code: 'unsupported_charset', message: 'Send the request body as UTF-8.' } });
    return;
  }
  if (e.type === 'encoding.unsupported') {
    res.status(415).json({
      error: { code: 'unsupported_encoding', message: 'Send the request body uncompressed, or gzip, deflate or br.' },
    });
    return;
  }
  // Any other client error from the HTTP layer (aborted or truncated bodies, bad URL encoding…).
  const status = e.status ?? (err as { statusCode?: number }).statusCode;
  if (status && status >= 400 && status < 500 && (err as { expose?: boolean }).expose) {
    res.status(status).json({ error: { code: 'bad_request', message: (err as Error).message || 'The request is malformed.' } });
    return;
  }
  console.error(`[kenning] ${req.method} ${req.originalUrl} failed:`, err);
  res.status(500).json({ error: { code: 'internal', message: 'Something went wrong on the server. It has been logged.' } });
}

export function notFoundHandler(req: Request, res: Response) {
  res.status(404).json({ error: { code: 'not_found', message: `No API route ${req.method} ${req.path}.` } });
}
