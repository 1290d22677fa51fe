import type { Sequelize } from 'sequelize';
import { createApp } from '@/server/app';
import { loadSessionUser } from '@/server/http/session';
import { startSessionUserCache } from '@/server/http/session-user-cache';
import { createTestDatabase, scratchFileStore, TEST_CONFIG } from '@/tests/support/test-db';
import { DEMO } from '@/tests/support/agents';
import { listen } from '@/tests/support/live-server';

// Two API processes on one database, as `npm start` runs them (one per core), each
// keeping signed-in users in memory for a few seconds. Ending a session on one
// must refuse a copy of its cookie on the other at once, cache warm or not.

let db: Sequelize;
let drop: () => Promise<void>;
type Instance = { cache: ReturnType<typeof startSessionUserCache>; live: Awaited<ReturnType<typeof listen>> };
let a: Instance;
let b: Instance;

beforeAll(async () => {
  const database = await createTestDatabase();
  ({ db, drop } = database);
  const instance = async (): Promise<Instance> => {
    // A long life, so only an announcement can explain a refused cookie.
    const cache = startSessionUserCache(database.url, loadSessionUser, 60);
    await cache.ready;
    const app = createApp({ db, config: TEST_CONFIG, files: scratchFileStore().files, sessionUsers: cache.cache });
    return { cache, live: await listen(app) };
  };
  a = await instance();
  b = await instance();
});
afterAll(async () => {
  for (const i of [a, b]) {
    await i?.live.close();
    await i?.cache.stop();
  }
  await drop();
});

const me = async (on: Instance, cookie: string) => (await on.live.call('GET', '/api/me', { cookie })).status;

it('keeps a signed-in user in memory: a change behind its back is not seen until the entry lapses', async () => {
  const cookie = await a.live.signIn(DEMO.observer);
  const first = await b.live.call('GET', '/api/me', { cookie });
  expect(first.status).toBe(200);
  await db.query("UPDATE users SET name = name || ' (renamed)' WHERE email = :email", {
    replacements: { email: DEMO.observer },
  });
  try {
    // Served from b's memory: no database read, so still the old name.
    expect((await b.live.call('GET', '/api/me', { cookie })).body.user.name).toBe(first.body.user.name);
  } finally {
    await db.query("UPDATE users SET name = replace(name, ' (renamed)', '') WHERE email = :email", {
      replacements: { email: DEMO.observer },
    });
  }
});

it('refuses a copied cookie on the other process right after sign-out, with both caches warm', async () => {
  const cookie = await a.live.signIn(DEMO.planner);
  const other = await a.live.signIn(DEMO.planner);
  for (const on of [a, b]) expect(await me(on, cookie)).toBe(200);
  expect(await me(b, other)).toBe(200);
  expect(b.cache.cache.size).toBeGreaterThanOrEqual(2);

  expect((await a.live.call('POST', '/api/auth/sign-out', { cookie })).status).toBe(204);
  expect(await me(b, cookie)).toBe(401);
  expect(await me(a, cookie)).toBe(401);
  expect((await b.live.call('GET', '/api/v1/sites', { cookie })).status).toBe(401);
  // The person's other session lives on.
  expect(await me(b, other)).toBe(200);
});

it('ends every session on every process: sign out everywhere, a role change, deactivation', async () => {
  const laptop = await a.live.signIn(DEMO.reviewer);
  const phone = await b.live.signIn(DEMO.reviewer);
  for (const on of [a, b]) for (const c of [laptop, phone]) expect(await me(on, c)).toBe(200);
  expect((await b.live.call('POST', '/api/auth/sign-out-everywhere', { cookie: phone })).status).toBe(204);
  for (const on of [a, b]) for (const c of [laptop, phone]) expect(await me(on, c)).toBe(401);

  const admin = await a.live.signIn(DEMO.admin);
  const people = (await a.live.call('GET', '/api/v1/users?pageSize=100', { cookie: admin })).body.items;
  const observer = people.find((u: { email: string }) => u.email === DEMO.observer);
  let version = observer.version as number;
  const change = async (body: object) => {
    const res = await a.live.call('PATCH', `/api/v1/users/${observer.id}`, { cookie: admin, json: { ...body, version } });
    expect(res.status).toBe(200);
    version = res.body.user.version;
  };

  let cookie = await b.live.signIn(DEMO.observer);
  expect(await me(b, cookie)).toBe(200);
  await change({ role: 'reviewer' });
  expect(await me(b, cookie)).toBe(401);

  cookie = await b.live.signIn(DEMO.observer);
  expect(await me(b, cookie)).toBe(200);
  await change({ active: false });
  expect(await me(b, cookie)).toBe(401);
  await change({ active: true, role: 'observer' });
  expect(await me(b, cookie)).toBe(401);
});
