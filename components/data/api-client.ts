import type { z } from 'zod';
import type { ApiError } from '@/shared/schemas/error';

/**
 * A response schema fetched with the chunk that holds it. The screens of the
 * first bundle (sign-in, home) name their schemas this way, so zod and the
 * shared schemas load after the first screen rather than before it.
 */
export interface LazySchema<T> {
  readonly load: () => Promise<z.ZodType<T>>;
}

/** A schema, or one to fetch on first use (kept once loaded; a failed fetch is tried again next time). */
export function lazySchema<T>(load: () => Promise<z.ZodType<T>>): LazySchema<T> {
  let loading: Promise<z.ZodType<T>> | null = null;
  return {
    load: () =>
      (loading ??= load().catch((error: unknown) => {
        loading = null;
        throw error;
      })),
  };
}

/** What every call names to parse its answer with. */
export type ResponseSchema<T> = z.ZodType<T> | LazySchema<T>;

/** Starts fetching a lazy schema at once, so that it loads while the request is under way. */
function readyParser<T>(schema: ResponseSchema<T>): Promise<z.ZodType<T>> {
  const parser = 'load' in schema ? schema.load() : Promise.resolve(schema);
  parser.catch(() => undefined); // reported when the answer is parsed
  return parser;
}

/**
 * An API error body, `{ error: { code, message, fields? } }` (`ApiErrorSchema`),
 * checked by hand: a signed-out start reads a 401 before anything else, and must
 * not wait for the chunk with zod in it.
 */
function isApiError(body: unknown): body is ApiError {
  if (typeof body !== 'object' || body === null || !('error' in body)) return false;
  const e = body.error;
  if (typeof e !== 'object' || e === null) return false;
  const { code, message, fields } = e as Record<string, unknown>;
  const isFields =
    fields === undefined ||
    (typeof fields === 'object' && fields !== null && Object.values(fields).every((v) => typeof v === 'string'));
  return typeof code === 'string' && typeof message === 'string' && isFields;
}

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

async function request<T>(method: Method, path: string, schema: ResponseSchema<T> | null, body?: unknown): Promise<T> {
  const parser = schema === null ? null : readyParser(schema);
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
  if (!res.ok) throw errorOf(res.status, await res.json().catch(() => null));
  if (parser === null || res.status === 204) return undefined as T;
  const json: unknown = await res.json();
  return (await parser).parse(json);
}

/** Maps a non-2xx answer to an ApiRequestError, using the API's error body when there is one. */
function errorOf(status: number, body: unknown): ApiRequestError {
  if (isApiError(body)) {
    const e = body.error;
    return new ApiRequestError(status, e.code, e.message, e.fields);
  }
  return new ApiRequestError(status, 'http_error', `The server answered ${status}.`);
}

/** Share of an upload sent so far, 0…1. */
export type UploadProgress = (fraction: number) => void;

/**
 * Sends a multipart form and reports upload progress. `fetch` cannot report
 * the progress of a request body, so this one call uses XMLHttpRequest.
 */
function upload<T>(path: string, form: FormData, schema: ResponseSchema<T>, onProgress?: UploadProgress, signal?: AbortSignal) {
  const parser = readyParser(schema);
  return new Promise<T>((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', `/api${path}`);
    xhr.withCredentials = true;
    xhr.setRequestHeader('Accept', 'application/json');
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable && e.total > 0) onProgress?.(e.loaded / e.total);
    };
    xhr.onerror = () => reject(new NetworkError('Kenning cannot reach its server. Check your connection.'));
    xhr.onabort = () => reject(new DOMException('The upload was cancelled.', 'AbortError'));
    xhr.onload = () => {
      let body: unknown = null;
      try {
        body = JSON.parse(xhr.responseText);
      } catch {
        // Not JSON: handled below as a plain HTTP error.
      }
      if (xhr.status < 200 || xhr.status >= 300) return reject(errorOf(xhr.status, body));
      onProgress?.(1);
      parser.then((s) => s.parse(body)).then(resolve, reject);
    };
    signal?.addEventListener('abort', () => xhr.abort(), { once: true });
    xhr.send(form);
  });
}

/** The one way the app talks to the server: throws on non-2xx, parses every body with its schema. */
export const api = {
  get: <T>(path: string, schema: ResponseSchema<T>) => request('GET', path, schema),
  post: <T>(path: string, body: unknown, schema: ResponseSchema<T> | null) => request('POST', path, schema, body),
  patch: <T>(path: string, body: unknown, schema: ResponseSchema<T>) => request('PATCH', path, schema, body),
  delete: (path: string) => request('DELETE', path, null),
  upload,
};
