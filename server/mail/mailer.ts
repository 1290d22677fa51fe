import nodemailer from 'nodemailer';
import { MailError, type Mailer, type MailErrorCode } from '@/server/domain/ports/mailer';
export type { MailMessage, SentMail, Mailer, MailErrorCode } from '@/server/domain/ports/mailer';
export { MailError } from '@/server/domain/ports/mailer';

export interface MailerOptions {
  host: string;
  port: number;
  /** true: TLS from the first byte (port 465). false (default): plain, upgraded with STARTTLS when offered. */
  secure?: boolean;
  /** The From header, e.g. `Kenning <no-reply@demo.kenning.test>`. */
  from: string;
  /** SMTP credentials, for a relay that needs them. The local catcher does not. */
  auth?: { user: string; pass: string };
  /** Connection, greeting and idle limit in milliseconds; defaults to 10 s. */
  timeoutMs?: number;
}

const DEFAULT_TIMEOUT_MS = 10_000;

const addressOf = (a: string | { address: string }) => (typeof a === 'string' ? a : a.address);

/** Nodemailer errors carry `code` (ECONNECTION, ESOCKET, ETIMEDOUT, EENVELOPE, EMESSAGE, …) and `responseCode`. */
function toMailError(err: unknown, where: string): MailError {
  const e = err as { code?: unknown; responseCode?: unknown; message?: unknown };
  const responseCode = typeof e.responseCode === 'number' ? e.responseCode : undefined;
  const reason = typeof e.message === 'string' ? e.message : String(err);
  const code: MailErrorCode = responseCode !== undefined && responseCode >= 400 ? 'rejected' : 'unreachable';
  const what = code === 'rejected' ? 'refused the message' : 'could not be reached';
  return new MailError(code, `The mail server at ${where} ${what}: ${reason}`, { cause: err, responseCode });
}

/**
 * An SMTP sender with a fixed From address. Settings come from the caller (server/config.ts),
 * never from the environment.
 *
 * @example
 * const mailer = createMailer({ host: '127.0.0.1', port: 2525, from: 'Kenning <no-reply@demo.kenning.test>' });
 * await mailer.send({ to: ['planner@demo.kenning.test'], ...reviewDecided(input) });
 */
export function createMailer({ host, port, secure = false, from, auth, timeoutMs = DEFAULT_TIMEOUT_MS }: MailerOptions): Mailer {
  const transport = nodemailer.createTransport({
    host,
    port,
    secure,
    auth,
    connectionTimeout: timeoutMs,
    greetingTimeout: timeoutMs,
    socketTimeout: timeoutMs,
    disableFileAccess: true,
    disableUrlAccess: true,
  });
  const where = `${host}:${port}`;

  return {
    async send(message) {
      const to = message.to.map((a) => a.trim()).filter((a) => a.length > 0);
      if (to.length === 0) throw new MailError('invalid_message', 'A message needs at least one recipient.');
      if (!message.subject.trim()) throw new MailError('invalid_message', 'A message needs a subject.');

      let info: {
        messageId: string;
        accepted: Array<string | { address: string }>;
        rejected: Array<string | { address: string }>;
      };
      try {
        info = await transport.sendMail({ from, to, subject: message.subject, text: message.text, html: message.html });
      } catch (err) {
        throw toMailError(err, where);
      }
      const accepted = info.accepted.map(addressOf);
      if (accepted.length === 0) {
        throw new MailError('rejected', `The mail server at ${where} accepted none of the recipients.`);
      }
      return { messageId: info.messageId, accepted, rejected: info.rejected.map(addressOf) };
    },
    close() {
      transport.close();
    },
  };
}
