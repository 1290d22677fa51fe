/* Port: sending mail (nodemailer over SMTP in server/mail/mailer). */

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
