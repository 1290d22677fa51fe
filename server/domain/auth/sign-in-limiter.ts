import { RateLimiterMemory, RateLimiterRes } from 'rate-limiter-flexible';
import { AppError } from '@/server/http/app-error';

export interface SignInLimits {
  perAddress: number;
  perAccount: number;
  windowSeconds: number;
}

/**
 * Two budgets: every attempt from an address spends one point of the address
 * budget; every failed attempt on an account spends one of the account budget.
 * A successful sign-in refunds the account budget.
 */
export function createSignInLimiter(limits: SignInLimits) {
  const byAddress = new RateLimiterMemory({ keyPrefix: 'addr', points: limits.perAddress, duration: limits.windowSeconds });
  const byAccount = new RateLimiterMemory({ keyPrefix: 'acct', points: limits.perAccount, duration: limits.windowSeconds });

  const refused = (res: RateLimiterRes) => {
    const minutes = Math.max(1, Math.ceil(res.msBeforeNext / 60_000));
    return AppError.tooManyRequests(
      `Too many sign-in attempts. Wait ${minutes} minute${minutes === 1 ? '' : 's'} and try again.`,
    );
  };

  return {
    /** Throws 429 when either budget is spent. */
    async admit(address: string, account: string): Promise<void> {
      const acct = await byAccount.get(account);
      if (acct && acct.remainingPoints <= 0) throw refused(acct);
      try {
        await byAddress.consume(address);
      } catch (res) {
        if (res instanceof RateLimiterRes) throw refused(res);
        throw res;
      }
    },
    async failed(account: string): Promise<void> {
      await byAccount.penalty(account, 1);
    },
    async succeeded(account: string): Promise<void> {
      await byAccount.delete(account);
    },
  };
}

export type SignInLimiter = ReturnType<typeof createSignInLimiter>;
