import { randomBytes } from 'node:crypto';
import { Client } from 'pg';
import type { Sequelize, Transaction } from 'sequelize';

/** The PostgreSQL channel on which ended sessions are announced; the payload is the user id. */
export const SESSIONS_ENDED_CHANNEL = 'kenning_sessions_ended';

/** Each listener says here that it has forgotten a user: payload `userId listenerId`. */
export const SESSIONS_HEARD_CHANNEL = 'kenning_sessions_heard';

/** The listening connections' application_name, by which they are counted. */
const LISTENER_NAME = 'kenning-session-listener';

/**
 * Tells every API process that sessions of `userId` ended (sign-out, sign-out
 * everywhere, a new password, a role change, deactivation). NOTIFY is
 * transactional: inside `transaction` it is delivered when that commits, and
 * not at all when it rolls back.
 */
export async function announceSessionsEnded(db: Sequelize, userId: string, transaction?: Transaction): Promise<void> {
  await db.query('SELECT pg_notify(:channel, :userId)', {
    replacements: { channel: SESSIONS_ENDED_CHANNEL, userId },
    transaction,
  });
}

export interface SessionNoticeHandlers {
  /** Sessions of this user ended somewhere (this process then acknowledges it to every process). */
  onEnded(userId: string): void;
  /** A listener (maybe this one) has forgotten the user. */
  onHeard?(userId: string, listenerId: string): void;
  /** Listening (again): notices from now on arrive. Anything before may have been missed. */
  onListening(): void;
  /** The connection is gone: notices may be missed until `onListening`. */
  onLost(): void;
}

/** How often the listening connection is checked, ms (a connection can die without a word). */
const PING_EVERY_MS = 5_000;

/**
 * Keeps one connection LISTENing on {@link SESSIONS_ENDED_CHANNEL}, reconnecting
 * after 0.5 s, then 1, 2 … up to 30 s while PostgreSQL is away.
 *
 * @example
 * const listener = listenForEndedSessions(url, { onEnded: evict, onListening: trust, onLost: distrust });
 * await listener.ready; // first LISTEN done (or failed: it keeps trying)
 */
export function listenForEndedSessions(databaseUrl: string, handlers: SessionNoticeHandlers) {
  let client: Client | null = null;
  let stopped = false;
  let delayMs = 500;
  let retry: NodeJS.Timeout | undefined;
  let ping: NodeJS.Timeout | undefined;
  let resolveReady: () => void = () => {};
  const ready = new Promise<void>((resolve) => {
    resolveReady = resolve;
  });

  const lost = (c: Client) => {
    if (client !== c) return; // an older connection, already replaced
    client = null;
    clearInterval(ping);
    handlers.onLost();
    c.end().catch(() => {});
    if (!stopped) retry = setTimeout(() => void connect(), delayMs);
    delayMs = Math.min(delayMs * 2, 30_000);
  };

  const listenerId = randomBytes(6).toString('hex');
  const connect = async () => {
    const c = new Client({ connectionString: databaseUrl, keepAlive: true, application_name: LISTENER_NAME });
    client = c;
    c.on('error', () => lost(c));
    c.on('end', () => lost(c));
    c.on('notification', (n) => {
      if (!n.payload) return;
      if (n.channel === SESSIONS_ENDED_CHANNEL) {
        handlers.onEnded(n.payload);
        c.query('SELECT pg_notify($1, $2)', [SESSIONS_HEARD_CHANNEL, `${n.payload} ${listenerId}`]).catch(() => lost(c));
      } else if (n.channel === SESSIONS_HEARD_CHANNEL) {
        const [userId, by] = n.payload.split(' ');
        if (userId && by) handlers.onHeard?.(userId, by);
      }
    });
    try {
      await c.connect();
      await c.query(`LISTEN ${SESSIONS_ENDED_CHANNEL}; LISTEN ${SESSIONS_HEARD_CHANNEL}`);
    } catch {
      lost(c);
      resolveReady();
      return;
    }
    if (stopped || client !== c) {
      await c.end().catch(() => {});
      return;
    }
    delayMs = 500;
    handlers.onListening();
    resolveReady();
    ping = setInterval(() => {
      c.query('SELECT 1').catch(() => lost(c));
    }, PING_EVERY_MS);
    ping.unref();
  };
  void connect();

  return {
    ready,
    /** How many processes listen on this database now (this one included). */
    async listeners(): Promise<number> {
      const c = client;
      if (!c) return 1;
      const { rows } = await c.query<{ n: number }>(
        'SELECT count(*)::int AS n FROM pg_stat_activity WHERE application_name = $1 AND datname = current_database()',
        [LISTENER_NAME],
      );
      return rows[0]?.n ?? 1;
    },
    async stop() {
      stopped = true;
      clearTimeout(retry);
      clearInterval(ping);
      const c = client;
      client = null;
      if (c) await c.end().catch(() => {});
    },
  };
}
