import { createStore, get, update, type UseStore } from 'idb-keyval';
import { api, ApiRequestError } from '@/components/data/api-client';
import { OUTBOX_DB, OUTBOX_ITEMS, OUTBOX_STORE, onDeviceCopiesForgotten } from './persisted-cache';
import { createOutbox, memoryOutboxStore, type OutboxItem, type OutboxStore, type SendOutcome } from './outbox';

/** The outbox's own IndexedDB database (idb-keyval keeps one object store per database). */
const DB_NAME = OUTBOX_DB;
const ITEMS = OUTBOX_ITEMS;

function deviceStore(): OutboxStore {
  if (typeof indexedDB === 'undefined') return memoryOutboxStore();
  let idb: UseStore | null = null;
  const store = () => (idb ??= createStore(DB_NAME, OUTBOX_STORE));
  return {
    read: async () => (await get<OutboxItem[]>(ITEMS, store())) ?? [],
    update: (change) => update<OutboxItem[]>(ITEMS, (old) => change(old ?? []), store()),
  };
}

/** 408 and 429 say "later", not "never". */
const TRY_AGAIN = new Set([408, 429]);

/** Sends one item through the API client; a 4xx is final, no answer or a 5xx is tried again later. */
async function sendItem(item: OutboxItem): Promise<SendOutcome> {
  try {
    await api.post(item.path, item.body, null);
    return { kind: 'delivered' };
  } catch (e) {
    if (e instanceof ApiRequestError && e.status < 500 && !TRY_AGAIN.has(e.status)) return { kind: 'refused', reason: e.message };
    return { kind: 'unreachable', reason: e instanceof Error ? e.message : String(e) };
  }
}

type Listener = () => void;
const listeners = new Set<Listener>();
const changed = () => listeners.forEach((l) => l());

const outbox = createOutbox(deviceStore(), sendItem);

/** The device's outbox (one per browser profile); every change is announced to {@link onOutboxChange} listeners. */
export const deviceOutbox = {
  async add(item: Parameters<typeof outbox.add>[0]) {
    await outbox.add(item);
    changed();
  },
  async flush() {
    try {
      return await outbox.flush();
    } finally {
      changed();
    }
  },
  list: () => outbox.list(),
  async clear() {
    await outbox.clear();
    changed();
  },
};

// A sign-out clears the stored list without loading this module; when it is loaded, what it shows follows.
onDeviceCopiesForgotten(changed);

export function onOutboxChange(listener: Listener): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}
