import { Router } from 'express';
import { readCaughtMail } from '@/server/domain/mail/read-caught-mail';
import type { CaughtMailClient } from '@/server/domain/ports/mailer';
import { actorOf, requireRole, requireUser } from '@/server/http/session';

/**
 * Administrators read the development mail catcher from the app. `client` is null when the
 * server runs without a catcher (CAUGHT_MAIL_URL unset), and the route then answers 404.
 */
export function caughtMailRoutes(client: CaughtMailClient | null) {
  const router = Router();
  router.use('/caught-mail', requireUser, requireRole('admin'));

  router.get('/caught-mail', async (req, res) => {
    res.json(await readCaughtMail(client, actorOf(req)));
  });

  return router;
}
