import type { NextFunction, Request, Response } from 'express';
import { getIronSession, type IronSession } from 'iron-session';
import type { Role, User } from '@/shared/schemas/auth';
import type { Actor } from '@/server/domain/actor';
import { liveSessionUser, SESSION_TTL_SECONDS, type SessionUser } from '@/server/domain/auth/end-sessions';
import { AppError } from '@/server/domain/app-error';
import type { SessionUserCache } from './session-user-cache';

export type { SessionUser } from '@/server/domain/auth/end-sessions';
export { loadSessionUser } from '@/server/domain/auth/end-sessions';

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
    /** This app's cache of signed-in users, when it keeps one. */
    sessionUsers?: SessionUserCache<SessionUser>;
  }
}

/**
 * Attaches the sealed-cookie session; the cookie is Secure whenever the request came over https.
 * With `sessionUsers`, requireUser reads signed-in users through that cache.
 */
export function sessionMiddleware(password: string, sessionUsers?: SessionUserCache<SessionUser> | null) {
  const unsealed = unsealedCookies();
  return async (req: Request, res: Response, next: NextFunction) => {
    if (sessionUsers) req.sessionUsers = sessionUsers;
    const options = {
      password,
      cookieName: SESSION_COOKIE,
      ttl: SESSION_TTL_SECONDS,
      cookieOptions: { httpOnly: true, sameSite: 'lax' as const, secure: req.secure, path: '/' },
    };
    const seal = sealOf(req.headers.cookie);
    const known = seal ? unsealed.get(seal) : undefined;
    if (known) {
      // Unsealed before: a session without the cookie (no crypto), then its fields. save()/destroy() work as usual.
      req.session = await getIronSession<SessionData>({ headers: {} } as Request, res, options);
      Object.assign(req.session, known);
    } else {
      req.session = await getIronSession<SessionData>(req, res, options);
      if (seal && req.session.userId) unsealed.set(seal, { ...req.session });
    }
    next();
  };
}

/** The sealed value of the session cookie in a Cookie header, if any. */
function sealOf(header: string | undefined): string | undefined {
  if (!header) return undefined;
  for (const part of header.split(';')) {
    const eq = part.indexOf('=');
    if (eq > 0 && part.slice(0, eq).trim() === SESSION_COOKIE) return part.slice(eq + 1).trim() || undefined;
  }
  return undefined;
}

/**
 * Cookies this process has unsealed, by their sealed value, until the seal's own
 * expiry: unsealing (PBKDF2 key derivation, AES, HMAC through WebCrypto) was the
 * largest cost of a signed-in request that needs no database. The sealed value is
 * authenticated when first unsealed, and the same value always unseals to the same
 * fields, so keeping the answer changes nothing else (whether the session is still
 * live is requireUser's question, asked every request).
 */
function unsealedCookies(maxEntries = 20_000) {
  const entries = new Map<string, { data: SessionData; expiresAtMs: number }>();
  return {
    get(seal: string): SessionData | undefined {
      const hit = entries.get(seal);
      if (!hit) return undefined;
      if (hit.expiresAtMs > Date.now()) return hit.data;
      entries.delete(seal);
      return undefined;
    },
    set(seal: string, data: SessionData) {
      // Iron's seal: Fe26.2*id*salt*iv*ciphertext*expiration(ms)*hmacSalt*hmac, then ~version.
      const expiresAtMs = Number(seal.split('*')[5]);
      if (!Number.isFinite(expiresAtMs) || expiresAtMs <= Date.now()) return;
      if (entries.size >= maxEntries) entries.delete(entries.keys().next().value!);
      entries.set(seal, { data, expiresAtMs });
    },
  };
}

/** Requires a signed-in, active user; loads the current role from the database. */
export async function requireUser(req: Request, _res: Response, next: NextFunction) {
  const userId = req.session.userId;
  if (!userId) throw AppError.unauthenticated();
  const user = await liveSessionUser(req.session, req.sessionUsers);
  // Signed out, or signed out everywhere / new password / new role / deactivated since this cookie was issued.
  if (!user) {
    req.session.destroy();
    throw AppError.unauthenticated('Your session has ended. Sign in again.');
  }
  req.user = user;
  req.actor = { userId: user.id, organizationId: user.organization.id, role: user.role };
  next();
}

/**
 * Runs `end` (a write that ends sessions of `userId`) and, when this app keeps a
 * session-user cache, waits (at most 0.5 s) until every process listening on the
 * database has acknowledged the announcement: by the time the answer leaves, a
 * copied cookie meets evicted caches everywhere.
 */
export async function endingSessionsOf<T>(req: Request, userId: string | undefined, end: () => Promise<T>): Promise<T> {
  const heard = userId && req.sessionUsers ? req.sessionUsers.heard(userId) : null;
  const result = await end();
  await heard?.();
  return result;
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
