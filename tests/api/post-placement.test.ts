import { readFileSync } from 'node:fs';
import path from 'node:path';
import type { Express } from 'express';
import request from 'supertest';
import { AuditEventModel, PostModel } from '@/server/data/models';
import { DEMO, signedInAgent } from '@/tests/support/agents';
import { createTestApp } from '@/tests/support/test-db';

jest.setTimeout(120_000);

// The invented fixture terrain: 160 × 150 cells of 30 m in WGS 84 / UTM zone 29N (tests/fixtures/terrain/README.md).
const TIF = readFileSync(path.join(__dirname, '..', 'fixtures', 'terrain', 'small-hill-utm29.tif'));
// Source: GDAL 3.6.2 — gdaltransform (EPSG:32629 → EPSG:4326) and gdallocationinfo of the fixture at two cell centres
// (426 605, 5 719 805) and (428 885, 5 718 005).
const HILL_TOP = { latDeg: 51.6244749493231, lonDeg: -10.0602753124699, heightM: 285 };
const RIDGE = { latDeg: 51.6085855435892, lonDeg: -10.0269785516961, heightM: 144 };
// Source: GDAL 3.6.2 gdaltransform of the outermost cell centres (SW, SE, NE, NW) and the middle of the south row.
const FOOTPRINT_CORNERS: [number, number][] = [
  [-10.0826434182533, 51.5991833552387],
  [-10.0137855252758, 51.5997982498853],
  [-10.0146814441371, 51.6399841441911],
  [-10.0836001612327, 51.6393683684723],
];
const SOUTH_MIDDLE: [number, number] = [-10.0482147774602, 51.5994958504581];

let app: Express;
let close: () => Promise<void>;
let planner: request.Agent;
let reviewer: request.Agent;
let otherPlanner: request.Agent;

const post = (name: string, at: { latDeg: number; lonDeg: number }) => ({
  name,
  kind: 'shore-post',
  location: { latDeg: at.latDeg, lonDeg: at.lonDeg },
  groundElevationM: 12,
  structureHeightM: 6,
  eyeHeightM: 1.7,
  sector: { fromDeg: 200, toDeg: 20 },
  status: 'proposed',
});

async function siteWith(agent: request.Agent, name: string, terrain: boolean) {
  const site = (await agent.post('/api/v1/sites').send({ name, kind: 'coast-stretch' }).expect(201)).body.site;
  if (terrain) await agent.post(`/api/v1/sites/${site.id}/terrain`).attach('file', TIF, 'small-hill-utm29.tif').expect(201);
  return site as { id: string; version: number; boundary: [number, number][] | null };
}

beforeAll(async () => {
  ({ app, close } = await createTestApp());
  [planner, reviewer, otherPlanner] = await Promise.all([
    signedInAgent(app, DEMO.planner),
    signedInAgent(app, DEMO.reviewer),
    signedInAgent(app, DEMO.otherPlanner),
  ]);
});
afterAll(() => close());

describe('POST /api/v1/sites/:siteId/posts/:postId/duplicate', () => {
  it('makes a new post with the same settings named “… (copy)”, then “(copy 2)”, audited as a create', async () => {
    const site = await siteWith(planner, 'Duplicate test coast', false);
    const original = (await planner.post(`/api/v1/sites/${site.id}/posts`).send(post('Gannet Head', RIDGE)).expect(201)).body
      .post;
    const first = (await planner.post(`/api/v1/sites/${site.id}/posts/${original.id}/duplicate`).send({}).expect(201)).body.post;
    expect(first.id).not.toBe(original.id);
    expect(first.name).toBe('Gannet Head (copy)');
    const same = ({ kind, location, groundElevationM, structureHeightM, eyeHeightM, sector, status }: typeof original) => ({
      kind,
      location,
      groundElevationM,
      structureHeightM,
      eyeHeightM,
      sector,
      status,
    });
    expect(same(first)).toEqual(same(original));
    expect(first.version).toBe(0);
    // A copy of the copy, or a second copy of the original, does not take a name already used.
    const second = (await planner.post(`/api/v1/sites/${site.id}/posts/${first.id}/duplicate`).send({}).expect(201)).body.post;
    expect(second.name).toBe('Gannet Head (copy 2)');
    const event = await AuditEventModel.findOne({ where: { entityType: 'post', entityId: first.id, action: 'create' } });
    expect(event?.summary).toMatchObject({ after: { name: 'Gannet Head (copy)', duplicatedFrom: original.id } });
  });

  it('is for planners of the organisation only', async () => {
    const site = await siteWith(planner, 'Duplicate rights coast', false);
    const original = (await planner.post(`/api/v1/sites/${site.id}/posts`).send(post('Skua Rock', RIDGE)).expect(201)).body.post;
    const before = await PostModel.count({ where: { siteId: site.id } });
    await reviewer.post(`/api/v1/sites/${site.id}/posts/${original.id}/duplicate`).send({}).expect(403);
    await otherPlanner.post(`/api/v1/sites/${site.id}/posts/${original.id}/duplicate`).send({}).expect(404);
    expect(await PostModel.count({ where: { siteId: site.id } })).toBe(before);
  });
});

describe('POST /api/v1/sites/:siteId/posts/:postId/move', () => {
  it('moves a post and reads its ground from the terrain at the new place, with the version check and an audit event', async () => {
    const site = await siteWith(planner, 'Move test coast', true);
    const made = (await planner.post(`/api/v1/sites/${site.id}/posts`).send(post('Curlew Point', RIDGE)).expect(201)).body.post;
    const res = await planner
      .post(`/api/v1/sites/${site.id}/posts/${made.id}/move`)
      .send({ location: { latDeg: HILL_TOP.latDeg, lonDeg: HILL_TOP.lonDeg }, version: made.version })
      .expect(200);
    expect(res.body.post.location.latDeg).toBeCloseTo(HILL_TOP.latDeg, 7);
    expect(res.body.post.location.lonDeg).toBeCloseTo(HILL_TOP.lonDeg, 7);
    // At a cell centre the bilinear height is the cell's value (the position round-trips to within a centimetre).
    expect(Math.abs(res.body.post.groundElevationM - HILL_TOP.heightM)).toBeLessThan(0.2);
    expect(res.body.ground).toMatchObject({ from: 'terrain', previousM: 12 });
    expect(res.body.post.version).toBe(made.version + 1);
    // Everything else stays.
    expect(res.body.post).toMatchObject({
      name: 'Curlew Point',
      structureHeightM: 6,
      eyeHeightM: 1.7,
      sector: { fromDeg: 200, toDeg: 20 },
    });

    // A move with the old version is refused and changes nothing.
    const stale = await planner
      .post(`/api/v1/sites/${site.id}/posts/${made.id}/move`)
      .send({ location: { latDeg: RIDGE.latDeg, lonDeg: RIDGE.lonDeg }, version: made.version });
    expect([stale.status, stale.body.error.code]).toEqual([409, 'stale_version']);

    const again = await planner
      .post(`/api/v1/sites/${site.id}/posts/${made.id}/move`)
      .send({ location: { latDeg: RIDGE.latDeg, lonDeg: RIDGE.lonDeg }, version: res.body.post.version })
      .expect(200);
    expect(Math.abs(again.body.post.groundElevationM - RIDGE.heightM)).toBeLessThan(0.2);

    const events = await AuditEventModel.findAll({
      where: { entityType: 'post', entityId: made.id, action: 'update' },
      order: [['id', 'ASC']],
    });
    expect(events).toHaveLength(2);
    const summary = events[0]!.summary as { before: { groundElevationM: number }; after: { groundElevationM: number } };
    expect(summary.before.groundElevationM).toBe(12);
    expect(Math.abs(summary.after.groundElevationM - HILL_TOP.heightM)).toBeLessThan(0.2);
  });

  it('refuses a place off the terrain under the location field, and keeps the recorded ground on a site without terrain', async () => {
    const site = await siteWith(planner, 'Move edge coast', true);
    const made = (await planner.post(`/api/v1/sites/${site.id}/posts`).send(post('Tern Ledge', RIDGE)).expect(201)).body.post;
    const off = await planner
      .post(`/api/v1/sites/${site.id}/posts/${made.id}/move`)
      .send({ location: { latDeg: 51.7, lonDeg: -10.05 }, version: made.version });
    expect([off.status, off.body.error.code]).toEqual([422, 'outside_terrain']);
    expect(off.body.error.fields.location).toMatch(/outside the site’s terrain/);
    const unchanged = (await planner.get(`/api/v1/sites/${site.id}/posts/${made.id}`).expect(200)).body.post;
    expect(unchanged.version).toBe(made.version);

    const bare = await siteWith(planner, 'Move bare coast', false);
    const p = (await planner.post(`/api/v1/sites/${bare.id}/posts`).send(post('Auk Stack', RIDGE)).expect(201)).body.post;
    const kept = await planner
      .post(`/api/v1/sites/${bare.id}/posts/${p.id}/move`)
      .send({ location: { latDeg: 51.61, lonDeg: -10.03 }, version: p.version })
      .expect(200);
    expect(kept.body.ground).toEqual({ from: 'kept', elevationM: 12 });
    expect(kept.body.post.groundElevationM).toBe(12);
    expect(kept.body.post.location).toEqual({ latDeg: 51.61, lonDeg: -10.03 });
  });

  it('refuses a post that a submitted or approved plan uses, naming the plan, and changes nothing', async () => {
    const approved = (await planner.get('/api/v1/plans?status=approved').expect(200)).body.items as {
      title: string;
      siteId: string;
      postIds: string[];
    }[];
    const plan = approved[0]!;
    const postId = plan.postIds[0]!;
    const before = (await planner.get(`/api/v1/sites/${plan.siteId}/posts/${postId}`).expect(200)).body.post;
    const res = await planner
      .post(`/api/v1/sites/${plan.siteId}/posts/${postId}/move`)
      .send({ location: { latDeg: before.location.latDeg + 0.001, lonDeg: before.location.lonDeg }, version: before.version });
    expect([res.status, res.body.error.code]).toEqual([409, 'post_in_frozen_plan']);
    expect(res.body.error.message).toContain(`“${plan.title}” (approved)`);
    const after = (await planner.get(`/api/v1/sites/${plan.siteId}/posts/${postId}`).expect(200)).body.post;
    expect(after).toEqual(before);
  });

  it('takes only a valid position and version, from planners of the organisation', async () => {
    const site = await siteWith(planner, 'Move rights coast', false);
    const made = (await planner.post(`/api/v1/sites/${site.id}/posts`).send(post('Shag Rock', RIDGE)).expect(201)).body.post;
    const bad = await planner
      .post(`/api/v1/sites/${site.id}/posts/${made.id}/move`)
      .send({ location: { latDeg: 95, lonDeg: -10 }, version: made.version });
    expect([bad.status, Object.keys(bad.body.error.fields)]).toEqual([400, ['location.latDeg']]);
    const body = { location: { latDeg: 51.6, lonDeg: -10 }, version: made.version };
    await reviewer.post(`/api/v1/sites/${site.id}/posts/${made.id}/move`).send(body).expect(403);
    await otherPlanner.post(`/api/v1/sites/${site.id}/posts/${made.id}/move`).send(body).expect(404);
  });
});

describe('POST /api/v1/sites/:siteId/boundary-from-terrain', () => {
  it('makes the boundary the terrain’s rectangle of cell centres reprojected to WGS 84, audited as a site update', async () => {
    const site = await siteWith(planner, 'Extent test coast', true);
    expect(site.boundary).toBeNull();
    const res = await planner.post(`/api/v1/sites/${site.id}/boundary-from-terrain`).send({ version: site.version }).expect(200);
    const ring = res.body.site.boundary as [number, number][];
    // 8 pieces a side, closed: 33 points, SW → SE → NE → NW.
    expect(ring).toHaveLength(33);
    expect(res.body.corners).toBe(33);
    expect(ring[32]).toEqual(ring[0]);
    FOOTPRINT_CORNERS.forEach(([lon, lat], i) => {
      // 1e-6° is about 0.1 m; the ring keeps 7 decimals.
      expect(Math.abs(ring[i * 8]![0] - lon)).toBeLessThan(1e-6);
      expect(Math.abs(ring[i * 8]![1] - lat)).toBeLessThan(1e-6);
    });
    // The extra points follow the grid line (curved in degrees), not the straight chord between the corners.
    expect(Math.abs(ring[4]![0] - SOUTH_MIDDLE[0])).toBeLessThan(1e-6);
    expect(Math.abs(ring[4]![1] - SOUTH_MIDDLE[1])).toBeLessThan(1e-6);
    const chordLat = (FOOTPRINT_CORNERS[0]![1] + FOOTPRINT_CORNERS[1]![1]) / 2;
    expect(Math.abs(ring[4]![1] - chordLat)).toBeGreaterThan(1e-6);

    const stored = (await planner.get(`/api/v1/sites/${site.id}`).expect(200)).body.site;
    expect(stored.boundary).toEqual(ring);
    expect(stored.version).toBe(site.version + 1);
    const event = await AuditEventModel.findOne({ where: { entityType: 'site', entityId: site.id, action: 'update' } });
    expect(event?.summary).toMatchObject({
      before: { boundary: null },
      after: { boundary: ring, boundaryFrom: res.body.terrainId },
    });

    // With the old version: refused, nothing changes.
    const stale = await planner.post(`/api/v1/sites/${site.id}/boundary-from-terrain`).send({ version: site.version });
    expect([stale.status, stale.body.error.code]).toEqual([409, 'stale_version']);
  });

  it('says what to do first on a site without terrain, and is for planners of the organisation only', async () => {
    const site = await siteWith(planner, 'Extent bare coast', false);
    const res = await planner.post(`/api/v1/sites/${site.id}/boundary-from-terrain`).send({ version: site.version });
    expect([res.status, res.body.error.code]).toEqual([404, 'no_terrain']);
    expect(res.body.error.message).toMatch(/upload one first/);
    await reviewer.post(`/api/v1/sites/${site.id}/boundary-from-terrain`).send({ version: site.version }).expect(403);
    await otherPlanner.post(`/api/v1/sites/${site.id}/boundary-from-terrain`).send({ version: site.version }).expect(404);
    const bad = await planner.post(`/api/v1/sites/${site.id}/boundary-from-terrain`).send({});
    expect([bad.status, Object.keys(bad.body.error.fields)]).toEqual([400, ['version']]);
  });
});
