import request from 'supertest';
import { createApp } from '@/server/app';
import { DEMO_PASSWORD } from '@/server/seeders/demo';
import { createTestApp, TEST_CONFIG } from '@/tests/support/test-db';
import { DEMO, signedInAgent } from '@/tests/support/agents';

// Sign-in is slowed progressively per account and per address (never locked for
// long), the counts are shared through PostgreSQL by every server process, the
// client address comes from X-Forwarded-For only behind a configured proxy, and
// production refuses writes a browser sent from another site.

let ctx: Awaited<ReturnType<typeof createTestApp>>;

beforeAll(async () => {
  ctx = await createTestApp();
});
afterAll(() => ctx.close());

const appWith = (config: Partial<typeof TEST_CONFIG>) =>
  createApp({ db: ctx.db, files: ctx.files, config: { ...TEST_CONFIG, TERRAIN_UPLOAD_DIR: ctx.uploadsDir, ...config } });
const signIn = (app: ReturnType<typeof appWith>, email: string, password: string, headers: Record<string, string> = {}) =>
  request(app).post('/api/auth/sign-in').set(headers).send({ email, password });

it('shares an account’s delay between two server processes and lets the owner in after a short wait', async () => {
  const limits = { SIGN_IN_STORE: 'database', SIGN_IN_LIMIT_PER_ACCOUNT: 2, SIGN_IN_LIMIT_PER_ADDRESS: 1000 } as const;
  const one = appWith(limits);
  const two = appWith(limits); // a second process: same database, its own memory

  expect((await signIn(one, DEMO.reviewer, 'wrong guess 1')).status).toBe(401);
  expect((await signIn(two, DEMO.reviewer, 'wrong guess 2')).status).toBe(401);
  const slowed = await signIn(one, DEMO.reviewer, DEMO_PASSWORD);
  expect(slowed.status).toBe(429);
  const retryAfter = Number(slowed.headers['retry-after']);
  expect(retryAfter).toBeGreaterThanOrEqual(1);
  expect(retryAfter).toBeLessThanOrEqual(2);
  expect((await signIn(two, DEMO.reviewer, DEMO_PASSWORD)).status).toBe(429);

  // Not a quarter-hour lock: after the wait the right password works (on either process).
  await new Promise((r) => setTimeout(r, retryAfter * 1000 + 200));
  expect((await signIn(two, DEMO.reviewer, DEMO_PASSWORD)).status).toBe(200);
  // Success cleared the account's count.
  expect((await signIn(one, DEMO.reviewer, 'wrong guess 3')).status).toBe(401);
  expect((await signIn(one, DEMO.reviewer, DEMO_PASSWORD)).status).toBe(200);
});

describe('the client address', () => {
  const spray = async (app: ReturnType<typeof appWith>) => {
    const statuses: number[] = [];
    for (const [i, email] of [DEMO.planner, DEMO.observer, DEMO.admin].entries()) {
      statuses.push((await signIn(app, email, 'sprayed guess', { 'X-Forwarded-For': `203.0.113.${i + 1}` })).status);
    }
    return statuses;
  };

  it('ignores X-Forwarded-For without TRUST_PROXY: a sprayer cannot pick a fresh address per try', async () => {
    expect(await spray(appWith({ SIGN_IN_LIMIT_PER_ADDRESS: 2, TRUST_PROXY: false }))).toEqual([401, 401, 429]);
  });

  it('takes the address from X-Forwarded-For behind a trusted proxy', async () => {
    expect(await spray(appWith({ SIGN_IN_LIMIT_PER_ADDRESS: 2, TRUST_PROXY: true }))).toEqual([401, 401, 401]);
  });
});

describe('the Origin check in production', () => {
  const production = () => appWith({ NODE_ENV: 'production' });

  it('refuses a sign-in posted from another site, accepts one from Kenning’s own origin', async () => {
    const app = production();
    const foreign = await signIn(app, DEMO.planner, DEMO_PASSWORD, { Origin: 'https://evil.example' });
    expect(foreign.status).toBe(403);
    expect(foreign.body.error.code).toBe('foreign_origin');
    const own = await signIn(app, DEMO.planner, DEMO_PASSWORD, { Origin: 'https://kenning.test' });
    expect(own.status).toBe(200);
    // Without Origin, a browser's Sec-Fetch-Site still gives a cross-site request away.
    const crossSite = await signIn(app, DEMO.planner, DEMO_PASSWORD, { 'Sec-Fetch-Site': 'cross-site' });
    expect(crossSite.status).toBe(403);
  });

  it('refuses a multipart upload from another site, and lets reads through', async () => {
    const app = production();
    const agent = await signedInAgent(app, DEMO.planner);
    const upload = await agent
      .post('/api/v1/attachments')
      .set('Origin', 'https://evil.example')
      .field('ownerType', 'plan')
      .attach('file', Buffer.from('%PDF-1.4\n'), 'note.pdf');
    expect(upload.status).toBe(403);
    expect(upload.body.error.code).toBe('foreign_origin');
    expect((await agent.get('/api/v1/sites').set('Origin', 'https://evil.example')).status).toBe(200);
  });

  it('is off outside production (the development web server runs on another port)', async () => {
    const res = await signIn(appWith({}), DEMO.planner, DEMO_PASSWORD, { Origin: 'http://127.0.0.1:8081' });
    expect(res.status).toBe(200);
  });
});
