/**
 * The device's outbox: writes made in the field (a bearing report, a drill's
 * answer) are kept on the device first and sent to the server in the order
 * they were made, each exactly once.
 *
 * "Exactly once" rests on two things: every item carries an idempotency key
 * the server remembers (a repeat of a delivered item is answered with the
 * first answer, never stored twice), and the device marks an item sent only
 * after the server's answer. An item whose answer was lost on the way back is
 * sent again and the server replays its first answer.
 *
 * Storage and sending are passed in, so the rules below are tested without a
 * browser (tests/unit/offline/outbox.test.ts); the app uses IndexedDB
 * (./device-store.ts) and the API client.
 */

/** What happened to an item so far. */
export type OutboxState = 'waiting' | 'sent' | 'refused';

export interface OutboxItem {
  /** The idempotency key, also the item's id on the device. */
  readonly key: string;
  /** What it is, for people: "Bearing 212° from Crane Knoll Tower". */
  readonly label: string;
  /** The API path it goes to, e.g. `/v1/incidents/…/reports`. */
  readonly path: string;
  readonly body: unknown;
  /** Query keys to refresh once it is delivered. */
  readonly refresh: readonly (readonly unknown[])[];
  /** When it was made on the device (ISO 8601). */
  readonly createdAt: string;
  state: OutboxState;
  attempts: number;
  /** When the server took it, or refused it (ISO 8601). */
  settledAt?: string;
  /** Why the server refused it, in its words. */
  refusal?: string;
  /** The last reason it could not be sent yet ("no network"), cleared when sent. */
  lastProblem?: string;
}

/** How an item's sending went. */
export type SendOutcome =
  | { readonly kind: 'delivered' }
  /** The server answered and will not take it (4xx): kept on the device, shown, never sent again. */
  | { readonly kind: 'refused'; readonly reason: string }
  /** No answer (no network, server away or 5xx): try again later, and keep the order. */
  | { readonly kind: 'unreachable'; readonly reason: string };

export interface OutboxStore {
  read(): Promise<OutboxItem[]>;
  /** Replaces the list in one step (one IndexedDB transaction on the device). */
  update(change: (items: OutboxItem[]) => OutboxItem[]): Promise<void>;
}

export type OutboxSender = (item: OutboxItem) => Promise<SendOutcome>;

/** Sent and refused items stay visible this long, then are dropped from the device. */
export const SETTLED_KEPT_MS = 7 * 24 * 60 * 60 * 1000;

export interface Outbox {
  /** Keeps `item` on the device (a second add with the same key changes nothing). */
  add(item: Omit<OutboxItem, 'state' | 'attempts' | 'createdAt'> & { createdAt?: string }): Promise<void>;
  /**
   * Sends the waiting items oldest first until one cannot be sent (then the
   * rest wait too, so the order holds). One send at a time on this device.
   * @returns the items delivered by this call
   */
  flush(): Promise<OutboxItem[]>;
  list(): Promise<OutboxItem[]>;
  /** Forgets everything on the device (sign-out). */
  clear(): Promise<void>;
}

export function createOutbox(store: OutboxStore, send: OutboxSender, now: () => Date = () => new Date()): Outbox {
  let running: Promise<OutboxItem[]> | null = null;

  const patch = (key: string, change: Partial<OutboxItem>) =>
    store.update((items) => items.map((i) => (i.key === key ? { ...i, ...change } : i)));

  async function drain(): Promise<OutboxItem[]> {
    const delivered: OutboxItem[] = [];
    const cutoff = now().getTime() - SETTLED_KEPT_MS;
    await store.update((items) => items.filter((i) => i.state === 'waiting' || Date.parse(i.settledAt ?? i.createdAt) >= cutoff));
    for (;;) {
      const next = (await store.read())
        .filter((i) => i.state === 'waiting')
        .sort((a, b) => a.createdAt.localeCompare(b.createdAt))[0];
      if (!next) return delivered;
      const attempts = next.attempts + 1;
      let outcome: SendOutcome;
      try {
        outcome = await send(next);
      } catch (e) {
        outcome = { kind: 'unreachable', reason: e instanceof Error ? e.message : String(e) };
      }
      const at = now().toISOString();
      if (outcome.kind === 'delivered') {
        await patch(next.key, { state: 'sent', attempts, settledAt: at, lastProblem: undefined });
        delivered.push({ ...next, state: 'sent', attempts, settledAt: at });
      } else if (outcome.kind === 'refused') {
        await patch(next.key, { state: 'refused', attempts, settledAt: at, refusal: outcome.reason });
      } else {
        await patch(next.key, { attempts, lastProblem: outcome.reason });
        return delivered;
      }
    }
  }

  return {
    async add(item) {
      const full: OutboxItem = { ...item, createdAt: item.createdAt ?? now().toISOString(), state: 'waiting', attempts: 0 };
      await store.update((items) => (items.some((i) => i.key === full.key) ? items : [...items, full]));
    },
    flush() {
      // One drain at a time: a second caller waits for the running one and then drains what is left.
      const previous = running ?? Promise.resolve([] as OutboxItem[]);
      const mine: Promise<OutboxItem[]> = previous.then(drain, drain).finally(() => {
        if (running === mine) running = null;
      });
      running = mine;
      return mine;
    },
    list: () => store.read(),
    clear: () => store.update(() => []),
  };
}

/** An outbox store in memory (tests, and a browser without IndexedDB). */
export function memoryOutboxStore(): OutboxStore {
  let items: OutboxItem[] = [];
  return {
    read: async () => items.map((i) => ({ ...i })),
    update: async (change) => {
      items = change(items.map((i) => ({ ...i })));
    },
  };
}
