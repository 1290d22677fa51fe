import type { Express } from 'express';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { polygonsFromGeoJson } from '@/shared/geo/polygons-from-geojson';
import { AuditEventModel, PlanModel, PostModel, SiteModel } from '@/server/data/models';
import { createTestApp } from '@/tests/support/test-db';
import { DEMO, signedInAgent } from '@/tests/support/agents';

let app: Express;
let close: () => Promise<void>;
let planner: Awaited<ReturnType<typeof signedInAgent>>;

// An invented district, [lon, lat] corners.
const RING: [number, number][] = [
  [12.0, 60.0],
  [12.3, 60.0],
  [12.3, 60.2],
  [12.0, 60.2],
];
// The same corners in another order: its sides cross (a "bow tie").
const BOW_TIE: [number, number][] = [
  [12.0, 60.0],
  [12.3, 60.2],
  [12.3, 60.0],
  [12.0, 60.2],
];

beforeAll(async () => {
  ({ app, close } = await createTestApp());
  planner = await signedInAgent(app, DEMO.planner);
});
afterAll(() => close());

describe('site setup through the API', () => {
  it('creates a site with every setup field and reads it back', async () => {
    const res = await planner.post('/api/v1/sites').send({
      name: 'Setup district',
      kind: 'coast-stretch',
      notes: 'Invented for a test.',
      defaultUnits: 'nautical',
      timeZone: 'Europe/Oslo',
      boundary: RING,
      priorityZones: [{ name: 'Harbour mouth', weight: 9, ring: RING.slice(0, 3) }],
    });
    expect(res.status).toBe(201);
    expect(res.body.site).toMatchObject({
      name: 'Setup district',
      kind: 'coast-stretch',
      defaultUnits: 'nautical',
      timeZone: 'Europe/Oslo',
      priorityZones: [{ name: 'Harbour mouth', weight: 9 }],
    });
    const read = await planner.get(`/api/v1/sites/${res.body.site.id}`).expect(200);
    expect(read.body.site.boundary).toEqual([...RING, RING[0]]);
  });

  it('answers a bad zone with the zone’s own field paths and writes nothing', async () => {
    const before = await SiteModel.count();
    const res = await planner.post('/api/v1/sites').send({
      name: 'Bad zones',
      kind: 'forest-district',
      priorityZones: [
        { name: 'Fine', weight: 5, ring: RING },
        { name: '', weight: 11, ring: RING },
      ],
    });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toMatchObject({
      'priorityZones.1.name': 'Name the zone.',
      'priorityZones.1.weight': 'Weight is 1 to 10.',
    });
    expect(await SiteModel.count()).toBe(before);
  });

  it('refuses a self-intersecting boundary or zone, naming the field and where it crosses', async () => {
    const res = await planner.post('/api/v1/sites').send({ name: 'Crossed', kind: 'search-area', boundary: BOW_TIE });
    expect(res.status).toBe(400);
    // The bow tie's diagonals cross at the middle of the rectangle (plain geometry, common practice, no source).
    expect(res.body.error.fields.boundary).toMatch(/crosses itself near 60\.10000, 12\.15000/);

    const { body } = await planner
      .post('/api/v1/sites')
      .send({ name: 'Uncrossed', kind: 'search-area', boundary: RING })
      .expect(201);
    const zone = await planner
      .patch(`/api/v1/sites/${body.site.id}`)
      .send({ priorityZones: [{ name: 'Twisted', weight: 3, ring: BOW_TIE }], version: body.site.version });
    expect(zone.status).toBe(400);
    expect(zone.body.error.fields['priorityZones.0.ring']).toMatch(/crosses itself/);
    expect((await planner.get(`/api/v1/sites/${body.site.id}`)).body.site.priorityZones).toEqual([]);
  });

  it('updates a site: bad fields are refused field by field and change nothing; good ones are audited', async () => {
    const { body } = await planner.post('/api/v1/sites').send({ name: 'To edit', kind: 'forest-district' }).expect(201);
    const bad = await planner
      .patch(`/api/v1/sites/${body.site.id}`)
      .send({ name: ' ', timeZone: 'Nowhere/Land', defaultUnits: 'cubits', version: body.site.version });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields)).toEqual(expect.arrayContaining(['name', 'timeZone', 'defaultUnits']));
    const good = await planner.patch(`/api/v1/sites/${body.site.id}`).send({
      name: 'Edited',
      timeZone: 'America/Anchorage',
      defaultUnits: 'imperial',
      boundary: RING,
      version: body.site.version,
    });
    expect(good.status).toBe(200);
    expect(good.body.site).toMatchObject({ name: 'Edited', timeZone: 'America/Anchorage', defaultUnits: 'imperial', version: 1 });
    expect(await AuditEventModel.count({ where: { entityId: body.site.id, action: 'update' } })).toBe(1);
  });

  it('refuses to delete a site approved plans depend on, with a readable reason, and keeps it', async () => {
    const demo = await SiteModel.findOne({ where: { name: 'Harrowmere Forest District' } });
    const res = await planner.delete(`/api/v1/sites/${demo!.id}`);
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('site_has_approved_plans');
    expect(res.body.error.message).toMatch(/approved plan.*cannot be deleted/);
    expect(await SiteModel.findByPk(demo!.id)).not.toBeNull();
  });

  it('takes outlines imported from GeoJSON: a polygon with a hole as the boundary, a MultiPolygon’s parts as zones', async () => {
    // The app reads the file with the shared importer and sends rings; the server checks them with the same ring schema.
    const read = (name: string) =>
      polygonsFromGeoJson(readFileSync(path.join(__dirname, '..', 'fixtures', 'geojson', name), 'utf8'));
    const [district] = read('lake-district-with-hole.geojson');
    const parts = read('island-parts.geojson');
    // Source: tests/fixtures/geojson/README.md (GDAL 3.6.2): 1 hole; 3 parts.
    expect(district!.holes).toBe(1);
    expect(parts).toHaveLength(3);
    const res = await planner.post('/api/v1/sites').send({
      name: district!.name,
      kind: 'coast-stretch',
      boundary: district!.ring,
      priorityZones: parts.map((p) => ({ name: p.name, weight: 4, ring: p.ring })),
    });
    expect(res.status).toBe(201);
    expect(res.body.site.boundary).toEqual(district!.ring);
    expect(res.body.site.priorityZones.map((z: { name: string }) => z.name)).toEqual([
      'Skerry group, part 1',
      'Skerry group, part 2',
      'Skerry group, part 3',
    ]);
    expect(res.body.site.priorityZones[1].ring).toEqual(parts[1]!.ring);
  });

  it('refuses the crossed GeoJSON outline when sent as a boundary', async () => {
    const text = readFileSync(path.join(__dirname, '..', 'fixtures', 'geojson', 'crossed-outline.geojson'), 'utf8');
    const ring = JSON.parse(text).coordinates[0];
    const res = await planner.post('/api/v1/sites').send({ name: 'Crossed import', kind: 'search-area', boundary: ring });
    expect(res.status).toBe(400);
    // Source: tests/fixtures/geojson/README.md — SpatiaLite reports Self-intersection[13.2 60.6].
    expect(res.body.error.fields.boundary).toMatch(/crosses itself near 60\.60000, 13\.20000/);
  });

  it('lets only planners create, edit or delete sites', async () => {
    const reviewer = await signedInAgent(app, DEMO.reviewer);
    expect((await reviewer.post('/api/v1/sites').send({ name: 'Nope', kind: 'search-area' })).status).toBe(403);
  });
});

describe('deleting posts', () => {
  it.each(['approved', 'submitted'] as const)(
    'refuses a post used by a %s plan with 409, naming the plan, and keeps it',
    async (status) => {
      const plan = await PlanModel.findOne({ where: { status } });
      const postId = plan!.postIds[0]!;
      const post = await PostModel.findByPk(postId);
      const res = await planner.delete(`/api/v1/sites/${post!.siteId}/posts/${postId}`);
      expect(res.status).toBe(409);
      expect(res.body.error.code).toBe('post_in_frozen_plan');
      expect(res.body.error.message).toContain(`“${plan!.title}” (${status})`);
      expect(res.body.error.message).toMatch(/cannot be deleted/);
      expect((await planner.get(`/api/v1/sites/${post!.siteId}/posts/${postId}`)).status).toBe(200);
      expect(await AuditEventModel.count({ where: { entityId: postId, action: 'delete' } })).toBe(0);
    },
  );

  it('soft-deletes a post no submitted or approved plan uses', async () => {
    const { body } = await planner.post('/api/v1/sites').send({ name: 'Post host', kind: 'forest-district' }).expect(201);
    const created = await planner
      .post(`/api/v1/sites/${body.site.id}/posts`)
      .send({ name: 'Spare hill', kind: 'hilltop', location: { latDeg: 60.1, lonDeg: 12.1 }, groundElevationM: 300 })
      .expect(201);
    await planner.delete(`/api/v1/sites/${body.site.id}/posts/${created.body.post.id}`).expect(204);
    expect((await planner.get(`/api/v1/sites/${body.site.id}/posts/${created.body.post.id}`)).status).toBe(404);
    expect(await PostModel.findByPk(created.body.post.id, { paranoid: false })).not.toBeNull();
  });
});
