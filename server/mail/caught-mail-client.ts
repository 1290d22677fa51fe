import { CaughtMailListSchema } from '@/shared/schemas/mail';
import { MailError, type CaughtMailClient } from '@/server/domain/ports/mailer';
export type { CaughtMailClient } from '@/server/domain/ports/mailer';

const TIMEOUT_MS = 5_000;

/**
 * Talks to the mail catcher's HTTP API (`server/scripts/mail-catcher.ts`). Throws `MailError`
 * with code `catcher_failed` when the catcher is down, answers non-2xx or sends a body that
 * does not match `CaughtMailListSchema`.
 *
 * @example
 * const mail = await createCaughtMailClient('http://127.0.0.1:40124').list();
 */
export function createCaughtMailClient(baseUrl: string): CaughtMailClient {
  const endpoint = new URL('/messages', baseUrl).href;

  async function call(method: 'GET' | 'DELETE'): Promise<Response> {
    let res: Response;
    try {
      res = await fetch(endpoint, { method, signal: AbortSignal.timeout(TIMEOUT_MS) });
    } catch (err) {
      throw new MailError('catcher_failed', `The mail catcher at ${endpoint} did not answer.`, { cause: err });
    }
    if (!res.ok) {
      const detail = (await res.text().catch(() => '')).slice(0, 200);
      throw new MailError(
        'catcher_failed',
        `The mail catcher answered ${method} ${endpoint} with ${res.status}. ${detail}`.trim(),
      );
    }
    return res;
  }

  return {
    async list() {
      const res = await call('GET');
      const body: unknown = await res.json().catch((err: unknown) => {
        throw new MailError('catcher_failed', `The mail catcher at ${endpoint} sent a body that is not JSON.`, { cause: err });
      });
      const parsed = CaughtMailListSchema.safeParse(body);
      if (!parsed.success) {
        throw new MailError('catcher_failed', `The mail catcher at ${endpoint} sent an unexpected body.`, {
          cause: parsed.error,
        });
      }
      return parsed.data.messages;
    },
    async clear() {
      await call('DELETE');
    },
  };
}
