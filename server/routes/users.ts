import { PageQuerySchema } from '@/shared/schemas/list';
import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { z } from 'zod';
import { InviteUserRequestSchema, UpdateUserRequestSchema } from '@/shared/schemas/auth';
import { inviteUser, listUsers, updateUser } from '@/server/domain/users/manage-users';
import { actorOf, endingSessionsOf, requireRole, requireUser } from '@/server/http/session';
import { parseOrThrow } from '@/server/http/validate';
import type { Mailer } from '@/server/domain/ports/mailer';
import { invitation } from '@/server/mail/templates';

const IdParam = z.object({ userId: z.uuid({ error: 'Not a user id.' }) });

/** The administrator's user management, scoped to the admin's organisation. */
export function userRoutes(db: Sequelize, publicUrl: () => string, mailer: Mailer | null) {
  const router = Router();
  router.use('/users', requireUser, requireRole('admin'));

  router.get('/users', async (req, res) => {
    const { page, pageSize } = parseOrThrow(PageQuerySchema, req.query, 'query');
    res.json(await listUsers(actorOf(req), page, pageSize));
  });

  router.post('/users', async (req, res) => {
    const input = parseOrThrow(InviteUserRequestSchema, req.body, 'invitation');
    const { user, token } = await inviteUser({ db }, actorOf(req), input);
    const setPasswordUrl = `${publicUrl()}/set-password?token=${token}`;
    // Sent after the account is committed; a mail failure still leaves the link for the admin to pass on.
    let mailed = false;
    if (mailer && req.user) {
      try {
        const message = invitation({
          name: user.name,
          organizationName: req.user.organization.name,
          setPasswordUrl,
          invitedBy: req.user.name,
        });
        await mailer.send({ to: [user.email], ...message });
        mailed = true;
      } catch (e) {
        console.error('[kenning] invitation mail failed:', e);
      }
    }
    res.status(201).json({ user, setPasswordUrl, mailed });
  });

  router.patch('/users/:userId', async (req, res) => {
    const { userId } = parseOrThrow(IdParam, req.params, 'address');
    const input = parseOrThrow(UpdateUserRequestSchema, req.body, 'change');
    // A new role or (de)activation ends the person's sessions: answer once every process has forgotten them.
    const endsSessions = input.role !== undefined || input.active !== undefined;
    const change = () => updateUser({ db }, actorOf(req), userId, input);
    res.json({ user: await (endsSessions ? endingSessionsOf(req, userId, change) : change()) });
  });

  return router;
}
