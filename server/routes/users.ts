import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { z } from 'zod';
import { InviteUserRequestSchema, UpdateUserRequestSchema } from '@/shared/schemas/auth';
import { inviteUser, listUsers, updateUser } from '@/server/domain/users/manage-users';
import { actorOf, requireRole, requireUser } from '@/server/http/session';
import { parseOrThrow } from '@/server/http/validate';

const IdParam = z.object({ userId: z.uuid({ error: 'Not a user id.' }) });

/** The administrator's user management, scoped to the admin's organisation. */
export function userRoutes(db: Sequelize, publicUrl: (req: import('express').Request) => string) {
  const router = Router();
  router.use('/users', requireUser, requireRole('admin'));

  router.get('/users', async (req, res) => {
    res.json({ users: await listUsers(actorOf(req)) });
  });

  router.post('/users', async (req, res) => {
    const input = parseOrThrow(InviteUserRequestSchema, req.body, 'invitation');
    const { user, token } = await inviteUser(db, actorOf(req), input);
    res.status(201).json({ user, setPasswordUrl: `${publicUrl(req)}/set-password?token=${token}` });
  });

  router.patch('/users/:userId', async (req, res) => {
    const { userId } = parseOrThrow(IdParam, req.params, 'address');
    const input = parseOrThrow(UpdateUserRequestSchema, req.body, 'change');
    res.json({ user: await updateUser(db, actorOf(req), userId, input) });
  });

  return router;
}
