import type { SignInRequest, User } from '@/shared/schemas/auth';
import { usersRepository } from '@/server/data/repositories/users-repository';
import { AppError } from '@/server/domain/app-error';
import { verifyPassword } from './passwords';
import type { SignInLimiter } from './sign-in-limiter';

const WRONG = 'The e-mail address or password is not right.';

/**
 * Checks the credentials within the attempt budgets. The same 401 message
 * answers an unknown e-mail, a wrong password and a deactivated account.
 */
export async function signIn(
  input: SignInRequest,
  address: string,
  limiter: SignInLimiter,
): Promise<{ user: User; sessionGeneration: number }> {
  await limiter.admit(address, input.email);
  const found = await usersRepository.credentialsByEmail(input.email);
  const ok = await verifyPassword(input.password, found?.passwordHash ?? null);
  if (!found || !ok || !found.active) {
    await limiter.failed(address, input.email);
    throw new AppError(401, 'wrong_credentials', WRONG);
  }
  await limiter.succeeded(input.email);
  await usersRepository.recordSignIn(found.user.id, new Date());
  return { user: found.user, sessionGeneration: found.sessionGeneration };
}
