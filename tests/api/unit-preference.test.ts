import type { Express } from 'express';
import { AuditEventModel, UserModel } from '@/server/data/models';
import { createTestApp } from '@/tests/support/test-db';
import { DEMO, signedInAgent } from '@/tests/support/agents';

let app: Express;
let close: () => Promise<void>;

beforeAll(async () => {
  ({ app, close } = await createTestApp());
});
afterAll(() => close());

// Source: issue 11 "Units everywhere" — a personal unit preference on the account page, stored on the
// server, the site's default units applying when the person has not chosen (product contract, no outside source).
describe('PATCH /api/me { unitPreference }', () => {
  it('stores the choice, shows it in /api/me and leaves the account version alone', async () => {
    const agent = await signedInAgent(app, DEMO.reviewer);
    const before = (await UserModel.findOne({ where: { email: DEMO.reviewer } }))!;
    expect((await agent.get('/api/me').expect(200)).body.user.unitPreference ?? null).toBeNull();

    const res = await agent.patch('/api/me').send({ unitPreference: 'nautical' }).expect(200);
    expect(res.body.user).toMatchObject({ email: DEMO.reviewer, unitPreference: 'nautical' });
    expect((await agent.get('/api/me').expect(200)).body.user.unitPreference).toBe('nautical');
    const after = (await UserModel.findOne({ where: { email: DEMO.reviewer } }))!;
    expect(after.unitPreference).toBe('nautical');
    expect(after.version).toBe(before.version);
    const events = await AuditEventModel.findAll({ where: { entityId: before.id, action: 'set-unit-preference' } });
    expect(events).toHaveLength(1);

    // null goes back to each site's default.
    await agent.patch('/api/me').send({ unitPreference: null }).expect(200);
    expect((await agent.get('/api/me').expect(200)).body.user.unitPreference ?? null).toBeNull();
  });

  it('answers a unit system it does not know with a 400 naming the field, and changes nothing', async () => {
    const agent = await signedInAgent(app, DEMO.observer);
    await agent.patch('/api/me').send({ unitPreference: 'imperial' }).expect(200);
    const res = await agent.patch('/api/me').send({ unitPreference: 'cubits' });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_input');
    expect(res.body.error.fields.unitPreference).toMatch(/metric, nautical or imperial/);
    expect((await agent.get('/api/me').expect(200)).body.user.unitPreference).toBe('imperial');
    const missing = await agent.patch('/api/me').send({});
    expect(missing.status).toBe(400);
    expect(Object.keys(missing.body.error.fields)).toEqual(['unitPreference']);
  });

  it('is 401 when signed out', async () => {
    const { default: request } = await import('supertest');
    expect((await request(app).patch('/api/me').send({ unitPreference: 'metric' })).status).toBe(401);
  });
});
