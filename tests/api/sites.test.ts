import type { Express } from 'express';
import request from 'supertest';
import { AuditEventModel, OrganizationModel, PostModel, SiteModel } from '@/server/data/models';
import { createTestApp } from '@/tests/support/test-db';
import { DEMO, signedInAgent } from '@/tests/support/agents';

let app: Express;
let close: () => Promise<void>;
let planner: Awaited<ReturnType<typeof signedInAgent>>;

// An invented square district, [lon, lat] corners.
const RING: [number, number][] = [
  [14.0, 61.0],
  [14.2, 61.0],
  [14.2, 61.1],
  [14.0, 61.1],
];
const siteBody = {
  name: 'Test district C',
  kind: 'forest-district',
  boundary: RING,
  priorityZones: [{ name: 'Old growth', weight: 8, ring: RING.slice(0, 3) }],
};
const postBody = {
  name: 'Tower T1',
  kind: 'tower',
  location: { latDeg: 61.05, lonDeg: 14.1 },
  groundElevationM: 412,
  structureHeightM: 18,
  eyeHeightM: 1.6,
};

beforeAll(async () => {
  ({ app, close } = await createTestApp());
  planner = await signedInAgent(app, DEMO.planner);
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

const names = (res: request.Response) => res.body.items.map((s: { name: string }) => s.name);

describe('GET /api/v1/sites', () => {
  it('lists only the caller organisation’s sites, sorted by name, for every role', async () => {
    for (const email of [DEMO.admin, DEMO.planner, DEMO.reviewer, DEMO.observer]) {
      const agent = await signedInAgent(app, email);
      const res = await agent.get('/api/v1/sites').expect(200);
      expect(names(res)).toEqual(expect.arrayContaining(['Test district A', 'Test district B']));
      expect(names(res)).not.toContain('Other agency coast');
    }
  });

  it('pages, and rejects a bad page size with a field error', async () => {
    const page2 = await planner.get('/api/v1/sites?page=2&pageSize=1').expect(200);
    expect(page2.body).toMatchObject({ page: 2, pageSize: 1 });
    expect(page2.body.items).toHaveLength(1);
    const bad = await planner.get('/api/v1/sites?pageSize=5000');
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toHaveProperty('pageSize');
  });

  it('is 401 signed out', async () => {
    expect((await request(app).get('/api/v1/sites')).status).toBe(401);
  });
});

describe('sites: create, read, edit, delete', () => {
  it('a planner creates a site with its boundary and zones, recorded in the audit trail', async () => {
    const res = await planner.post('/api/v1/sites').send(siteBody);
    expect(res.status).toBe(201);
    const site = res.body.site;
    expect(site.boundary).toEqual([...RING, RING[0]]); // closed ring
    expect(site.priorityZones).toEqual([{ name: 'Old growth', weight: 8, ring: [...RING.slice(0, 3), RING[0]] }]);
    expect(site).toMatchObject({ defaultUnits: 'metric', timeZone: 'UTC', version: 0 });
    const got = await planner.get(`/api/v1/sites/${site.id}`).expect(200);
    expect(got.body.site).toEqual(site);
    expect(await AuditEventModel.count({ where: { entityId: site.id, action: 'create' } })).toBe(1);
  });

  it.each([
    ['reviewer', DEMO.reviewer],
    ['observer', DEMO.observer],
    ['admin', DEMO.admin],
  ])('a %s cannot create, edit or delete sites (403)', async (_role, email) => {
    const agent = await signedInAgent(app, email);
    const site = await SiteModel.findOne({ where: { name: 'Test district A' } });
    expect((await agent.post('/api/v1/sites').send(siteBody)).status).toBe(403);
    expect((await agent.patch(`/api/v1/sites/${site!.id}`).send({ name: 'X', version: site!.version })).status).toBe(403);
    expect((await agent.delete(`/api/v1/sites/${site!.id}`)).status).toBe(403);
  });

  it("another organisation's planner gets 404 on this organisation's site", async () => {
    const other = await signedInAgent(app, DEMO.otherPlanner);
    const site = await SiteModel.findOne({ where: { name: 'Test district A' } });
    expect((await other.get(`/api/v1/sites/${site!.id}`)).status).toBe(404);
    expect((await other.patch(`/api/v1/sites/${site!.id}`).send({ name: 'Taken', version: site!.version })).status).toBe(404);
    expect((await other.delete(`/api/v1/sites/${site!.id}`)).status).toBe(404);
    expect((await other.get(`/api/v1/sites/${site!.id}/posts`)).status).toBe(404);
    expect((await SiteModel.findByPk(site!.id))!.name).toBe('Test district A');
  });

  it('answers bad input with a reason per field and writes nothing', async () => {
    const before = await SiteModel.count();
    const res = await planner
      .post('/api/v1/sites')
      .send({ name: '', kind: 'volcano', boundary: [[200, 10]], timeZone: 'Mars/Olympus' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(expect.arrayContaining(['name', 'kind', 'timeZone']));
    expect(Object.keys(res.body.error.fields).some((k) => k.startsWith('boundary'))).toBe(true);
    expect(await SiteModel.count()).toBe(before);
  });

  it('detects concurrent edits with 409 and overwrites nothing', async () => {
    const { body } = await planner
      .post('/api/v1/sites')
      .send({ ...siteBody, name: 'Edit race' })
      .expect(201);
    const first = await planner.patch(`/api/v1/sites/${body.site.id}`).send({ notes: 'first', version: 0 });
    expect(first.status).toBe(200);
    expect(first.body.site).toMatchObject({ notes: 'first', version: 1 });
    const second = await planner.patch(`/api/v1/sites/${body.site.id}`).send({ notes: 'second', version: 0 });
    expect(second.status).toBe(409);
    expect(second.body.error.code).toBe('stale_version');
    expect((await planner.get(`/api/v1/sites/${body.site.id}`)).body.site.notes).toBe('first');
  });

  it('soft-deletes a site: gone from the lists, kept in the table', async () => {
    const { body } = await planner
      .post('/api/v1/sites')
      .send({ ...siteBody, name: 'To remove' })
      .expect(201);
    await planner.delete(`/api/v1/sites/${body.site.id}`).expect(204);
    await planner.get(`/api/v1/sites/${body.site.id}`).expect(404);
    expect(await SiteModel.findByPk(body.site.id, { paranoid: false })).not.toBeNull();
    expect(await AuditEventModel.count({ where: { entityId: body.site.id, action: 'delete' } })).toBe(1);
  });
});

describe('posts of a site', () => {
  it('a planner adds, edits and removes a post; every role lists them', async () => {
    const { body } = await planner
      .post('/api/v1/sites')
      .send({ ...siteBody, name: 'With posts' })
      .expect(201);
    const siteId = body.site.id;
    const created = await planner
      .post(`/api/v1/sites/${siteId}/posts`)
      .send({ ...postBody, sector: { fromDeg: 300, toDeg: 60 } });
    expect(created.status).toBe(201);
    expect(created.body.post).toMatchObject({ ...postBody, sector: { fromDeg: 300, toDeg: 60 }, status: 'existing', version: 0 });
    const observer = await signedInAgent(app, DEMO.observer);
    const list = await observer.get(`/api/v1/sites/${siteId}/posts`).expect(200);
    expect(list.body.items.map((p: { name: string }) => p.name)).toEqual(['Tower T1']);
    expect((await observer.post(`/api/v1/sites/${siteId}/posts`).send(postBody)).status).toBe(403);

    const postId = created.body.post.id;
    const edited = await planner.patch(`/api/v1/sites/${siteId}/posts/${postId}`).send({ structureHeightM: 24, version: 0 });
    expect(edited.body.post).toMatchObject({ structureHeightM: 24, version: 1, location: postBody.location });
    expect(
      (await planner.patch(`/api/v1/sites/${siteId}/posts/${postId}`).send({ structureHeightM: 30, version: 0 })).status,
    ).toBe(409);

    const listed = await planner.get('/api/v1/sites?pageSize=200').expect(200);
    expect(listed.body.items.find((s: { id: string }) => s.id === siteId).postCount).toBe(1);

    await planner.delete(`/api/v1/sites/${siteId}/posts/${postId}`).expect(204);
    expect((await planner.get(`/api/v1/sites/${siteId}/posts`)).body.items).toEqual([]);
    expect(await AuditEventModel.count({ where: { entityId: postId } })).toBe(3);
  });

  it('pages, filters and sorts a site’s posts', async () => {
    const { body } = await planner
      .post('/api/v1/sites')
      .send({ ...siteBody, name: 'Many posts' })
      .expect(201);
    const siteId = body.site.id;
    for (const [name, kind, status] of [
      ['Post C', 'tower', 'existing'],
      ['Post A', 'shore-post', 'proposed'],
      ['Post B', 'tower', 'proposed'],
    ] as const) {
      await planner
        .post(`/api/v1/sites/${siteId}/posts`)
        .send({ ...postBody, name, kind, status })
        .expect(201);
    }
    const names = (res: request.Response) => res.body.items.map((p: { name: string }) => p.name);
    const all = await planner.get(`/api/v1/sites/${siteId}/posts`).expect(200);
    expect(names(all)).toEqual(['Post A', 'Post B', 'Post C']);
    expect(all.body).toMatchObject({ total: 3, page: 1, pageSize: 200 });
    expect(names(await planner.get(`/api/v1/sites/${siteId}/posts?sort=-name&pageSize=2`))).toEqual(['Post C', 'Post B']);
    expect(names(await planner.get(`/api/v1/sites/${siteId}/posts?kind=tower&status=proposed`))).toEqual(['Post B']);
    expect(names(await planner.get(`/api/v1/sites/${siteId}/posts?q=t%20a`))).toEqual(['Post A']);
    // LIKE wildcards in the search text are taken literally.
    expect(names(await planner.get(`/api/v1/sites/${siteId}/posts?q=%25`))).toEqual([]);
    const one = (await planner.get(`/api/v1/sites/${siteId}/posts?q=post%20b`)).body.items[0];
    expect((await planner.get(`/api/v1/sites/${siteId}/posts/${one.id}`).expect(200)).body.post).toEqual(one);
    const other = await signedInAgent(app, DEMO.otherPlanner);
    expect((await other.get(`/api/v1/sites/${siteId}/posts/${one.id}`)).status).toBe(404);
    const bad = await planner.get(`/api/v1/sites/${siteId}/posts?sort=height&kind=balloon&pageSize=9999`);
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields)).toEqual(expect.arrayContaining(['sort', 'kind', 'pageSize']));
  });

  it('refuses to delete a site with an approved plan, and deletes one without', async () => {
    const demo = await SiteModel.findOne({ where: { name: 'Harrowmere Forest District' } });
    const refused = await planner.delete(`/api/v1/sites/${demo!.id}`);
    expect(refused.status).toBe(409);
    expect(refused.body.error).toMatchObject({
      code: 'site_has_approved_plans',
      message: expect.stringMatching(/approved plan/),
    });
    expect((await planner.get(`/api/v1/sites/${demo!.id}`)).status).toBe(200);

    const { body } = await planner
      .post('/api/v1/sites')
      .send({ ...siteBody, name: 'Short-lived' })
      .expect(201);
    await planner.delete(`/api/v1/sites/${body.site.id}`).expect(204);
    expect((await planner.get(`/api/v1/sites/${body.site.id}`)).status).toBe(404);
  });

  it('answers bad post input with field errors and writes nothing', async () => {
    const site = await SiteModel.findOne({ where: { name: 'Test district A' } });
    const before = await PostModel.count();
    const res = await planner.post(`/api/v1/sites/${site!.id}/posts`).send({
      name: 'Bad',
      kind: 'balloon',
      location: { latDeg: 95, lonDeg: 0 },
      groundElevationM: 'high',
      eyeHeightM: -1,
      sector: { fromDeg: 400, toDeg: 10 },
    });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(
      expect.arrayContaining(['kind', 'location.latDeg', 'groundElevationM', 'eyeHeightM', 'sector.fromDeg']),
    );
    expect(await PostModel.count()).toBe(before);
  });
});
