import { randomBytes } from 'node:crypto';
import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { MeUpdateSchema, SetPasswordRequestSchema, SignInRequestSchema } from '@/shared/schemas/auth';
import { endAllSessions, endSession } from '@/server/domain/auth/end-sessions';
import { signIn } from '@/server/domain/auth/sign-in';
import type { SignInLimiter } from '@/server/domain/auth/sign-in-limiter';
import { setPasswordWithToken, updateOwnSettings } from '@/server/domain/users/manage-users';
import { actorOf, endingSessionsOf, requireUser } from '@/server/http/session';
import { parseOrThrow } from '@/server/http/validate';

export function authRoutes(db: Sequelize, limiter: SignInLimiter) {
  const router = Router();

  router.post('/auth/sign-in', async (req, res) => {
    const input = parseOrThrow(SignInRequestSchema, req.body, 'sign-in form');
    const { user, sessionGeneration } = await signIn(input, req.ip ?? 'unknown', limiter);
    // A fresh session on every sign-in: new nonce, newly sealed cookie value.
    req.session.userId = user.id;
    req.session.nonce = randomBytes(12).toString('base64url');
    req.session.generation = sessionGeneration;
    await req.session.save();
    res.json({ user });
  });

  // Both end sessions on the server: a copy of the cookie is refused afterwards, not only forgotten here.
  router.post('/auth/sign-out', async (req, res) => {
    await endingSessionsOf(req, req.session.userId, () => endSession(req.session));
    req.session.destroy();
    res.status(204).end();
  });

  router.post('/auth/sign-out-everywhere', requireUser, async (req, res) => {
    await endingSessionsOf(req, req.session.userId, () => endAllSessions(req.session));
    req.session.destroy();
    res.status(204).end();
  });

  router.post('/auth/set-password', async (req, res) => {
    const input = parseOrThrow(SetPasswordRequestSchema, req.body, 'password form');
    await setPasswordWithToken({ db }, input.token, input.password);
    res.status(204).end();
  });

  router.get('/me', requireUser, (req, res) => {
    res.json({ user: req.user });
  });

  /** The person's own settings: `{ unitPreference: 'metric' | 'nautical' | 'imperial' | null }`. */
  router.patch('/me', requireUser, async (req, res) => {
    const input = parseOrThrow(MeUpdateSchema, req.body, 'account settings');
    // Answer once every process has dropped its cached copy, so the next request anywhere sees the change.
    const user = await endingSessionsOf(req, req.user!.id, () => updateOwnSettings({ db }, actorOf(req), req.user!, input));
    res.json({ user });
  });

  return router;
}
