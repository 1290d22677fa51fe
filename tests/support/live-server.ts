import type { AddressInfo } from 'node:net';
import type { Express } from 'express';
import { DEMO_PASSWORD } from '@/server/seeders/demo';
import { createTestApp } from './test-db';

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
export type Live = Awaited<ReturnType<typeof listen>>;

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

/**
 * A draft plan on the demo forest district with its first post, target and condition set, created by the signed-in
 * `cookie` through the live server; answers the POST's response (201 with `plan`).
 */
export async function createForestPlan(live: Live, cookie: string, title: string): Promise<LiveResponse> {
  const items = async (path: string) => (await live.call('GET', `/api/v1${path}`, { cookie })).body.items;
  const sites = await items('/sites');
  const site = sites.find((s: { name: string }) => s.name === 'Harrowmere Forest District');
  const posts = await items(`/sites/${site.id}/posts`);
  const targets = await items('/targets');
  const sets = await items('/conditions');
  return live.call('POST', '/api/v1/plans', {
    cookie,
    json: {
      siteId: site.id,
      title,
      postIds: [posts[0].id],
      targetIds: [targets[0].id],
      conditionSetIds: [sets[0].id],
    },
  });
}

/** A test app with a database of its own (`createTestApp`), listening on a loopback port; `close` stops both. */
export async function listenTestApp() {
  const ctx = await createTestApp();
  const live = await listen(ctx.app);
  const close = async () => {
    await live.close();
    await ctx.close();
  };
  return { ctx, live, close };
}
