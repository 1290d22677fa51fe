import { listenForEndedSessions } from '@/server/data/session-notices';

/** What requireUser needs to know about a cookie's user (see usersRepository.activeById). */
export type SessionUserLoader<U> = (userId: string, nonce: string | undefined) => Promise<U | null>;

/**
 * Keeps the users that signed-in requests loaded, per (user, session nonce), for
 * `ttlMs` in this process, so a busy client does not cost a database round trip
 * per request. Correct only while `trusted`: the owner evicts a user as soon as
 * PostgreSQL announces that sessions of theirs ended (`evict`), and calls
 * `distrust` when it may miss announcements (nothing is served from memory until
 * `trust`). A load that overlapped any eviction is not kept, so a read that began
 * before a sign-out cannot put the old answer back.
 */
export function createSessionUserCache<U>(
  load: SessionUserLoader<U>,
  {
    ttlMs,
    maxUsers = 10_000,
    now = Date.now,
    listeners = async () => 1,
  }: { ttlMs: number; maxUsers?: number; now?: () => number; listeners?: () => Promise<number> },
) {
  const byUser = new Map<string, Map<string, { user: U; until: number }>>();
  let trusted = false;
  /** Bumped by every eviction: a load that saw it change is not kept. */
  let epoch = 0;
  /** Sign-outs waiting for every process to say it has forgotten the user. */
  const waiters = new Map<string, Set<{ heardBy: Set<string>; check: () => void }>>();

  const cache = {
    /** The user for this cookie: from memory when fresh, else loaded (and kept when live). */
    async get(userId: string, nonce: string | undefined, keep: (user: U) => boolean): Promise<U | null> {
      const key = nonce ?? '';
      if (trusted && ttlMs > 0) {
        const sessions = byUser.get(userId);
        const hit = sessions?.get(key);
        if (hit && hit.until > now()) return hit.user;
        if (hit) sessions!.delete(key);
      }
      const started = epoch;
      const user = await load(userId, nonce);
      if (user && trusted && ttlMs > 0 && started === epoch && keep(user)) {
        if (!byUser.has(userId) && byUser.size >= maxUsers) byUser.delete(byUser.keys().next().value!);
        let sessions = byUser.get(userId);
        if (!sessions) byUser.set(userId, (sessions = new Map()));
        sessions.set(key, { user, until: now() + ttlMs });
      }
      return user;
    },
    /** Sessions of `userId` ended somewhere: forget them here. */
    evict(userId: string) {
      epoch++;
      byUser.delete(userId);
    },
    /** The process listening as `listenerId` has forgotten `userId`. */
    acknowledged(userId: string, listenerId: string) {
      for (const w of waiters.get(userId) ?? []) {
        w.heardBy.add(listenerId);
        w.check();
      }
    },
    /** Announcements may be missed from now on: forget everything and stop keeping users. */
    distrust() {
      epoch++;
      trusted = false;
      byUser.clear();
    },
    /** Announcements arrive (again). */
    trust() {
      epoch++;
      byUser.clear();
      trusted = true;
    },
    /**
     * Resolves when every process listening on the database has said it forgot
     * `userId` (or after `timeoutMs`). Call before the write that announces it,
     * await after it has committed.
     */
    heard(userId: string, timeoutMs = 500): () => Promise<void> {
      if (!trusted) return () => Promise.resolve();
      let needed = Infinity;
      let resolve: () => void = () => {};
      const done = new Promise<void>((r) => {
        resolve = r;
      });
      const waiter = { heardBy: new Set<string>(), check: () => waiter.heardBy.size >= needed && resolve() };
      let set = waiters.get(userId);
      if (!set) waiters.set(userId, (set = new Set()));
      set.add(waiter);
      return async () => {
        const timer = setTimeout(resolve, timeoutMs);
        try {
          needed = await listeners().catch(() => 1);
          waiter.check();
          await done;
        } finally {
          clearTimeout(timer);
          set.delete(waiter);
          if (!set.size && waiters.get(userId) === set) waiters.delete(userId);
        }
      };
    },
    get size() {
      let n = 0;
      for (const sessions of byUser.values()) n += sessions.size;
      return n;
    },
  };
  return cache;
}

export type SessionUserCache<U> = ReturnType<typeof createSessionUserCache<U>>;

/**
 * A session-user cache fed by PostgreSQL's LISTEN/NOTIFY: one connection per
 * process listens for ended sessions. Trusted only while that connection is up.
 */
export function startSessionUserCache<U>(databaseUrl: string, load: SessionUserLoader<U>, ttlSeconds: number) {
  let listener: ReturnType<typeof listenForEndedSessions> | null = null;
  const cache = createSessionUserCache(load, {
    ttlMs: ttlSeconds * 1000,
    listeners: () => listener?.listeners() ?? Promise.resolve(1),
  });
  listener =
    ttlSeconds > 0
      ? listenForEndedSessions(databaseUrl, {
          onEnded: (userId) => cache.evict(userId),
          onHeard: (userId, listenerId) => cache.acknowledged(userId, listenerId),
          onListening: () => cache.trust(),
          onLost: () => cache.distrust(),
        })
      : null;
  return {
    cache,
    /** The first LISTEN is done (or failed and is being retried). */
    ready: listener?.ready ?? Promise.resolve(),
    stop: async () => {
      cache.distrust();
      await listener?.stop();
    },
  };
}
