import type { CaughtMailList } from '@/shared/schemas/mail';
import { usersRepository } from '@/server/data/repositories/users-repository';
import { AppError } from '@/server/domain/app-error';
import type { Actor } from '@/server/domain/actor';
import { MailError, type CaughtMailClient } from '@/server/domain/ports/mailer';

/**
 * The caught mail an administrator may read: the catcher is shared by every
 * organisation, so only mail to the caller's own people. `client` is null when
 * the server runs without a catcher (404 `mail_catcher_off`); a catcher that
 * cannot be read is a 502 `mail_catcher_unavailable`.
 */
export async function readCaughtMail(client: CaughtMailClient | null, actor: Actor): Promise<CaughtMailList> {
  if (!client) {
    throw new AppError(
      404,
      'mail_catcher_off',
      'No mail catcher is configured on this server, so there is no caught mail to show.',
    );
  }
  try {
    const [messages, own] = await Promise.all([client.list(), usersRepository.emailsInOrganization(actor.organizationId)]);
    const members = new Set(own.map((e) => e.toLowerCase()));
    return { messages: messages.filter((m) => m.to.some((to) => members.has(to.toLowerCase()))) };
  } catch (err) {
    if (err instanceof MailError) {
      throw new AppError(502, 'mail_catcher_unavailable', 'The mail catcher could not be read. Is it still running?', undefined, {
        cause: err,
      });
    }
    throw err;
  }
}
