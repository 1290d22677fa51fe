import type { Express } from 'express';
import request from 'supertest';
import { OrganizationModel, SiteModel } from '@/server/data/models';
import { createTestApp } from '@/tests/support/test-db';
import { DEMO, signedInAgent } from '@/tests/support/agents';

let app: Express;
let close: () => Promise<void>;

beforeAll(async () => {
  ({ app, close } = await createTestApp());
  const [home, other] = await Promise.all([
    OrganizationModel.findOne({ where: { slug: 'harrowmere' } }),
    OrganizationModel.findOne({ where: { slug: 'tallon-bay' } }),
  ]);
  await SiteModel.bulkCreate([
    { organizationId: home!.id, name: 'Test district B', kind: 'forest-district' },
    { organizationId: home!.id, name: 'Test district A', kind: 'forest-district' },
    { organizationId: other!.id, name: 'Other agency coast', kind: 'coast-stretch' },
  ]);
});
afterAll(() => close());

describe('GET /api/v1/sites', () => {
  it('lists only the caller organisation’s sites, sorted by name, for every role', async () => {
    for (const email of [DEMO.admin, DEMO.planner, DEMO.reviewer, DEMO.observer]) {
      const agent = await signedInAgent(app, email);
      const res = await agent.get('/api/v1/sites').expect(200);
      expect(res.body.items.map((s: { name: string }) => s.name)).toEqual(['Test district A', 'Test district B']);
      expect(res.body.total).toBe(2);
    }
    const other = await signedInAgent(app, DEMO.otherPlanner);
    const res = await other.get('/api/v1/sites').expect(200);
    expect(res.body.items.map((s: { name: string }) => s.name)).toEqual(['Other agency coast']);
  });

  it('pages, and rejects a bad page size with a field error', async () => {
    const agent = await signedInAgent(app, DEMO.planner);
    const page2 = await agent.get('/api/v1/sites?page=2&pageSize=1').expect(200);
    expect(page2.body).toMatchObject({ page: 2, pageSize: 1, total: 2 });
    expect(page2.body.items.map((s: { name: string }) => s.name)).toEqual(['Test district B']);
    const bad = await agent.get('/api/v1/sites?pageSize=5000');
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toHaveProperty('pageSize');
  });

  it('is 401 signed out', async () => {
    expect((await request(app).get('/api/v1/sites')).status).toBe(401);
  });
});
