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
/** A user as a session check loads it: the account plus what decides whether a cookie is still live. */
export type SessionUser = NonNullable<Awaited<ReturnType<typeof usersRepository.activeById>>>;

/** Loads a cookie's user from the database (also the loader of the HTTP layer's session-user cache). */
export const loadSessionUser = (userId: string, nonce: string | undefined): Promise<SessionUser | null> =>
  usersRepository.activeById(userId, nonce);

/** Somewhere recently loaded session users are remembered for a few seconds (one per process). */
export interface SessionUserSource {
  get(userId: string, nonce: string | undefined, keep: (user: SessionUser) => boolean): Promise<SessionUser | null>;
}

/**
 * The cookie's user when the cookie is still live: signed in, not signed out (here or everywhere), no new
 * password or role since, still active. `recent` answers from its short memory when it can.
 */
export async function liveSessionUser(cookie: SessionCookie, recent?: SessionUserSource | null): Promise<User | null> {
  const { userId } = cookie;
  if (!userId) return null;
  const found = recent
    ? await recent.get(userId, cookie.nonce, (u) => sessionIsLive(u, cookie))
    : await loadSessionUser(userId, cookie.nonce);
  if (!found || !sessionIsLive(found, cookie)) return null;
  const { sessionGeneration: _generation, sessionEnded: _ended, ...user } = found;
  return user;
}
