import request from 'supertest';
import type { Express } from 'express';
import { UserModel } from '@/server/data/models';
import { createTestApp } from '@/tests/support/test-db';
import { DEMO, signedInAgent } from '@/tests/support/agents';

let app: Express;
let close: () => Promise<void>;

beforeAll(async () => {
  ({ app, close } = await createTestApp());
});
afterAll(() => close());

const idOf = async (email: string) => (await UserModel.findOne({ where: { email } }))!;

describe('who may manage users (role × organisation)', () => {
  it.each([
    ['planner', DEMO.planner],
    ['reviewer', DEMO.reviewer],
    ['observer', DEMO.observer],
  ])('a %s gets 403 on every user route', async (_role, email) => {
    const agent = await signedInAgent(app, email);
    const target = await idOf(DEMO.planner);
    expect((await agent.get('/api/v1/users')).status).toBe(403);
    expect((await agent.post('/api/v1/users').send({ email: 'x@y.test', name: 'X', role: 'observer' })).status).toBe(403);
    expect((await agent.patch(`/api/v1/users/${target.id}`).send({ role: 'admin', version: target.version })).status).toBe(403);
  });

  it('signed out, every user route is 401', async () => {
    expect((await request(app).get('/api/v1/users')).status).toBe(401);
    expect((await request(app).post('/api/v1/users').send({})).status).toBe(401);
  });

  it('an admin lists only the users of their own organisation', async () => {
    const agent = await signedInAgent(app, DEMO.admin);
    const res = await agent.get('/api/v1/users').expect(200);
    const emails = res.body.items.map((u: { email: string }) => u.email);
    expect(emails).toEqual(expect.arrayContaining([DEMO.admin, DEMO.planner, DEMO.reviewer, DEMO.observer]));
    expect(emails).not.toContain(DEMO.otherAdmin);
    expect(emails).not.toContain(DEMO.otherPlanner);
    expect(res.body.items[0]).not.toHaveProperty('passwordHash');
  });

  it("an admin of another organisation gets 404 for this organisation's user", async () => {
    const agent = await signedInAgent(app, DEMO.otherAdmin);
    const target = await idOf(DEMO.planner);
    const res = await agent.patch(`/api/v1/users/${target.id}`).send({ role: 'observer', version: target.version });
    expect(res.status).toBe(404);
    expect((await idOf(DEMO.planner)).role).toBe('planner');
  });
});

describe('PATCH /api/v1/users/:id', () => {
  it('changes a role, bumping the version, and refuses the stale version with 409', async () => {
    const agent = await signedInAgent(app, DEMO.admin);
    const before = await idOf(DEMO.observer);
    const first = await agent.patch(`/api/v1/users/${before.id}`).send({ role: 'reviewer', version: before.version });
    expect(first.status).toBe(200);
    expect(first.body.user).toMatchObject({ role: 'reviewer', version: before.version + 1 });
    const stale = await agent.patch(`/api/v1/users/${before.id}`).send({ role: 'planner', version: before.version });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('stale_version');
    expect((await idOf(DEMO.observer)).role).toBe('reviewer');
    await agent
      .patch(`/api/v1/users/${before.id}`)
      .send({ role: 'observer', version: before.version + 1 })
      .expect(200);
  });

  it('will not deactivate or demote the last active admin', async () => {
    const agent = await signedInAgent(app, DEMO.admin);
    const me = await idOf(DEMO.admin);
    const res = await agent.patch(`/api/v1/users/${me.id}`).send({ active: false, version: me.version });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('last_admin');
    expect((await idOf(DEMO.admin)).active).toBe(true);
  });

  it('answers bad input with field errors and changes nothing', async () => {
    const agent = await signedInAgent(app, DEMO.admin);
    const target = await idOf(DEMO.reviewer);
    const res = await agent.patch(`/api/v1/users/${target.id}`).send({ role: 'captain' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty('role');
    expect(res.body.error.fields).toHaveProperty('version');
    const bad = await agent.patch('/api/v1/users/not-a-uuid').send({ role: 'planner', version: 0 });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toHaveProperty('userId');
    expect((await idOf(DEMO.reviewer)).role).toBe('reviewer');
  });
});

describe('invitations', () => {
  it('invites a user who sets a password through the one-time link and signs in', async () => {
    const agent = await signedInAgent(app, DEMO.admin);
    const res = await agent
      .post('/api/v1/users')
      .send({ email: 'New.Watcher@Demo.Kenning.test', name: 'Nell Harrow', role: 'observer' });
    expect(res.status).toBe(201);
    expect(res.body.user).toMatchObject({ email: 'new.watcher@demo.kenning.test', status: 'invited', role: 'observer' });
    const token = new URL(res.body.setPasswordUrl).searchParams.get('token');
    expect(token).toBeTruthy();

    // Not yet able to sign in.
    await request(app)
      .post('/api/auth/sign-in')
      .send({ email: 'new.watcher@demo.kenning.test', password: 'a-good-long-password' })
      .expect(401);
    const short = await request(app).post('/api/auth/set-password').send({ token, password: 'short' });
    expect(short.status).toBe(400);
    expect(short.body.error.fields).toHaveProperty('password');
    await request(app).post('/api/auth/set-password').send({ token, password: 'a-good-long-password' }).expect(204);
    // The link works once.
    const again = await request(app).post('/api/auth/set-password').send({ token, password: 'another-long-password' });
    expect(again.status).toBe(400);
    expect(again.body.error.code).toBe('invalid_token');
    const signIn = await request(app)
      .post('/api/auth/sign-in')
      .send({ email: 'new.watcher@demo.kenning.test', password: 'a-good-long-password' });
    expect(signIn.status).toBe(200);
    expect(signIn.body.user.organization.name).toBe('Harrowmere Lookout Service');
  });

  it('refuses an e-mail already in use with 409 on the e-mail field and writes nothing', async () => {
    const agent = await signedInAgent(app, DEMO.admin);
    const before = await UserModel.count();
    const res = await agent.post('/api/v1/users').send({ email: DEMO.otherPlanner, name: 'Dup', role: 'planner' });
    expect(res.status).toBe(409);
    expect(res.body.error.fields).toHaveProperty('email');
    expect(await UserModel.count()).toBe(before);
  });

  it('answers a malformed invitation with a reason per field', async () => {
    const agent = await signedInAgent(app, DEMO.admin);
    const before = await UserModel.count();
    const res = await agent.post('/api/v1/users').send({ email: 'nope', name: '', role: 'chief' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['email', 'name', 'role']);
    expect(await UserModel.count()).toBe(before);
  });
});
