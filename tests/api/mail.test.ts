/**
 * Mail end to end on loopback: the catcher (SMTP + its HTTP API), the mailer, the HTTP client,
 * the stand-alone catcher process and the admin route. No database: the one repository the
 * route's session guard reads is replaced by a stub.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import http from 'node:http';
import net, { type AddressInfo } from 'node:net';
import path from 'node:path';
import { createInterface } from 'node:readline';
import express, { type NextFunction, type Request, type Response } from 'express';
import request from 'supertest';
import type { User } from '@/shared/schemas/auth';
import { CaughtMailListSchema, CaughtMailSchema } from '@/shared/schemas/mail';
import { usersRepository } from '@/server/data/repositories/users-repository';
import { errorHandler } from '@/server/http/error-handler';
import { createCaughtMailClient, type CaughtMailClient } from '@/server/mail/caught-mail-client';
import { startCaughtMailApi, startMailCatcher, type CaughtMailApi, type MailCatcher } from '@/server/mail/mail-catcher';
import { MailError, createMailer, type Mailer } from '@/server/mail/mailer';
import { invitation, reviewDecided } from '@/server/mail/templates';
import { caughtMailRoutes } from '@/server/routes/caught-mail';

jest.mock('@/server/data/repositories/users-repository', () => ({
  usersRepository: { activeById: jest.fn(), emailsInOrganization: jest.fn() },
}));

const FROM = 'Kenning <no-reply@demo.kenning.test>';
const PLANNER = 'planner@demo.kenning.test';
const REVIEWER = 'reviewer@demo.kenning.test';
const quiet = () => {};

/** A loopback port nothing listens on (bound, read, released). */
async function closedPort(): Promise<number> {
  const s = net.createServer();
  await new Promise<void>((resolve) => s.listen(0, '127.0.0.1', resolve));
  const { port } = s.address() as AddressInfo;
  await new Promise<void>((resolve) => s.close(() => resolve()));
  return port;
}

const text = (to: string[], subject: string, body = 'Body.') => ({ to, subject, text: body });

let catcher: MailCatcher;
let api: CaughtMailApi;
let client: CaughtMailClient;
let mailer: Mailer;

beforeAll(async () => {
  catcher = await startMailCatcher({ onError: quiet });
  api = await startCaughtMailApi(catcher);
  client = createCaughtMailClient(api.url);
  mailer = createMailer({ host: '127.0.0.1', port: catcher.port, from: FROM });
});
afterAll(async () => {
  mailer.close();
  await api.close();
  await catcher.close();
});
beforeEach(() => client.clear());

describe('sending through the catcher', () => {
  it('delivers a template and reads it back over the HTTP API', async () => {
    const content = invitation({
      name: 'Ada Fenwick',
      organizationName: 'Harrowmere Lookout Service',
      invitedBy: 'Rowan Tull',
      setPasswordUrl: 'http://127.0.0.1:8080/set-password?token=abc&x=1',
    });
    const sent = await mailer.send({ to: [PLANNER], ...content });
    expect(sent.messageId).toMatch(/^<.+@.+>$/);
    expect(sent).toMatchObject({ accepted: [PLANNER], rejected: [] });

    const [mail, ...rest] = await client.list();
    expect(rest).toHaveLength(0);
    expect(CaughtMailSchema.parse(mail)).toEqual(mail);
    expect(mail).toMatchObject({
      from: expect.stringContaining('no-reply@demo.kenning.test'),
      to: [PLANNER],
      subject: content.subject,
    });
    expect(mail!.text.trim()).toBe(content.text.trim());
    expect(mail!.html).toContain('href="http://127.0.0.1:8080/set-password?token=abc&#38;x=1"');
    expect(Date.parse(mail!.receivedAt)).toBeGreaterThan(Date.now() - 60_000);
  });

  it('keeps every envelope recipient and non-ASCII subjects intact', async () => {
    const content = reviewDecided({
      planTitle: 'Côte north — ridge',
      decision: 'returned',
      reviewer: 'Rowan Tull',
      comment: 'Add the north slope.',
      planUrl: 'http://127.0.0.1:8080/plans/1',
    });
    await mailer.send({ to: [PLANNER, REVIEWER], ...content });
    const [mail] = await client.list();
    expect(mail!.to).toEqual([PLANNER, REVIEWER]);
    expect(mail!.subject).toBe('Returned for changes: Côte north — ridge');
    expect(mail!.text).toContain('> Add the north slope.');
  });

  it('lists newest first, and clear() forgets everything', async () => {
    await mailer.send(text([PLANNER], 'first'));
    await mailer.send(text([PLANNER], 'second'));
    expect((await client.list()).map((m) => m.subject)).toEqual(['second', 'first']);
    await client.clear();
    expect(await client.list()).toEqual([]);
    expect(catcher.messages()).toEqual([]);
  });

  it('a message without html has no html field', async () => {
    await mailer.send(text([PLANNER], 'plain only', 'Just text.'));
    const [mail] = await client.list();
    expect(mail).not.toHaveProperty('html');
    expect(mail!.text.trim()).toBe('Just text.');
  });
});

describe('the catcher’s limits', () => {
  it('keeps only the newest maxMessages', async () => {
    const small = await startMailCatcher({ maxMessages: 2, onError: quiet });
    const m = createMailer({ host: '127.0.0.1', port: small.port, from: FROM });
    try {
      for (const subject of ['one', 'two', 'three']) await m.send(text([PLANNER], subject));
      expect(small.messages().map((x) => x.subject)).toEqual(['three', 'two']);
    } finally {
      m.close();
      await small.close();
    }
  });

  it('refuses a message over the size limit with 552, which the mailer throws as MailError', async () => {
    const small = await startMailCatcher({ maxMessageBytes: 4096, onError: quiet });
    const m = createMailer({ host: '127.0.0.1', port: small.port, from: FROM });
    try {
      const err = await m.send(text([PLANNER], 'too big', 'x'.repeat(20_000))).catch((e: unknown) => e);
      expect(err).toBeInstanceOf(MailError);
      expect(err).toMatchObject({ code: 'rejected', responseCode: 552 });
      expect(small.messages()).toEqual([]);
    } finally {
      m.close();
      await small.close();
    }
  });

  it('will not listen on a non-loopback address', async () => {
    await expect(startMailCatcher({ host: '0.0.0.0' })).rejects.toThrow(/loopback only/);
    await expect(startCaughtMailApi(catcher, { host: '0.0.0.0' })).rejects.toThrow(/loopback only/);
  });

  it('rejects a port already in use instead of hanging', async () => {
    await expect(startMailCatcher({ port: catcher.port, onError: quiet })).rejects.toThrow(/EADDRINUSE/);
  });
});

describe('mailer failures are thrown, typed', () => {
  it('an SMTP port nobody listens on → MailError "unreachable" naming the address', async () => {
    const port = await closedPort();
    const m = createMailer({ host: '127.0.0.1', port, from: FROM, timeoutMs: 2000 });
    try {
      const err = await m.send(text([PLANNER], 'nowhere')).catch((e: unknown) => e);
      expect(err).toBeInstanceOf(MailError);
      expect(err).toMatchObject({ code: 'unreachable', responseCode: undefined });
      expect((err as MailError).message).toContain(`127.0.0.1:${port}`);
      expect((err as MailError).cause).toBeDefined();
    } finally {
      m.close();
    }
  });

  it('a message without recipients or subject is refused before any connection', async () => {
    await expect(mailer.send(text([], 'no one'))).rejects.toMatchObject({ name: 'MailError', code: 'invalid_message' });
    await expect(mailer.send(text(['  '], 'blank'))).rejects.toMatchObject({ code: 'invalid_message' });
    await expect(mailer.send(text([PLANNER], '  '))).rejects.toMatchObject({ code: 'invalid_message' });
    expect(catcher.messages()).toEqual([]);
  });
});

describe('the caught-mail HTTP API and its client', () => {
  const raw = (method: string, pathname: string, headers: Record<string, string> = {}) =>
    new Promise<{ status: number; body: string; allow?: string }>((resolve, reject) => {
      const req = http.request({ host: '127.0.0.1', port: api.port, method, path: pathname, headers }, (res) => {
        let body = '';
        res.setEncoding('utf8');
        res.on('data', (c: string) => (body += c));
        res.on('end', () => resolve({ status: res.statusCode ?? 0, body, allow: res.headers.allow }));
      });
      req.on('error', reject);
      req.end();
    });

  it('answers unknown paths with 404 and other methods with 405', async () => {
    expect((await raw('GET', '/nothing')).status).toBe(404);
    const post = await raw('POST', '/messages');
    expect(post.status).toBe(405);
    expect(post.allow).toBe('GET, DELETE');
  });

  it('refuses a request whose Host is not a loopback name (DNS rebinding)', async () => {
    const res = await raw('GET', '/messages', { Host: 'mail.elsewhere.test' });
    expect(res.status).toBe(403);
    expect(JSON.parse(res.body)).toMatchObject({ error: { code: 'forbidden' } });
  });

  it('the client throws MailError "catcher_failed" when nothing listens', async () => {
    const dead = createCaughtMailClient(`http://127.0.0.1:${await closedPort()}`);
    await expect(dead.list()).rejects.toMatchObject({ name: 'MailError', code: 'catcher_failed' });
    await expect(dead.clear()).rejects.toBeInstanceOf(MailError);
  });

  it('the client throws on a non-2xx answer and on a body of the wrong shape', async () => {
    const fake = http.createServer((req, res) => {
      if (req.method === 'DELETE') res.writeHead(500).end('broken');
      else res.writeHead(200, { 'Content-Type': 'application/json' }).end(JSON.stringify({ messages: [{ id: 1 }] }));
    });
    await new Promise<void>((resolve) => fake.listen(0, '127.0.0.1', resolve));
    const c = createCaughtMailClient(`http://127.0.0.1:${(fake.address() as AddressInfo).port}`);
    try {
      await expect(c.clear()).rejects.toMatchObject({ code: 'catcher_failed', message: expect.stringMatching(/500/) });
      await expect(c.list()).rejects.toMatchObject({ code: 'catcher_failed', message: expect.stringMatching(/unexpected body/) });
    } finally {
      await new Promise<void>((resolve) => fake.close(() => resolve()));
    }
  });
});

describe('server/scripts/mail-catcher.ts as its own process', () => {
  let child: ChildProcess | undefined;
  afterEach(() => {
    if (child && child.exitCode === null && child.signalCode === null) child.kill('SIGKILL');
  });

  it('prints one JSON line with both ports, catches mail, and stops cleanly on SIGTERM', async () => {
    const root = path.resolve(__dirname, '..', '..');
    const proc = spawn(process.execPath, ['--import', 'tsx', path.join(root, 'server', 'scripts', 'mail-catcher.ts')], {
      cwd: root,
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    child = proc;
    let stderr = '';
    proc.stderr!.on('data', (c: Buffer) => (stderr += c.toString()));
    const lines = createInterface({ input: proc.stdout! });
    const first = await new Promise<string>((resolve, reject) => {
      lines.once('line', resolve);
      proc.once('exit', (code) => reject(new Error(`the catcher exited with ${code}: ${stderr}`)));
    });
    const ready = JSON.parse(first) as { ready: boolean; host: string; smtpPort: number; httpPort: number; url: string };
    expect(ready).toMatchObject({ ready: true, host: '127.0.0.1' });
    expect(ready.smtpPort).toBeGreaterThan(0);
    expect(ready.httpPort).toBeGreaterThan(0);
    expect(ready.url).toBe(`http://127.0.0.1:${ready.httpPort}`);

    const m = createMailer({ host: ready.host, port: ready.smtpPort, from: FROM });
    try {
      await m.send(text([PLANNER], 'via the process'));
    } finally {
      m.close();
    }
    expect((await createCaughtMailClient(ready.url).list()).map((x) => x.subject)).toEqual(['via the process']);

    let more = '';
    proc.stdout!.on('data', (c: Buffer) => (more += c.toString()));
    const exited = new Promise<number | null>((resolve) => proc.once('exit', (code) => resolve(code)));
    proc.kill('SIGTERM');
    expect(await exited).toBe(0);
    expect(more).toBe('');
    expect(stderr).toContain('caught "via the process"');
  });
});

describe('GET /caught-mail (admin route)', () => {
  const user = (id: string, role: User['role']): User => ({
    id,
    email: `${role}@demo.kenning.test`,
    name: role,
    role,
    organization: { id: '00000000-0000-4000-8000-000000000001', name: 'Harrowmere Lookout Service' },
  });
  const users: Record<string, User> = { 'admin-id': user('admin-id', 'admin'), 'planner-id': user('planner-id', 'planner') };

  beforeAll(() => {
    jest
      .mocked(usersRepository.activeById)
      .mockImplementation(async (id: string) => (users[id] ? { ...users[id], sessionGeneration: 0 } : null));
    // The admin's organisation holds the planner and the reviewer, not the outsider.
    jest.mocked(usersRepository.emailsInOrganization).mockResolvedValue([PLANNER, REVIEWER]);
  });

  /** A bare app with a stand-in session: the `x-test-user` header names the signed-in user. */
  function appWith(c: CaughtMailClient | null) {
    const app = express();
    app.use((req: Request, _res: Response, next: NextFunction) => {
      req.session = { userId: req.get('x-test-user'), destroy: () => {} } as unknown as Request['session'];
      next();
    });
    app.use(caughtMailRoutes(c));
    app.use(errorHandler);
    return app;
  }

  it('signed out → 401; a planner → 403', async () => {
    const app = appWith(client);
    expect((await request(app).get('/caught-mail')).status).toBe(401);
    expect((await request(app).get('/caught-mail').set('x-test-user', 'planner-id')).status).toBe(403);
  });

  it('an admin gets { messages }, newest first, matching the shared schema', async () => {
    await mailer.send(text([PLANNER], 'older'));
    await mailer.send(text([REVIEWER], 'newer'));
    const res = await request(appWith(client)).get('/caught-mail').set('x-test-user', 'admin-id').expect(200);
    const body = CaughtMailListSchema.parse(res.body);
    expect(body.messages.map((m) => m.subject)).toEqual(['newer', 'older']);
  });

  it("leaves out mail to other organisations' people", async () => {
    await mailer.send(text([PLANNER], 'yours'));
    await mailer.send(text(['someone@tallon.kenning.test'], 'not yours'));
    const res = await request(appWith(client)).get('/caught-mail').set('x-test-user', 'admin-id').expect(200);
    expect(res.body.messages.map((m: { subject: string }) => m.subject)).not.toContain('not yours');
    expect(res.body.messages.map((m: { subject: string }) => m.subject)).toContain('yours');
  });

  it('without a catcher → 404 with a clear message (after the role check)', async () => {
    const app = appWith(null);
    expect((await request(app).get('/caught-mail').set('x-test-user', 'planner-id')).status).toBe(403);
    const res = await request(app).get('/caught-mail').set('x-test-user', 'admin-id');
    expect(res.status).toBe(404);
    expect(res.body.error).toMatchObject({ code: 'mail_catcher_off', message: expect.stringMatching(/no mail catcher/i) });
  });

  it('a catcher that went away → 502', async () => {
    const dead = createCaughtMailClient(`http://127.0.0.1:${await closedPort()}`);
    const res = await request(appWith(dead)).get('/caught-mail').set('x-test-user', 'admin-id');
    expect(res.status).toBe(502);
    expect(res.body.error.code).toBe('mail_catcher_unavailable');
  });
});
