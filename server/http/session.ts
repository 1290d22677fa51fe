import type { NextFunction, Request, Response } from 'express';
import { getIronSession, type IronSession } from 'iron-session';
import type { Role, User } from '@/shared/schemas/auth';
import { usersRepository } from '@/server/data/repositories/users-repository';
import type { Actor } from '@/server/domain/actor';
import { SESSION_TTL_SECONDS, sessionIsLive } from '@/server/domain/auth/end-sessions';
import { AppError } from '@/server/domain/app-error';

export interface SessionData {
  userId?: string;
  /** Random per sign-in, so every sign-in issues a new cookie value. */
  nonce?: string;
  /** The user's session generation at sign-in; a later bump ends this session. */
  generation?: number;
}

export const SESSION_COOKIE = 'kenning_session';

declare module 'express-serve-static-core' {
  interface Request {
    session: IronSession<SessionData>;
    actor?: Actor;
    /** The signed-in user as loaded by requireUser. */
    user?: User;
  }
}

/** Attaches the sealed-cookie session; the cookie is Secure whenever the request came over https. */
export function sessionMiddleware(password: string) {
  return async (req: Request, res: Response, next: NextFunction) => {
    req.session = await getIronSession<SessionData>(req, res, {
      password,
      cookieName: SESSION_COOKIE,
      ttl: SESSION_TTL_SECONDS,
      cookieOptions: { httpOnly: true, sameSite: 'lax', secure: req.secure, path: '/' },
    });
    next();
  };
}

/** Requires a signed-in, active user; loads the current role from the database. */
export async function requireUser(req: Request, _res: Response, next: NextFunction) {
  const userId = req.session.userId;
  if (!userId) throw AppError.unauthenticated();
  const found = await usersRepository.activeById(userId, req.session.nonce);
  // Signed out, or signed out everywhere / new password / new role / deactivated since this cookie was issued.
  if (!found || !sessionIsLive(found, req.session)) {
    req.session.destroy();
    throw AppError.unauthenticated('Your session has ended. Sign in again.');
  }
  const { sessionGeneration: _generation, sessionEnded: _ended, ...user } = found;
  req.user = user;
  req.actor = { userId: user.id, organizationId: user.organization.id, role: user.role };
  next();
}

/** Requires one of `roles`; use after requireUser. */
export function requireRole(...roles: Role[]) {
  return (req: Request, _res: Response, next: NextFunction) => {
    if (!req.actor || !roles.includes(req.actor.role)) throw AppError.forbidden();
    next();
  };
}

/** The actor of a request that passed requireUser. */
export function actorOf(req: Request): Actor {
  if (!req.actor) throw AppError.unauthenticated();
  return req.actor;
}
