import { defaultShouldDehydrateQuery, type Query } from '@tanstack/react-query';
import type { PersistedClient, Persister, PersistQueryClientOptions } from '@tanstack/react-query-persist-client';
import { createStore, del, get, set, type UseStore } from 'idb-keyval';

/**
 * The query cache kept on the device, so what a person last saw (the
 * briefing, their posts, crew cards, the libraries) opens on a cold start with
 * no network. IndexedDB, in a database of its own; cleared at sign-out.
 */
const DB_NAME = 'kenning-cache';
const KEY = 'queries';

/** What the device keeps is kept this long after it was fetched. */
export const DEVICE_COPY_MAX_AGE_MS = 7 * 24 * 60 * 60 * 1000;

let idb: UseStore | null = null;
const store = () => (idb ??= createStore(DB_NAME, 'cache'));

/** Whether this runtime can keep copies (a browser with IndexedDB; not the tests' jsdom, not native yet). */
export const deviceCanKeepCopies = () => typeof indexedDB !== 'undefined' && typeof window !== 'undefined';

/**
 * The build's own id: the content hash in the entry script's name. Copies made
 * by another build are dropped, so a new build never reads old shapes.
 */
function buildId(): string {
  if (typeof document === 'undefined') return 'unknown';
  const src = Array.from(document.scripts, (s) => s.src).find((s) => /\/entry-[0-9a-f]+\.js/.test(s));
  return src ? /\/entry-([0-9a-f]+)\.js/.exec(src)![1]! : 'development';
}

/** Queries that are never kept (answers that change by the second, or that are only meaningful online). */
const notKept = (query: Query) => query.meta?.keepOnDevice === false;

export function persistOptions(): Omit<PersistQueryClientOptions, 'queryClient'> {
  return {
    persister: { ...idbPersister(), restoreClient: () => restoreOnlyUnreachable(readCopy) },
    maxAge: DEVICE_COPY_MAX_AGE_MS,
    buster: buildId(),
    dehydrateOptions: { shouldDehydrateQuery: (q) => defaultShouldDehydrateQuery(q) && !notKept(q) },
  };
}

/** Writes at most once a second: the cache changes in bursts (a page's queries arrive together). */
const WRITE_EVERY_MS = 1000;

/**
 * The persister over IndexedDB that TanStack Query's documentation describes
 * ("building a persister" with idb-keyval), the last state of a burst written once.
 */
function idbPersister(): Persister {
  let pending: PersistedClient | null = null;
  let timer: ReturnType<typeof setTimeout> | null = null;
  const write = () => {
    if (timer) clearTimeout(timer);
    timer = null;
    const latest = pending;
    pending = null;
    // As JSON, like TanStack's storage persisters: anything a structured clone would refuse is simply left out.
    if (latest) void set(KEY, JSON.stringify(latest), store()).catch(() => undefined);
  };
  // A phone closes apps without warning: what is waiting is written when the page is hidden.
  if (typeof document !== 'undefined') {
    document.addEventListener('visibilitychange', () => {
      if (document.visibilityState === 'hidden') write();
    });
  }
  return {
    persistClient(client) {
      pending = client;
      timer ??= setTimeout(write, WRITE_EVERY_MS);
    },
    restoreClient: readCopy,
    removeClient: () => del(KEY, store()),
  };
}

/** The device's copy, or undefined when there is none (or it cannot be read). */
async function readCopy(): Promise<PersistedClient | undefined> {
  const text = await get<string>(KEY, store());
  if (typeof text !== 'string') return undefined;
  try {
    return JSON.parse(text) as PersistedClient;
  } catch {
    return undefined;
  }
}

/** How long the start waits for the server before it opens the device's copy instead. */
const REACH_TIMEOUT_MS = 3000;

/** Whether the server answers now (a phone can show signal and still have no data). */
async function serverReachable(): Promise<boolean> {
  if (typeof navigator !== 'undefined' && navigator.onLine === false) return false;
  const abort = new AbortController();
  const timer = setTimeout(() => abort.abort(), REACH_TIMEOUT_MS);
  try {
    await fetch('/api/health', { cache: 'no-store', signal: abort.signal });
    return true; // any answer, even 503 (database away), means the server itself is there
  } catch {
    return false;
  } finally {
    clearTimeout(timer);
  }
}

/**
 * The device's copy is opened only when the server cannot be reached: online,
 * the app starts from fresh answers, so a reload never shows figures older
 * than the server's (the copy is still written as new answers come in).
 */
async function restoreOnlyUnreachable<T>(restore: () => PromiseLike<T | undefined> | T | undefined): Promise<T | undefined> {
  return (await serverReachable()) ? undefined : restore();
}

/**
 * Deletes the device's copies of the person's data (sign-out): the kept query
 * cache and the outbox (./device-outbox.ts keeps its list under `items` in
 * `kenning-outbox`; cleared here directly, so sign-out does not load the outbox).
 */
export async function forgetDeviceCopies(): Promise<void> {
  if (!deviceCanKeepCopies()) return;
  await Promise.all([del(KEY, store()), del(OUTBOX_ITEMS, createStore(OUTBOX_DB, OUTBOX_STORE))]);
  outboxCleared?.();
}

/** The outbox's IndexedDB place (see ./device-outbox.ts). */
export const OUTBOX_DB = 'kenning-outbox';
export const OUTBOX_STORE = 'outbox';
export const OUTBOX_ITEMS = 'items';

let outboxCleared: (() => void) | null = null;
/** The loaded outbox hears of a sign-out's clearing (to refresh what it shows). */
export function onDeviceCopiesForgotten(listener: () => void) {
  outboxCleared = listener;
}
