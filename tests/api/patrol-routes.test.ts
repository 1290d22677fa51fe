import type { Express } from 'express';
import request from 'supertest';
import { PlanModel, PostModel } from '@/server/data/models';
import { PlanCoverageSchema } from '@/shared/schemas/coverage';
import { routeLegs } from '@/shared/patrol/route-legs';
import { convertSpeed } from '@/shared/units/speed';
import { DEMO, signedInAgent } from '@/tests/support/agents';
import { createTestApp } from '@/tests/support/test-db';

jest.setTimeout(120_000);

let app: Express;
let close: () => Promise<void>;
let planner: request.Agent;
let siteId: string;

// An invented bay; the waypoints are about 2.2 km apart on the parallel.
const A = { latDeg: 54.2, lonDeg: 8.1 };
const B = { latDeg: 54.2, lonDeg: 8.134 };
const vessel = (extra: Record<string, unknown> = {}) => ({
  name: 'Cutter Tern',
  kind: 'vessel',
  location: A,
  groundElevationM: 0,
  structureHeightM: 3,
  eyeHeightM: 1.7,
  route: [A, B, A],
  speedMps: convertSpeed(10, 'kn'),
  cycleMinutes: 30,
  ...extra,
});

beforeAll(async () => {
  ({ app, close } = await createTestApp());
  planner = await signedInAgent(app, DEMO.planner);
  siteId = (await planner.post('/api/v1/sites').send({ name: 'Tern Bay', kind: 'coast-stretch' }).expect(201)).body.site.id;
});
afterAll(() => close());

describe('patrol fields of a post', () => {
  it('stores a vessel’s route, speed (m/s) and cycle and gives them back', async () => {
    const res = await planner.post(`/api/v1/sites/${siteId}/posts`).send(vessel()).expect(201);
    expect(res.body.post.route).toEqual([A, B, A]);
    // Source: 1 kn = 1852 m / 3600 s exactly (international nautical mile) — common practice.
    expect(res.body.post.speedMps).toBeCloseTo(5.1444, 4);
    expect(res.body.post.cycleMinutes).toBe(30);
    const row = await PostModel.findByPk(res.body.post.id);
    expect(row!.route).toEqual([
      [A.lonDeg, A.latDeg],
      [B.lonDeg, B.latDeg],
      [A.lonDeg, A.latDeg],
    ]);
    // A fixed post has none.
    const tower = await planner
      .post(`/api/v1/sites/${siteId}/posts`)
      .send({ name: 'Dune hut', kind: 'shore-post', location: A, groundElevationM: 8 })
      .expect(201);
    expect(tower.body.post).toMatchObject({ route: null, speedMps: null, cycleMinutes: null });
  });

  it.each([
    ['a route on a shore post', { kind: 'shore-post' }, 'route', /vessel or an aircraft/],
    ['a route without a speed', { speedMps: null }, 'speedMps', /speed/],
    ['a route without a cycle', { cycleMinutes: null }, 'cycleMinutes', /cycle/],
    ['a speed without a route', { route: null, cycleMinutes: null }, 'speedMps', /route/],
    ['a doubled waypoint', { route: [A, A, B] }, 'route.1', /on top of/],
    ['a cycle shorter than one run of the route', { cycleMinutes: 10 }, 'cycleMinutes', /takes 15 min/],
  ])('refuses %s with 422 under the field at fault, and stores nothing', async (_what, change, field, reason) => {
    const before = await PostModel.count();
    const res = await planner.post(`/api/v1/sites/${siteId}/posts`).send(vessel(change));
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('invalid_patrol');
    expect(res.body.error.fields[field]).toMatch(reason);
    expect(await PostModel.count()).toBe(before);
  });

  it('refuses badly typed fields with 400 under the field', async () => {
    const res = await planner
      .post(`/api/v1/sites/${siteId}/posts`)
      .send(vessel({ speedMps: -2, route: [A], cycleMinutes: 5000 }));
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(expect.arrayContaining(['speedMps', 'route', 'cycleMinutes']));
  });

  it('judges a change with the fields left as they are: a vessel with a route cannot become a tower, but can drop its route', async () => {
    const post = (
      await planner
        .post(`/api/v1/sites/${siteId}/posts`)
        .send(vessel({ name: 'Cutter Skua' }))
        .expect(201)
    ).body.post;
    const bad = await planner.patch(`/api/v1/sites/${siteId}/posts/${post.id}`).send({ kind: 'tower', version: post.version });
    expect(bad.status).toBe(422);
    expect(bad.body.error.fields.route).toMatch(/vessel or an aircraft/);
    const slower = await planner.patch(`/api/v1/sites/${siteId}/posts/${post.id}`).send({ speedMps: 1, version: post.version });
    // Source: time = distance ÷ speed — common practice, no source: 4.4 km at 1 m/s is ≈ 73 min > 30.
    expect(routeLegs([A, B, A], 1).transitS! / 60).toBeGreaterThan(30);
    expect(slower.status).toBe(422);
    expect(slower.body.error.fields.cycleMinutes).toMatch(/cycle must be at least/);
    const cleared = await planner
      .patch(`/api/v1/sites/${siteId}/posts/${post.id}`)
      .send({ route: null, speedMps: null, cycleMinutes: null, version: post.version })
      .expect(200);
    expect(cleared.body.post).toMatchObject({ route: null, speedMps: null, cycleMinutes: null });
  });

  it('a duplicate keeps the route', async () => {
    const post = (
      await planner
        .post(`/api/v1/sites/${siteId}/posts`)
        .send(vessel({ name: 'Cutter Gannet' }))
        .expect(201)
    ).body.post;
    const copy = (await planner.post(`/api/v1/sites/${siteId}/posts/${post.id}/duplicate`).expect(201)).body.post;
    expect(copy).toMatchObject({ route: [A, B, A], cycleMinutes: 30 });
  });
});

describe('the demo coast plan with its patrol vessel', () => {
  it('carries the vessel’s patrol figures in every case, the fraction layer, and freezes them in the revision', async () => {
    const plan = await PlanModel.findOne({ where: { title: 'Summer watch, Tallow Strand' } });
    const coverage = PlanCoverageSchema.parse((await planner.get(`/api/v1/plans/${plan!.id}/coverage`).expect(200)).body);
    const run = coverage.current!;
    expect(run.status).toBe('done');
    for (const c of run.cases) {
      const [patrol] = c.patrols ?? [];
      expect(patrol?.postName).toBe('Patrol vessel Kittiwake');
      expect(patrol!.sweptAreaM2).toBeGreaterThan(0);
      expect(patrol!.meanFractionInView).toBeGreaterThan(0);
      expect(patrol!.meanFractionInView).toBeLessThanOrEqual(1);
      // Source: random-search POD = 1 − e^(−C) (Koopman, from memory).
      if (patrol!.coverageFactor !== null) expect(patrol!.pod!).toBeCloseTo(1 - Math.exp(-patrol!.coverageFactor), 3);
      // The vessel counts in the run as a post.
      expect(c.posts.some((p) => p.postId === patrol!.postId)).toBe(true);
    }
    const c = run.cases[0]!;
    const layer = await planner
      .get(`/api/v1/coverage-runs/${run.id}/layers/patrol-fraction`)
      .query({ caseKey: c.key, postId: c.patrols![0]!.postId })
      .expect(200);
    expect(layer.body.format).toBe('kenning-rle8/1');
    const notPatrol = c.posts.find((p) => p.postId !== c.patrols![0]!.postId)!;
    const refused = await planner
      .get(`/api/v1/coverage-runs/${run.id}/layers/patrol-fraction`)
      .query({ caseKey: c.key, postId: notPatrol.postId });
    expect(refused.status).toBe(400);
    expect(refused.body.error.fields.postId).toMatch(/patrol/);
    const revisions = (await planner.get(`/api/v1/plans/${plan!.id}/revisions`).expect(200)).body;
    const last = (revisions.items ?? revisions.revisions).at(-1);
    const frozen = (await planner.get(`/api/v1/plans/${plan!.id}/revisions/${last.number}`).expect(200)).body.revision;
    expect(frozen.snapshot.coverage.cases[0].patrols[0].postId).toBe(c.patrols![0]!.postId);
    expect(Object.keys(frozen.snapshot.coverage.layerHashes).some((k: string) => k.startsWith('patrol-fraction:'))).toBe(true);
  });
});
