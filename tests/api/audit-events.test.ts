import type { Express } from 'express';
import request from 'supertest';
import { AuditEventListSchema } from '@/shared/schemas/audit';
import { UserModel } from '@/server/data/models';
import { createTestApp } from '@/tests/support/test-db';
import { DEMO, signedInAgent } from '@/tests/support/agents';

let app: Express;
let close: () => Promise<void>;
let siteId: string;
const RING: [number, number][] = [
  [12.0, 60.0],
  [12.3, 60.0],
  [12.3, 60.2],
];

beforeAll(async () => {
  ({ app, close } = await createTestApp());
  const planner = await signedInAgent(app, DEMO.planner);
  const created = await planner.post('/api/v1/sites').send({ name: 'Audited district', kind: 'forest-district' }).expect(201);
  siteId = created.body.site.id;
  await planner
    .patch(`/api/v1/sites/${siteId}`)
    .send({ name: 'Audited district (renamed)', timeZone: 'Europe/Oslo', boundary: RING, version: 0 })
    .expect(200);
});
afterAll(() => close());

describe('GET /api/v1/audit-events', () => {
  it('gives administrators and reviewers one record’s history, newest first, with who and what changed', async () => {
    const planner = await UserModel.findOne({ where: { email: DEMO.planner } });
    for (const email of [DEMO.admin, DEMO.reviewer]) {
      const agent = await signedInAgent(app, email);
      const res = await agent.get(`/api/v1/audit-events?entityType=site&entityId=${siteId}`).expect(200);
      expect(res.body.total).toBe(2);
      // The app reads the answer with the shared schema.
      expect(AuditEventListSchema.safeParse(res.body).error?.issues ?? []).toEqual([]);
      const [update, create] = res.body.items;
      expect(create).toMatchObject({ action: 'create', entityType: 'site', entityId: siteId, entityName: 'Audited district' });
      expect(update).toMatchObject({
        action: 'update',
        entityName: 'Audited district (renamed)',
        actor: { id: planner!.id, name: planner!.name },
      });
      const byField = Object.fromEntries(update.changes.map((c: { field: string }) => [c.field, c]));
      expect(byField.name).toEqual({ field: 'name', before: 'Audited district', after: 'Audited district (renamed)' });
      expect(byField.timeZone).toMatchObject({ before: 'UTC', after: 'Europe/Oslo' });
      expect(byField.boundary).toMatchObject({ before: null, after: [...RING, RING[0]] });
      // Bookkeeping fields and unchanged ones are left out.
      expect(Object.keys(byField)).not.toEqual(expect.arrayContaining(['version']));
      expect(byField.kind).toBeUndefined();
      expect(Date.parse(update.at)).toBeGreaterThanOrEqual(Date.parse(create.at));
    }
  });

  it('filters the organisation’s trail by kind, person and time', async () => {
    const admin = await signedInAgent(app, DEMO.admin);
    const planner = await UserModel.findOne({ where: { email: DEMO.planner } });
    const byPlanner = await admin.get(`/api/v1/audit-events?actorId=${planner!.id}&entityType=site&pageSize=200`).expect(200);
    expect(byPlanner.body.items.length).toBeGreaterThanOrEqual(2);
    expect(
      byPlanner.body.items.every(
        (e: { actor: { id: string }; entityType: string }) => e.actor.id === planner!.id && e.entityType === 'site',
      ),
    ).toBe(true);
    const past = await admin.get('/api/v1/audit-events?to=2000-01-01T00:00:00Z').expect(200);
    expect(past.body.total).toBe(0);
    const recent = await admin
      .get(`/api/v1/audit-events?from=${new Date(Date.now() - 3_600_000).toISOString()}&entityId=${siteId}`)
      .expect(200);
    expect(recent.body.total).toBe(2);
    const bad = await admin.get('/api/v1/audit-events?entityType=volcano&from=yesterday&pageSize=1000');
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields)).toEqual(expect.arrayContaining(['entityType', 'from', 'pageSize']));
  });

  it('is refused to planners and observers (403) and to the signed-out (401)', async () => {
    for (const email of [DEMO.planner, DEMO.observer]) {
      const agent = await signedInAgent(app, email);
      expect((await agent.get('/api/v1/audit-events')).status).toBe(403);
    }
    expect((await request(app).get('/api/v1/audit-events')).status).toBe(401);
  });

  it('keeps each organisation’s trail to itself: another organisation gets 404 for the record and never sees its events', async () => {
    const other = await signedInAgent(app, DEMO.otherAdmin);
    const one = await other.get(`/api/v1/audit-events?entityId=${siteId}`);
    expect(one.status).toBe(404);
    expect(one.body.error.code).toBe('not_found');
    const all = await other.get('/api/v1/audit-events?pageSize=200').expect(200);
    expect(all.body.items.some((e: { entityId: string }) => e.entityId === siteId)).toBe(false);
  });
});
