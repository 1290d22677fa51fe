import { ACCOUNT_MAX_DELAY_S, createSignInLimiter, progressiveDelayS } from '@/server/domain/auth/sign-in-limiter';
import { AppError } from '@/server/domain/app-error';

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

describe('progressiveDelayS', () => {
  // Doubling back-off: common practice, no source.
  it('is free up to the free failures, then 1, 2, 4, 8 … seconds, capped', () => {
    expect([0, 1, 2].map((f) => progressiveDelayS(f, 3, 60))).toEqual([0, 0, 0]);
    expect([3, 4, 5, 6].map((f) => progressiveDelayS(f, 3, 60))).toEqual([1, 2, 4, 8]);
    expect(progressiveDelayS(50, 3, 60)).toBe(60);
    expect(progressiveDelayS(5000, 3, ACCOUNT_MAX_DELAY_S)).toBe(ACCOUNT_MAX_DELAY_S);
  });
});

describe('createSignInLimiter (in memory)', () => {
  it('slows an account after its free failures instead of locking it, and forgets on success', async () => {
    const limiter = createSignInLimiter({ perAddress: 100, perAccount: 2, windowSeconds: 60 });
    await limiter.admit('a', 'u@x');
    await limiter.failed('a', 'u@x');
    await limiter.admit('a', 'u@x');
    await limiter.failed('a', 'u@x');
    const err = await limiter.admit('a', 'u@x').catch((e: unknown) => e);
    expect(err).toBeInstanceOf(AppError);
    expect(err).toMatchObject({ status: 429, retryAfterS: 1 });
    expect((err as AppError).message).toMatch(/Wait 1 second\b/);
    // The wait is short: a second later the owner may try again.
    await sleep(1100);
    await expect(limiter.admit('a', 'u@x')).resolves.toBeUndefined();
    await limiter.succeeded('u@x');
    await limiter.failed('a', 'u@x');
    await expect(limiter.admit('a', 'u@x')).resolves.toBeUndefined();
  });

  it('doubles the wait with each further failure', async () => {
    const limiter = createSignInLimiter({ perAddress: 100, perAccount: 1, windowSeconds: 60 });
    await limiter.failed('a', 'v@x'); // 1 s
    await limiter.failed('a', 'v@x'); // 2 s
    await limiter.failed('a', 'v@x'); // 4 s
    const err = (await limiter.admit('b', 'v@x').catch((e: unknown) => e)) as AppError;
    expect(err.retryAfterS).toBe(4);
  });

  it('counts failures per address across accounts, separately from each account', async () => {
    const limiter = createSignInLimiter({ perAddress: 2, perAccount: 100, windowSeconds: 60 });
    await limiter.failed('b', 'one@x');
    await limiter.failed('b', 'two@x');
    await expect(limiter.admit('b', 'three@x')).rejects.toMatchObject({ status: 429 });
    // Another address, and the same accounts from it, are not slowed.
    await expect(limiter.admit('c', 'one@x')).resolves.toBeUndefined();
  });
});
