import { ConnectionAcquireTimeoutError, ConnectionError, DatabaseError, type Sequelize } from 'sequelize';
import { databaseIsUp } from '@/server/data/database';

/** SQLSTATEs of a server that is shutting down, starting up or gone (classes 57P and 08). */
const AWAY_CODES = new Set(['57P01', '57P02', '57P03', '08000', '08001', '08003', '08004', '08006']);
/** What node-postgres says when the socket under a pooled connection closes mid-query. */
const AWAY_MESSAGE = /Connection terminated|Client has encountered a connection error|not queryable|ECONNRESET|ECONNREFUSED/i;

/** True when `err` means PostgreSQL cannot be reached (not that a query was wrong, nor that the pool is busy). */
export function isDatabaseAway(err: unknown): boolean {
  if (err instanceof ConnectionAcquireTimeoutError) return false;
  if (err instanceof ConnectionError) return true;
  if (err instanceof DatabaseError) {
    const parent = err.parent as { code?: string; message?: string };
    return AWAY_CODES.has(parent.code ?? '') || AWAY_MESSAGE.test(parent.message ?? '');
  }
  return false;
}

export interface DatabaseOutage {
  /** True from the first refused request until a probe reaches the database again. */
  readonly down: boolean;
  /** Counts a request answered 503 because the database is away; logs only the first of an outage. */
  refused(err: unknown): void;
  /** Stops the recovery probe. */
  close(): void;
}

/**
 * Keeps the log quiet while PostgreSQL is away: one line when the outage is first
 * seen, one when a probe (every `probeMs`) reaches the database again, with how
 * long it lasted and how many requests were answered 503 meanwhile.
 */
export function watchDatabaseOutage(
  db: Sequelize,
  { probeMs = 1000, log = console }: { probeMs?: number; log?: Pick<Console, 'error' | 'warn'> } = {},
): DatabaseOutage {
  let since: number | null = null;
  let count = 0;
  let timer: NodeJS.Timeout | undefined;
  let probing = false;

  const probe = async () => {
    if (probing) return;
    probing = true;
    try {
      if (since !== null && (await databaseIsUp(db, Math.min(probeMs, 2000)))) {
        const seconds = ((Date.now() - since) / 1000).toFixed(1);
        log.warn(`[kenning] database reachable again after ${seconds} s; ${count} request(s) were answered 503 meanwhile`);
        since = null;
        count = 0;
        clearInterval(timer);
        timer = undefined;
      }
    } finally {
      probing = false;
    }
  };

  return {
    get down() {
      return since !== null;
    },
    refused(err) {
      count++;
      if (since !== null) return;
      since = Date.now();
      const reason = err instanceof Error ? err.message : String(err);
      log.error(`[kenning] database unavailable (${reason}); answering 503 database_unavailable until it returns`);
      timer = setInterval(() => void probe(), probeMs);
      timer.unref();
    },
    close() {
      clearInterval(timer);
      timer = undefined;
    },
  };
}
