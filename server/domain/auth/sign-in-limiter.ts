import {
  RateLimiterMemory,
  RateLimiterPostgres,
  type IRateLimiterOptions,
  type RateLimiterAbstract,
} from 'rate-limiter-flexible';
import type { Sequelize } from 'sequelize';
import { AppError } from '@/server/domain/app-error';

export interface SignInLimits {
  /** Failed sign-ins from one address before delays begin. */
  perAddress: number;
  /** Failed sign-ins on one account before delays begin. */
  perAccount: number;
  /** Failures are counted in windows this long (from the first failure of a window). */
  windowSeconds: number;
  /**
   * Where the counts live: PostgreSQL (table `sign_in_limits`, shared by every server
   * process) or this process's memory (tests, one-off tools).
   */
  store?: Sequelize | 'memory';
}

/** The longest wait one account can be put to: its owner is slowed, never locked out for long. */
export const ACCOUNT_MAX_DELAY_S = 60;
/** The longest wait one address can be put to (password spraying over many accounts). */
export const ADDRESS_MAX_DELAY_S = 15 * 60;

/**
 * The wait after the `failures`-th failure when `free` failures cost nothing:
 * 1 s after the first failure beyond the free ones, doubling each time, at most `maxS`.
 */
export function progressiveDelayS(failures: number, free: number, maxS: number): number {
  if (failures < free) return 0;
  return Math.min(maxS, 2 ** Math.min(30, failures - free));
}

/**
 * Progressive delays instead of a lock: each failed sign-in counts against the
 * account and against the address, separately. Past each one's free failures, the
 * next attempt must wait 1 s, then 2, 4, 8… (at most a minute for an account, a
 * quarter of an hour for an address). An attempt during a wait is refused (429,
 * Retry-After) whatever the password, so guessing stays slow; the real owner waits
 * seconds, not a quarter of an hour. A successful sign-in clears the account's count.
 */
export function createSignInLimiter(limits: SignInLimits) {
  const make = (keyPrefix: string, extra: Partial<IRateLimiterOptions> = {}): RateLimiterAbstract => {
    const options = { keyPrefix, points: 1_000_000, duration: limits.windowSeconds, ...extra };
    return !limits.store || limits.store === 'memory'
      ? new RateLimiterMemory(options)
      : new RateLimiterPostgres({
          ...options,
          storeClient: limits.store,
          storeType: 'sequelize',
          tableName: 'sign_in_limits',
          // Created by a migration: the application's role may not create tables.
          tableCreated: true,
        });
  };
  const failures = { account: make('fail-acct'), address: make('fail-addr') };
  // A "wait" is a key blocked until its delay has passed.
  const waits = { account: make('wait-acct', { points: 1 }), address: make('wait-addr', { points: 1 }) };

  const refused = (msBeforeNext: number) => {
    const seconds = Math.max(1, Math.ceil(msBeforeNext / 1000));
    const wait = seconds < 90 ? `${seconds} second${seconds === 1 ? '' : 's'}` : `${Math.ceil(seconds / 60)} minutes`;
    return AppError.tooManyRequests(`Too many sign-in attempts. Wait ${wait} and try again.`, seconds);
  };

  const waiting = async (limiter: RateLimiterAbstract, key: string) => {
    const res = await limiter.get(key);
    return res && res.consumedPoints > 1 && res.msBeforeNext > 0 ? res.msBeforeNext : 0;
  };

  const count = async (kind: 'account' | 'address', key: string, free: number, maxS: number) => {
    const res = await failures[kind].penalty(key, 1);
    const delayS = progressiveDelayS(res.consumedPoints, free, maxS);
    if (delayS > 0) await waits[kind].block(key, delayS);
  };

  return {
    /** Throws 429 (with the wait in seconds) while the account or the address must wait. */
    async admit(address: string, account: string): Promise<void> {
      const ms = Math.max(await waiting(waits.account, account), await waiting(waits.address, address));
      if (ms > 0) throw refused(ms);
    },
    async failed(address: string, account: string): Promise<void> {
      await count('account', account, limits.perAccount, ACCOUNT_MAX_DELAY_S);
      await count('address', address, limits.perAddress, ADDRESS_MAX_DELAY_S);
    },
    async succeeded(account: string): Promise<void> {
      await failures.account.delete(account);
      await waits.account.delete(account);
    },
  };
}

export type SignInLimiter = ReturnType<typeof createSignInLimiter>;
