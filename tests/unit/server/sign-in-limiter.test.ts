import { createSignInLimiter } from '@/server/domain/auth/sign-in-limiter';
import { AppError } from '@/server/http/app-error';

describe('createSignInLimiter', () => {
  it('locks an account after its failures and unlocks it on success', async () => {
    const limiter = createSignInLimiter({ perAddress: 100, perAccount: 2, windowSeconds: 60 });
    await limiter.admit('a', 'u@x');
    await limiter.failed('u@x');
    await limiter.admit('a', 'u@x');
    await limiter.failed('u@x');
    await expect(limiter.admit('a', 'u@x')).rejects.toMatchObject({ status: 429 });
    await limiter.succeeded('u@x');
    await expect(limiter.admit('a', 'u@x')).resolves.toBeUndefined();
  });

  it('counts every attempt from an address', async () => {
    const limiter = createSignInLimiter({ perAddress: 2, perAccount: 100, windowSeconds: 60 });
    await limiter.admit('b', 'one@x');
    await limiter.admit('b', 'two@x');
    const err = await limiter.admit('b', 'three@x').catch((e: unknown) => e);
    expect(err).toBeInstanceOf(AppError);
    expect((err as AppError).message).toMatch(/Wait 1 minute/);
    await expect(limiter.admit('c', 'three@x')).resolves.toBeUndefined();
  });
});
