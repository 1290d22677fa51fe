import type { NextFunction, Request, Response } from 'express';
import { getIronSession, type IronSession } from 'iron-session';
import type { Role, User } from '@/shared/schemas/auth';
import type { Actor } from '@/server/domain/actor';
import { liveSessionUser, SESSION_TTL_SECONDS } from '@/server/domain/auth/end-sessions';
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
  const user = await liveSessionUser(req.session);
  // Signed out, or signed out everywhere / new password / new role / deactivated since this cookie was issued.
  if (!user) {
    req.session.destroy();
    throw AppError.unauthenticated('Your session has ended. Sign in again.');
  }
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
