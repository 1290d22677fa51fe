/** Field path → reason, as shown under each input. */
export type FieldErrors = Record<string, string>;

/**
 * The one error type use cases and routes throw (a domain type: the HTTP status it carries is what the error handler answers with). `code` is stable and meant for
 * programs; `message` is for people.
 */
export class AppError extends Error {
  override name = 'AppError';

  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: FieldErrors,
    options?: { cause?: unknown },
  ) {
    super(message, options);
  }

  static badRequest(message: string, fields?: FieldErrors) {
    return new AppError(400, 'invalid_input', message, fields);
  }
  static unauthenticated(message = 'Sign in to continue.') {
    return new AppError(401, 'unauthenticated', message);
  }
  static forbidden(message = 'Your role does not allow this.') {
    return new AppError(403, 'forbidden', message);
  }
  static notFound(what = 'That item') {
    return new AppError(404, 'not_found', `${what} was not found.`);
  }
  static conflict(message: string, code = 'conflict') {
    return new AppError(409, code, message);
  }
  static tooManyRequests(message: string, retryAfterS?: number) {
    const error = new AppError(429, 'too_many_requests', message);
    error.retryAfterS = retryAfterS;
    return error;
  }

  /** Seconds the client should wait before trying again (sent as Retry-After). */
  retryAfterS?: number;
}
