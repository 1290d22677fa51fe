/* Port: sending mail (nodemailer over SMTP in server/mail/mailer) and reading the local mail catcher (server/mail/caught-mail-client). */

import type { CaughtMail } from '@/shared/schemas/mail';

/** What went wrong, for programs; `message` is for people. */
export type MailErrorCode =
  /** The message itself is unusable (no recipient, empty subject). Nothing was sent. */
  | 'invalid_message'
  /** The SMTP server could not be reached or the conversation broke off. */
  | 'unreachable'
  /** The SMTP server answered but refused the message or every recipient. */
  | 'rejected'
  /** The caught-mail HTTP API failed or answered something unexpected. */
  | 'catcher_failed';

/** The one error the mail modules throw. The SMTP reply code is kept when there was one. */
export class MailError extends Error {
  override name = 'MailError';
  /** The SMTP server's numeric reply (e.g. 550), when it gave one. */
  readonly responseCode: number | undefined;

  constructor(
    readonly code: MailErrorCode,
    message: string,
    options?: { cause?: unknown; responseCode?: number },
  ) {
    super(message, { cause: options?.cause });
    this.responseCode = options?.responseCode;
  }
}

export interface MailMessage {
  /** Bare addresses; at least one. */
  to: string[];
  subject: string;
  text: string;
  html?: string;
}

export interface SentMail {
  messageId: string;
  /** Recipients the server accepted. */
  accepted: string[];
  /** Recipients the server refused while accepting others (the send still counts as sent). */
  rejected: string[];
}

export interface Mailer {
  /** Sends one message; throws `MailError` and never resolves on failure. */
  send(message: MailMessage): Promise<SentMail>;
  /** Closes the transport's open connections. */
  close(): void;
}

export interface CaughtMailClient {
  /** Every caught message, newest first. */
  list(): Promise<CaughtMail[]>;
  /** Forgets every caught message. */
  clear(): Promise<void>;
}
