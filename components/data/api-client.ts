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
  if (!res.ok) throw errorOf(res.status, await res.json().catch(() => null));
  if (schema === null || res.status === 204) return undefined as z.infer<S>;
  return schema.parse(await res.json());
}

/** Maps a non-2xx answer to an ApiRequestError, using the API's error body when there is one. */
function errorOf(status: number, body: unknown): ApiRequestError {
  const parsed = ApiErrorSchema.safeParse(body);
  if (parsed.success) {
    const e = parsed.data.error;
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
function upload<S extends z.ZodType>(path: string, form: FormData, schema: S, onProgress?: UploadProgress, signal?: AbortSignal) {
  return new Promise<z.infer<S>>((resolve, reject) => {
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
      try {
        onProgress?.(1);
        resolve(schema.parse(body));
      } catch (e) {
        reject(e);
      }
    };
    signal?.addEventListener('abort', () => xhr.abort(), { once: true });
    xhr.send(form);
  });
}

/** The one way the app talks to the server: throws on non-2xx, parses every body with its schema. */
export const api = {
  get: <S extends z.ZodType>(path: string, schema: S) => request('GET', path, schema),
  post: <S extends z.ZodType>(path: string, body: unknown, schema: S | null) => request('POST', path, schema, body),
  patch: <S extends z.ZodType>(path: string, body: unknown, schema: S) => request('PATCH', path, schema, body),
  delete: (path: string) => request('DELETE', path, null),
  upload,
};
