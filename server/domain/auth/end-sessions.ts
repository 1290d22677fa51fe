import type { User } from '@/shared/schemas/auth';
import { usersRepository } from '@/server/data/repositories/users-repository';

/** What a session cookie says about its session. */
export interface SessionCookie {
  userId?: string;
  nonce?: string;
  generation?: number;
}

/** How long a session cookie lives; an ended session is remembered this long. */
export const SESSION_TTL_SECONDS = 12 * 60 * 60;

/** Whether the cookie still belongs to a live session of `user` (same generation, not signed out). */
export function sessionIsLive(user: { sessionGeneration?: number; sessionEnded?: boolean }, cookie: SessionCookie) {
  return (user.sessionGeneration ?? 0) === (cookie.generation ?? 0) && !user.sessionEnded;
}

/** Signing out: this session ends on the server, so a copy of its cookie is refused from now on. */
export async function endSession(cookie: SessionCookie): Promise<void> {
  if (!cookie.userId || !cookie.nonce) return;
  await usersRepository.endSession(cookie.userId, cookie.nonce, new Date(Date.now() + SESSION_TTL_SECONDS * 1000));
}

/**
 * Signing out everywhere: every session of the cookie's user ends (their session
 * generation is bumped). A cookie that is already out of date ends nothing, so an
 * old copy cannot sign the owner out again and again.
 */
export async function endAllSessions(cookie: SessionCookie): Promise<void> {
  if (!cookie.userId) return;
  const user = await usersRepository.activeById(cookie.userId, cookie.nonce);
  if (user && sessionIsLive(user, cookie)) await usersRepository.endSessions(cookie.userId);
}

/**
 * The signed-in user a session cookie stands for, or null when the session has
 * ended (signed out, signed out everywhere, new password or role, deactivated).
 * The session middleware asks this on every request.
 */
export async function liveSessionUser(cookie: SessionCookie): Promise<User | null> {
  if (!cookie.userId) return null;
  const found = await usersRepository.activeById(cookie.userId, cookie.nonce);
  if (!found || !sessionIsLive(found, cookie)) return null;
  const { sessionGeneration: _generation, sessionEnded: _ended, ...user } = found;
  return user;
}
