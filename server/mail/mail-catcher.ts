import { randomUUID } from 'node:crypto';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import type { CaughtMail } from '@/shared/schemas/mail';

/**
 * A local SMTP server that accepts every message and keeps the newest ones in memory, for
 * development, the demo and tests. It has no authentication and no TLS, so it only ever
 * listens on a loopback address and only talks to loopback clients.
 */

export interface MailCatcherOptions {
  /** A loopback address (127.x.x.x, ::1 or localhost); default 127.0.0.1. */
  host?: string;
  /** 0 (default) lets the system pick a free port; read it back from `port`. */
  port?: number;
  /** Messages kept; the oldest is dropped beyond this. Default 500. */
  maxMessages?: number;
  /** Largest message accepted, in bytes (advertised with SIZE, refused with 552). Default 10 MiB. */
  maxMessageBytes?: number;
  /** Called with each message once it is stored. */
  onMessage?: (mail: CaughtMail) => void;
  /** Called with connection-level errors after start-up; default: logged to stderr. */
  onError?: (err: Error) => void;
}

export interface MailCatcher {
  readonly host: string;
  readonly port: number;
  /** Caught messages, newest first (a copy). */
  messages(): CaughtMail[];
  clear(): void;
  /** Stops listening; safe to call twice. */
  close(): Promise<void>;
}

const DEFAULT_MAX_MESSAGES = 500;
const DEFAULT_MAX_MESSAGE_BYTES = 10 * 1024 * 1024;

/** True for the loopback names and addresses this module agrees to use. */
export function isLoopback(hostOrAddress: string): boolean {
  const h = hostOrAddress.toLowerCase().replace(/^\[|\]$/g, '');
  return h === 'localhost' || h === '::1' || /^(::ffff:)?127(\.\d{1,3}){3}$/.test(h);
}

/** An error whose `responseCode` smtp-server sends back as the SMTP reply. */
const smtpError = (responseCode: number, message: string) => Object.assign(new Error(message), { responseCode });

/** Starts the catcher; resolves once it is listening. */
export async function startMailCatcher({
  host = '127.0.0.1',
  port = 0,
  maxMessages = DEFAULT_MAX_MESSAGES,
  maxMessageBytes = DEFAULT_MAX_MESSAGE_BYTES,
  onMessage,
  onError = (err) => console.error('[mail-catcher]', err.message),
}: MailCatcherOptions = {}): Promise<MailCatcher> {
  if (!isLoopback(host))
    throw new Error(`The mail catcher listens on loopback only; ${JSON.stringify(host)} is not a loopback address.`);
  if (!Number.isInteger(maxMessages) || maxMessages < 1) throw new Error('maxMessages must be a positive integer.');
  if (!Number.isInteger(maxMessageBytes) || maxMessageBytes < 1) throw new Error('maxMessageBytes must be a positive integer.');

  /** Newest first; never longer than maxMessages. */
  let caught: CaughtMail[] = [];

  const server = new SMTPServer({
    banner: 'Kenning mail catcher (development only)',
    authOptional: true,
    disabledCommands: ['AUTH', 'STARTTLS'],
    size: maxMessageBytes,
    disableReverseLookup: true,
    maxClients: 50,
    socketTimeout: 30_000,
    closeTimeout: 1_000,
    logger: false,
    onConnect(session, callback) {
      if (isLoopback(session.remoteAddress)) return callback();
      callback(smtpError(554, 'This mail catcher only accepts local connections.'));
    },
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      let bytes = 0;
      stream.on('data', (chunk: Buffer) => {
        bytes += chunk.length;
        if (bytes <= maxMessageBytes) chunks.push(chunk);
      });
      stream.on('end', () => {
        if (stream.sizeExceeded || bytes > maxMessageBytes) {
          callback(smtpError(552, `Message exceeds the limit of ${maxMessageBytes} bytes.`));
          return;
        }
        simpleParser(Buffer.concat(chunks), { skipTextToHtml: true, skipTextLinks: true, skipImageLinks: true }).then(
          (parsed) => {
            const envelope = session.envelope;
            const mail: CaughtMail = {
              id: randomUUID(),
              receivedAt: new Date().toISOString(),
              from: parsed.from?.text ?? (envelope.mailFrom ? envelope.mailFrom.address : ''),
              to: envelope.rcptTo.map((r) => r.address),
              subject: parsed.subject ?? '',
              text: parsed.text ?? '',
              ...(typeof parsed.html === 'string' && { html: parsed.html }),
            };
            caught = [mail, ...caught.slice(0, maxMessages - 1)];
            onMessage?.(mail);
            callback(null, `Caught as ${mail.id}`);
          },
          (err: unknown) =>
            callback(smtpError(451, `Could not read the message: ${err instanceof Error ? err.message : String(err)}`)),
        );
      });
    },
  });

  return new Promise((resolve, reject) => {
    let started = false;
    server.on('error', (err: Error) => (started ? onError(err) : reject(err)));
    const listener = server.listen(port, host, () => {
      started = true;
      let closing: Promise<void> | undefined;
      resolve({
        host,
        port: (listener.address() as AddressInfo).port,
        messages: () => [...caught],
        clear: () => {
          caught = [];
        },
        close: () => (closing ??= new Promise<void>((done) => server.close(() => done()))),
      });
    });
  });
}

export interface CaughtMailApiOptions {
  /** A loopback address; default 127.0.0.1. */
  host?: string;
  /** 0 (default) picks a free port. */
  port?: number;
}

export interface CaughtMailApi {
  readonly port: number;
  /** Base URL for `createCaughtMailClient`, e.g. `http://127.0.0.1:40123`. */
  readonly url: string;
  close(): Promise<void>;
}

const hostForUrl = (host: string) => (host.includes(':') ? `[${host}]` : host);

/** The Host header's name without its port: `127.0.0.1:80` → `127.0.0.1`, `[::1]:80` → `::1`. */
const hostnameOf = (hostHeader: string) => hostHeader.replace(/:\d+$/, '');

/**
 * The catcher's tiny HTTP JSON API, on loopback:
 *   GET /messages    → 200 `{ messages: CaughtMail[] }`, newest first
 *   DELETE /messages → 204, forgets every message
 * Requests naming a non-loopback Host are refused, so a web page cannot read caught mail
 * (set-password links!) through DNS rebinding.
 */
export async function startCaughtMailApi(
  catcher: Pick<MailCatcher, 'messages' | 'clear'>,
  { host = '127.0.0.1', port = 0 }: CaughtMailApiOptions = {},
): Promise<CaughtMailApi> {
  if (!isLoopback(host))
    throw new Error(`The caught-mail API listens on loopback only; ${JSON.stringify(host)} is not a loopback address.`);

  const send = (res: http.ServerResponse, status: number, body?: unknown, headers: Record<string, string> = {}) => {
    res.writeHead(status, {
      'Cache-Control': 'no-store',
      ...(body !== undefined && { 'Content-Type': 'application/json' }),
      ...headers,
    });
    res.end(body === undefined ? undefined : JSON.stringify(body));
  };
  const error = (code: string, message: string) => ({ error: { code, message } });

  const server = http.createServer((req, res) => {
    if (!isLoopback(hostnameOf(req.headers.host ?? ''))) {
      send(res, 403, error('forbidden', 'The caught-mail API answers loopback host names only.'));
      return;
    }
    const path = new URL(req.url ?? '/', 'http://localhost').pathname;
    if (path !== '/messages') {
      send(res, 404, error('not_found', `No route ${req.method} ${path}. Use GET or DELETE /messages.`));
      return;
    }
    if (req.method === 'GET') send(res, 200, { messages: catcher.messages() });
    else if (req.method === 'DELETE') {
      catcher.clear();
      send(res, 204);
    } else send(res, 405, error('method_not_allowed', 'Use GET or DELETE on /messages.'), { Allow: 'GET, DELETE' });
  });

  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, host, () => {
      server.off('error', reject);
      const actual = (server.address() as AddressInfo).port;
      let closing: Promise<void> | undefined;
      resolve({
        port: actual,
        url: `http://${hostForUrl(host)}:${actual}`,
        close: () =>
          (closing ??= new Promise<void>((done) => {
            server.close(() => done());
            server.closeAllConnections();
          })),
      });
    });
  });
}
