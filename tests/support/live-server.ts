import type { AddressInfo } from 'node:net';
import type { Express } from 'express';
import { DEMO_PASSWORD } from '@/server/seeders/demo';

export interface LiveResponse {
  status: number;
  headers: Headers;
  body: any; // eslint-disable-line @typescript-eslint/no-explicit-any
  /** Wall-clock time from sending to the whole body, ms. */
  ms: number;
}

/**
 * The app listening on a free loopback port, for tests that need real parallel
 * requests (supertest starts a server per request and serialises nothing, but
 * a shared listener is what a burst of clients meets).
 */
export async function listen(app: Express) {
  const server = await new Promise<import('node:http').Server>((resolve) => {
    const s = app.listen(0, '127.0.0.1', () => resolve(s));
  });
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;

  async function call(
    method: string,
    path: string,
    { cookie, json, headers = {} }: { cookie?: string; json?: unknown; headers?: Record<string, string> } = {},
  ): Promise<LiveResponse> {
    const started = performance.now();
    const res = await fetch(base + path, {
      method,
      headers: {
        ...(cookie && { cookie }),
        ...(json !== undefined && { 'content-type': 'application/json' }),
        ...headers,
      },
      body: json === undefined ? undefined : JSON.stringify(json),
    });
    const text = await res.text();
    let body: unknown = text;
    try {
      body = text ? JSON.parse(text) : null;
    } catch {
      // not JSON: keep the text
    }
    return { status: res.status, headers: res.headers, body, ms: performance.now() - started };
  }

  /** Signs in and returns the session cookie (`name=value`). */
  async function signIn(email: string, password = DEMO_PASSWORD): Promise<string> {
    const res = await fetch(base + '/api/auth/sign-in', {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ email, password }),
    });
    if (res.status !== 200) throw new Error(`sign-in as ${email} failed: ${res.status} ${await res.text()}`);
    const cookie = res.headers.getSetCookie().find((c) => c.startsWith('kenning_session='));
    if (!cookie) throw new Error('sign-in set no session cookie');
    return cookie.split(';')[0]!;
  }

  return {
    base,
    call,
    signIn,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
