import request from 'supertest';
import type { Express } from 'express';
import type { Sequelize } from 'sequelize';
import { UserModel } from '@/server/data/models';
import { DEMO_PASSWORD } from '@/server/seeders/demo';
import { createApp } from '@/server/app';
import type { FileStore } from '@/server/storage/file-store';
import { createTestApp, TEST_CONFIG } from '@/tests/support/test-db';
import { DEMO } from '@/tests/support/agents';

let app: Express;
let db: Sequelize;
let close: () => Promise<void>;
let files: FileStore;

beforeAll(async () => {
  ({ app, db, files, close } = await createTestApp());
});
afterAll(() => close());

const cookieOf = (res: request.Response) => {
  const set = res.headers['set-cookie'] as unknown as string[] | undefined;
  const c = set?.find((s) => s.startsWith('kenning_session='));
  if (!c) throw new Error('no session cookie was set');
  return c;
};

describe('POST /api/auth/sign-in', () => {
  it.each(Object.entries(DEMO).filter(([k]) => !k.startsWith('other')))('signs in the demo %s', async (role, email) => {
    const res = await request(app).post('/api/auth/sign-in').send({ email, password: DEMO_PASSWORD });
    expect(res.status).toBe(200);
    expect(res.body.user).toMatchObject({ email, role, organization: { name: 'Harrowmere Lookout Service' } });
    const cookie = cookieOf(res);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).not.toMatch(/Secure/i); // plain http here
  });

  it('accepts the e-mail in any case and with spaces around it', async () => {
    const res = await request(app)
      .post('/api/auth/sign-in')
      .send({ email: '  Planner@Demo.Kenning.TEST ', password: DEMO_PASSWORD });
    expect(res.status).toBe(200);
  });

  it('answers a wrong password and an unknown e-mail with the same 401', async () => {
    const wrong = await request(app).post('/api/auth/sign-in').send({ email: DEMO.planner, password: 'not-the-password' });
    const unknown = await request(app)
      .post('/api/auth/sign-in')
      .send({ email: 'nobody@demo.kenning.test', password: 'whatever-at-all' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body).toEqual(unknown.body);
    expect(wrong.body.error.code).toBe('wrong_credentials');
    expect(wrong.headers['set-cookie']).toBeUndefined();
  });

  it('answers malformed bodies with 400 and a reason per field', async () => {
    const res = await request(app).post('/api/auth/sign-in').send({ email: 'not-an-address' });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_input');
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['email', 'password']);
  });

  it('answers a body that is not JSON with 400', async () => {
    const res = await request(app).post('/api/auth/sign-in').set('Content-Type', 'application/json').send('{"email":');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('malformed_json');
  });

  it('issues a new session value at every sign-in', async () => {
    const body = { email: DEMO.reviewer, password: DEMO_PASSWORD };
    const a = cookieOf(await request(app).post('/api/auth/sign-in').send(body));
    const b = cookieOf(await request(app).post('/api/auth/sign-in').send(body));
    expect(a.split(';')[0]).not.toEqual(b.split(';')[0]);
  });

  it('refuses a deactivated account with the same 401', async () => {
    await UserModel.update({ active: false }, { where: { email: DEMO.observer } });
    try {
      const res = await request(app).post('/api/auth/sign-in').send({ email: DEMO.observer, password: DEMO_PASSWORD });
      expect(res.status).toBe(401);
      expect(res.body.error.code).toBe('wrong_credentials');
    } finally {
      await UserModel.update({ active: true }, { where: { email: DEMO.observer } });
    }
  });

  it('marks the cookie Secure when the request came over https through a trusted proxy', async () => {
    const secured = createApp({ db, files, config: { ...TEST_CONFIG, TRUST_PROXY: true } });
    {
      const res = await request(secured)
        .post('/api/auth/sign-in')
        .set('X-Forwarded-Proto', 'https')
        .send({ email: DEMO.planner, password: DEMO_PASSWORD });
      expect(res.status).toBe(200);
      expect(cookieOf(res)).toMatch(/Secure/i);
    }
  });
});

describe('sign-in rate limits', () => {
  it('answers a burst of bad attempts on one account with 429, even with the right password', async () => {
    const limited = {
      app: createApp({ db, files, config: { ...TEST_CONFIG, SIGN_IN_LIMIT_PER_ACCOUNT: 3, SIGN_IN_LIMIT_PER_ADDRESS: 100 } }),
    };
    {
      const statuses: number[] = [];
      for (let i = 0; i < 4; i++) {
        const r = await request(limited.app)
          .post('/api/auth/sign-in')
          .send({ email: DEMO.planner, password: `wrong-${i}-guess` });
        statuses.push(r.status);
      }
      expect(statuses).toEqual([401, 401, 401, 429]);
      const right = await request(limited.app).post('/api/auth/sign-in').send({ email: DEMO.planner, password: DEMO_PASSWORD });
      expect(right.status).toBe(429);
      expect(right.body.error.message).toMatch(/Too many sign-in attempts/);
      // Another account from the same address is not locked out.
      const other = await request(limited.app).post('/api/auth/sign-in').send({ email: DEMO.reviewer, password: DEMO_PASSWORD });
      expect(other.status).toBe(200);
    }
  });

  it('limits attempts per address across accounts', async () => {
    const limited = {
      app: createApp({ db, files, config: { ...TEST_CONFIG, SIGN_IN_LIMIT_PER_ADDRESS: 2, SIGN_IN_LIMIT_PER_ACCOUNT: 100 } }),
    };
    {
      const emails = [DEMO.planner, DEMO.reviewer, DEMO.admin];
      const statuses = [];
      for (const email of emails)
        statuses.push((await request(limited.app).post('/api/auth/sign-in').send({ email, password: 'wrong-password' })).status);
      expect(statuses).toEqual([401, 401, 429]);
    }
  });
});

describe('GET /api/me and sign-out', () => {
  it('is 401 when signed out', async () => {
    const res = await request(app).get('/api/me');
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('unauthenticated');
  });

  it('returns the user with the organisation, then 401 after sign-out', async () => {
    const agent = request.agent(app);
    await agent.post('/api/auth/sign-in').send({ email: DEMO.planner, password: DEMO_PASSWORD }).expect(200);
    const me = await agent.get('/api/me').expect(200);
    expect(me.body.user).toEqual({
      id: expect.any(String),
      email: DEMO.planner,
      name: expect.any(String),
      role: 'planner',
      organization: { id: expect.any(String), name: 'Harrowmere Lookout Service' },
    });
    await agent.post('/api/auth/sign-out').expect(204);
    await agent.get('/api/me').expect(401);
  });

  it('ends the session of a user who is deactivated meanwhile', async () => {
    const agent = request.agent(app);
    await agent.post('/api/auth/sign-in').send({ email: DEMO.reviewer, password: DEMO_PASSWORD }).expect(200);
    await UserModel.update({ active: false }, { where: { email: DEMO.reviewer } });
    try {
      await agent.get('/api/me').expect(401);
    } finally {
      await UserModel.update({ active: true }, { where: { email: DEMO.reviewer } });
    }
  });

  it('rejects a forged cookie', async () => {
    const res = await request(app).get('/api/me').set('Cookie', 'kenning_session=Fe26.2*1*forged*value');
    expect(res.status).toBe(401);
  });
});

describe('GET /api/health', () => {
  it('reports the database', async () => {
    const res = await request(app).get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ status: 'ok', db: 'ok' });
    expect(db).toBeDefined();
  });
});
