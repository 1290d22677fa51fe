import { z } from 'zod';

/**
 * One message held by the development mail catcher. Recipients are the SMTP envelope's,
 * so they include addresses that were not in the To header (Bcc).
 */
export const CaughtMailSchema = z.object({
  id: z.string().min(1),
  /** ISO 8601 (UTC) time the catcher accepted the message. */
  receivedAt: z.iso.datetime(),
  /** The From header as written, e.g. `Kenning <no-reply@demo.kenning.test>`. */
  from: z.string(),
  /** Envelope recipients (bare addresses), as the sender gave them. */
  to: z.array(z.string()),
  subject: z.string(),
  /** Plain-text body ('' when the message had none). */
  text: z.string(),
  /** HTML body, when the message had one. */
  html: z.string().optional(),
});
export type CaughtMail = z.infer<typeof CaughtMailSchema>;

/** Body of `GET /api/v1/caught-mail` and of the catcher's own `GET /messages`: newest first. */
export const CaughtMailListSchema = z.object({ messages: z.array(CaughtMailSchema) });
export type CaughtMailList = z.infer<typeof CaughtMailListSchema>;
