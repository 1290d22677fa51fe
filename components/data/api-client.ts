import type { z } from 'zod';
import { ApiErrorSchema } from '@/shared/schemas/error';

/** A failed API call: HTTP status, stable code, message for people, and per-field reasons. */
export class ApiRequestError extends Error {
  override name = 'ApiRequestError';
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields: Record<string, string> = {},
  ) {
    super(message);
  }
}

/** The server is out of reach (offline, or not running). */
export class NetworkError extends Error {
  override name = 'NetworkError';
}

type Method = 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';

async function request<S extends z.ZodType>(method: Method, path: string, schema: S | null, body?: unknown): Promise<z.infer<S>> {
  let res: Response;
  try {
    res = await fetch(`/api${path}`, {
      method,
      credentials: 'same-origin',
      headers:
        body === undefined ? { Accept: 'application/json' } : { Accept: 'application/json', 'Content-Type': 'application/json' },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
  } catch (cause) {
    throw new NetworkError('Kenning cannot reach its server. Check your connection.', { cause });
  }
  if (!res.ok) {
    const parsed = ApiErrorSchema.safeParse(await res.json().catch(() => null));
    if (parsed.success) {
      const e = parsed.data.error;
      throw new ApiRequestError(res.status, e.code, e.message, e.fields);
    }
    throw new ApiRequestError(res.status, 'http_error', `The server answered ${res.status}.`);
  }
  if (schema === null || res.status === 204) return undefined as z.infer<S>;
  return schema.parse(await res.json());
}

/** The one way the app talks to the server: throws on non-2xx, parses every body with its schema. */
export const api = {
  get: <S extends z.ZodType>(path: string, schema: S) => request('GET', path, schema),
  post: <S extends z.ZodType>(path: string, body: unknown, schema: S | null) => request('POST', path, schema, body),
  patch: <S extends z.ZodType>(path: string, body: unknown, schema: S) => request('PATCH', path, schema, body),
  delete: (path: string) => request('DELETE', path, null),
};
