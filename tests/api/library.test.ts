import type { Express } from 'express';
import { AuditEventModel, TargetProfileModel } from '@/server/data/models';
import { STARTER_CONDITION_SETS, STARTER_TARGETS } from '@/server/seeders/demo';
import { createTestApp } from '@/tests/support/test-db';
import { DEMO, signedInAgent } from '@/tests/support/agents';

let app: Express;
let close: () => Promise<void>;

beforeAll(async () => {
  ({ app, close } = await createTestApp());
});
afterAll(() => close());

const target = { name: 'Test kayak', kind: 'small-craft', heightM: 0.8, widthM: 0.6, requiredVisibleM: 0.3, period: 'day' };

describe('target and condition libraries', () => {
  it('every organisation starts with the starter libraries, and sees only its own', async () => {
    for (const email of [DEMO.observer, DEMO.otherPlanner]) {
      const agent = await signedInAgent(app, email);
      const t = await agent.get('/api/v1/targets').expect(200);
      expect(t.body.items).toHaveLength(STARTER_TARGETS.length);
      const c = await agent.get('/api/v1/conditions').expect(200);
      expect(c.body.items).toHaveLength(STARTER_CONDITION_SETS.length);
    }
    const mine = (await (await signedInAgent(app, DEMO.planner)).get('/api/v1/targets')).body.items.map(
      (t: { id: string }) => t.id,
    );
    const theirs = (await (await signedInAgent(app, DEMO.otherPlanner)).get('/api/v1/targets')).body.items.map(
      (t: { id: string }) => t.id,
    );
    expect(mine.filter((id: string) => theirs.includes(id))).toEqual([]);
  });

  it('pages, searches and sorts a library', async () => {
    const agent = await signedInAgent(app, DEMO.observer);
    const page = (await agent.get('/api/v1/targets?pageSize=2&sort=-name').expect(200)).body;
    expect(page).toMatchObject({ total: STARTER_TARGETS.length, page: 1, pageSize: 2 });
    const names = STARTER_TARGETS.map((t) => t.name).sort((a, b) => b.localeCompare(a, 'en'));
    expect(page.items.map((t: { name: string }) => t.name)).toEqual(names.slice(0, 2));
    const found = (await agent.get('/api/v1/conditions?q=inversion').expect(200)).body.items;
    expect(found.map((c: { name: string }) => c.name)).toEqual(['Cold sea, inversion']);
    expect((await agent.get('/api/v1/targets?sort=weight')).body.error.fields).toHaveProperty('sort');
  });

  it('a planner adds, edits (with versions) and removes a target; others get 403 or 404', async () => {
    const planner = await signedInAgent(app, DEMO.planner);
    const created = await planner.post('/api/v1/targets').send(target);
    expect(created.status).toBe(201);
    const id = created.body.target.id;
    expect(created.body.target).toMatchObject({ ...target, version: 0 });

    expect((await (await signedInAgent(app, DEMO.reviewer)).post('/api/v1/targets').send(target)).status).toBe(403);
    expect(
      (await (await signedInAgent(app, DEMO.otherPlanner)).patch(`/api/v1/targets/${id}`).send({ name: 'Mine now', version: 0 }))
        .status,
    ).toBe(404);

    const edited = await planner.patch(`/api/v1/targets/${id}`).send({ heightM: 1.0, version: 0 });
    expect(edited.body.target).toMatchObject({ heightM: 1.0, version: 1 });
    expect((await planner.patch(`/api/v1/targets/${id}`).send({ heightM: 2, version: 0 })).status).toBe(409);
    // An edit that would make the required part exceed the height is refused on that field.
    const tooTall = await planner.patch(`/api/v1/targets/${id}`).send({ requiredVisibleM: 5, version: 1 });
    expect(tooTall.status).toBe(400);
    expect(tooTall.body.error.fields).toHaveProperty('requiredVisibleM');

    await planner.delete(`/api/v1/targets/${id}`).expect(204);
    expect(await TargetProfileModel.findByPk(id, { paranoid: false })).not.toBeNull();
    expect(await AuditEventModel.count({ where: { entityId: id } })).toBe(3);
  });

  it('answers bad input with field errors and writes nothing', async () => {
    const planner = await signedInAgent(app, DEMO.planner);
    const before = await TargetProfileModel.count();
    const bad = await planner.post('/api/v1/targets').send({ name: '', kind: 'dragon', heightM: -1, widthM: 0 });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields)).toEqual(expect.arrayContaining(['name', 'kind', 'heightM', 'widthM']));
    expect(await TargetProfileModel.count()).toBe(before);
    const badSet = await planner.post('/api/v1/conditions').send({ name: 'Odd', conditions: [{ k: 50 }, { preset: 'nope' }] });
    expect(badSet.status).toBe(400);
    expect(Object.keys(badSet.body.error.fields)).toEqual(expect.arrayContaining(['conditions.0.k', 'conditions.1.preset']));
  });

  it('a condition set is saved whole and parsed conditions come back', async () => {
    const planner = await signedInAgent(app, DEMO.planner);
    const res = await planner.post('/api/v1/conditions').send({
      name: 'Measured morning',
      conditions: [{ pressureHpa: 1002, temperatureC: 6, lapseRateKPerM: -0.01 }],
      visibilityM: 15000,
    });
    expect(res.status).toBe(201);
    expect(res.body.conditionSet).toMatchObject({
      name: 'Measured morning',
      conditions: [{ pressureHpa: 1002, temperatureC: 6, lapseRateKPerM: -0.01 }],
      visibilityM: 15000,
      visibilityKind: 'mor-5pct',
    });
  });
});
