import type { z } from 'zod';
import { AppError, type FieldErrors } from '@/server/domain/app-error';

/** Flattens zod issues to `{ "a.b": "why" }`, first message per path. */
export function fieldErrors(error: z.ZodError): FieldErrors {
  const out: FieldErrors = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join('.') : '_';
    out[key] ??= issue.message;
  }
  return out;
}

/** Parses `value` with `schema` or throws a 400 AppError listing each bad field. */
export function parseOrThrow<S extends z.ZodType>(schema: S, value: unknown, what = 'request'): z.infer<S> {
  const result = schema.safeParse(value);
  if (result.success) return result.data;
  throw AppError.badRequest(`The ${what} has invalid fields.`, fieldErrors(result.error));
}
