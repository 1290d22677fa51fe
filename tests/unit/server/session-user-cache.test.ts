import { createSessionUserCache } from '@/server/http/session-user-cache';

// The per-process cache of signed-in users: what it keeps, and what makes it forget.
// Plain behaviour of this module (common practice, no source).

type U = { id: string; live: boolean; name: string };

function setup(ttlMs = 5000) {
  let clock = 0;
  const rows = new Map<string, U>([['u1', { id: 'u1', live: true, name: 'Ada' }]]);
  const loads: string[] = [];
  let gate: Promise<void> | null = null;
  const cache = createSessionUserCache<U>(
    async (userId) => {
      loads.push(userId);
      if (gate) await gate;
      const row = rows.get(userId);
      return row ? { ...row } : null;
    },
    { ttlMs, now: () => clock },
  );
  cache.trust();
  const get = (id = 'u1', nonce = 'n1') => cache.get(id, nonce, (u) => u.live);
  return {
    cache,
    rows,
    loads,
    get,
    tick: (ms: number) => (clock += ms),
    hold: () => {
      let open: () => void = () => {};
      gate = new Promise((r) => (open = r));
      return () => {
        gate = null;
        open();
      };
    },
  };
}

it('serves a user from memory until the entry lapses', async () => {
  const t = setup();
  await t.get();
  t.rows.get('u1')!.name = 'Renamed';
  expect((await t.get())!.name).toBe('Ada');
  expect(t.loads).toHaveLength(1);
  t.tick(5001);
  expect((await t.get())!.name).toBe('Renamed');
  expect(t.loads).toHaveLength(2);
});

it('keeps sessions apart by nonce and keeps no session that is not live', async () => {
  const t = setup();
  await t.get('u1', 'a');
  await t.get('u1', 'b');
  expect(t.loads).toHaveLength(2);
  expect(t.cache.size).toBe(2);
  t.rows.get('u1')!.live = false;
  t.tick(6000);
  await t.get('u1', 'a');
  await t.get('u1', 'a');
  expect(t.loads).toHaveLength(4);
  expect(t.cache.size).toBe(1); // only b's lapsed entry, until it is asked for
});

it('forgets a user when their sessions end, and every user when announcements may be missed', async () => {
  const t = setup();
  await t.get();
  t.cache.evict('u1');
  await t.get();
  expect(t.loads).toHaveLength(2);
  t.cache.distrust();
  await t.get();
  await t.get();
  expect(t.loads).toHaveLength(4); // nothing served from memory while not trusted
  t.cache.trust();
  await t.get();
  await t.get();
  expect(t.loads).toHaveLength(5);
});

it('does not keep a load that overlapped an eviction (a read begun before a sign-out)', async () => {
  const t = setup();
  const release = t.hold();
  const pending = t.get();
  t.cache.evict('u1'); // the sign-out commits while the read is in flight
  release();
  await pending;
  expect(t.cache.size).toBe(0);
  await t.get();
  expect(t.loads).toHaveLength(2);
});

it('heard() resolves once every listening process has acknowledged the user, or after the timeout', async () => {
  const cache = createSessionUserCache(async () => null, { ttlMs: 5000, listeners: async () => 2 });
  cache.trust();
  const heard = cache.heard('u1', 10_000);
  let done = false;
  const waiting = heard().then(() => (done = true));
  await new Promise((r) => setTimeout(r, 5));
  cache.evict('u1');
  cache.acknowledged('u1', 'process-a');
  cache.acknowledged('u2', 'process-b'); // another user's
  await new Promise((r) => setTimeout(r, 5));
  expect(done).toBe(false);
  cache.acknowledged('u1', 'process-b');
  await waiting;
  expect(done).toBe(true);
  const timedOut = cache.heard('u3', 5);
  await timedOut(); // nobody acknowledges u3: returns after 5 ms
});
