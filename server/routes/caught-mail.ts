import { Router } from 'express';
import type { CaughtMailList } from '@/shared/schemas/mail';
import { AppError } from '@/server/domain/app-error';
import { usersRepository } from '@/server/data/repositories/users-repository';
import { actorOf, requireRole, requireUser } from '@/server/http/session';
import type { CaughtMailClient } from '@/server/mail/caught-mail-client';
import { MailError } from '@/server/mail/mailer';

/**
 * Administrators read the development mail catcher from the app. `client` is null when the
 * server runs without a catcher (CAUGHT_MAIL_URL unset), and the route then answers 404.
 */
export function caughtMailRoutes(client: CaughtMailClient | null) {
  const router = Router();
  router.use('/caught-mail', requireUser, requireRole('admin'));

  router.get('/caught-mail', async (req, res) => {
    if (!client) {
      throw new AppError(
        404,
        'mail_catcher_off',
        'No mail catcher is configured on this server, so there is no caught mail to show.',
      );
    }
    try {
      // The catcher is shared by every organisation; an admin sees only mail to their own people.
      const [messages, own] = await Promise.all([
        client.list(),
        usersRepository.emailsInOrganization(actorOf(req).organizationId),
      ]);
      const members = new Set(own.map((e) => e.toLowerCase()));
      const body: CaughtMailList = { messages: messages.filter((m) => m.to.some((to) => members.has(to.toLowerCase()))) };
      res.json(body);
    } catch (err) {
      if (err instanceof MailError) {
        throw new AppError(
          502,
          'mail_catcher_unavailable',
          'The mail catcher could not be read. Is it still running?',
          undefined,
          {
            cause: err,
          },
        );
      }
      throw err;
    }
  });

  return router;
}
