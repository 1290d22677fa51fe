import type { Express } from 'express';
import type request from 'supertest';
import { PlanModel, PostModel, SiteModel, UserModel } from '@/server/data/models';
import { createTestApp } from '@/tests/support/test-db';
import { DEMO, signedInAgent } from '@/tests/support/agents';

/**
 * Who may do what, route by route: every role of the demo organisation and
 * two people of another organisation try every route of the API on fresh
 * records. A role without the right gets 403; anyone outside the
 * organisation gets 404 for its records (never 403, which would confirm
 * that the record exists).
 */

type Who = 'admin' | 'planner' | 'reviewer' | 'observer' | 'otherAdmin' | 'otherPlanner';
const WHO: Who[] = ['admin', 'planner', 'reviewer', 'observer', 'otherAdmin', 'otherPlanner'];
type Expect = Record<Who, number>;

let app: Express;
let close: () => Promise<void>;
const agents = {} as Record<Who, request.Agent>;
let siteId: string;
let coastSiteId: string;
let approvedPlanId: string;
let reviewerId: string;
let coastPostId: string;
let targetIds: string[];
let conditionSetIds: string[];

beforeAll(async () => {
  ({ app, close } = await createTestApp());
  for (const who of WHO) agents[who] = await signedInAgent(app, DEMO[who]);
  siteId = (await SiteModel.findOne({ where: { name: 'Harrowmere Forest District' } }))!.id;
  coastSiteId = (await SiteModel.findOne({ where: { name: 'Tallow Strand' } }))!.id;
  approvedPlanId = (await PlanModel.findOne({ where: { status: 'approved' } }))!.id;
  reviewerId = (await UserModel.findOne({ where: { email: DEMO.reviewer } }))!.id;
  coastPostId = (await PostModel.findOne({ where: { name: 'Gull Point' } }))!.id;
  targetIds = [(await agents.planner.get('/api/v1/targets')).body.items[0].id];
  conditionSetIds = [(await agents.planner.get('/api/v1/conditions')).body.items[0].id];
});
afterAll(() => close());

/** Everyone of the organisation may; the other organisation gets 404. */
const everyone = (ok: number): Expect => ({
  admin: ok,
  planner: ok,
  reviewer: ok,
  observer: ok,
  otherAdmin: 404,
  otherPlanner: 404,
});
/** Only `roles` of the organisation may; other roles get 403; the other organisation gets 404 where its role would pass. */
const only = (roles: Who[], ok: number, otherOrg = 404): Expect =>
  Object.fromEntries(
    WHO.map((w) => {
      if (w === 'otherAdmin') return [w, roles.includes('admin') ? otherOrg : 403];
      if (w === 'otherPlanner') return [w, roles.includes('planner') ? otherOrg : 403];
      return [w, roles.includes(w) ? ok : 403];
    }),
  ) as Expect;

const planner = () => agents.planner;
const newSite = async () =>
  (
    await planner()
      .post('/api/v1/sites')
      .send({ name: `Matrix ${Math.random()}`, kind: 'search-area' })
      .expect(201)
  ).body.site;
const newPost = async () =>
  (
    await planner()
      .post(`/api/v1/sites/${siteId}/posts`)
      .send({
        name: `Matrix post ${Math.random()}`,
        kind: 'hilltop',
        location: { latDeg: 51.7, lonDeg: 15.3 },
        groundElevationM: 400,
      })
      .expect(201)
  ).body.post;
const newPlan = async () =>
  (
    await planner()
      .post('/api/v1/plans')
      .send({
        siteId: coastSiteId,
        title: 'Matrix plan',
        postIds: [(await newPostOn(coastSiteId)).id],
        targetIds,
        conditionSetIds,
      })
      .expect(201)
  ).body.plan;
const newPostOn = async (site: string) =>
  (
    await planner()
      .post(`/api/v1/sites/${site}/posts`)
      .send({ name: 'Matrix shore post', kind: 'shore-post', location: { latDeg: 51.8, lonDeg: 15.6 }, groundElevationM: 12 })
      .expect(201)
  ).body.post;
const submitted = async () => {
  const plan = await newPlan();
  await planner().post(`/api/v1/plans/${plan.id}/submit`).send({ rowVersion: plan.rowVersion }).expect(200);
  return plan;
};
let watchStart = Date.UTC(2040, 0, 1);
const newWatch = async () => {
  const tolliver = (await UserModel.findOne({ where: { email: 'lookout.tolliver@demo.kenning.test' } }))!.id;
  watchStart += 2 * 86_400_000;
  const post = await newPost();
  return (
    await planner()
      .post('/api/v1/assignments')
      .send({
        postId: post.id,
        userId: tolliver,
        startsAt: new Date(watchStart).toISOString(),
        endsAt: new Date(watchStart + 3_600_000).toISOString(),
      })
      .expect(201)
  ).body.assignment;
};
const newSweepTable = async () =>
  (
    await planner()
      .post('/api/v1/sweep-width-tables')
      .send({
        name: 'Matrix table',
        edition: 'Matrix edition',
        sourceName: 'Invented for the access matrix',
        rows: [{ searchObject: 'Matrix raft', visibilityM: 5000, heightM: 5, sweepWidthM: 1000 }],
      })
      .expect(201)
  ).body.table;
const newTarget = async () =>
  (await planner().post('/api/v1/targets').send({ name: 'Matrix buoy', kind: 'small-craft', heightM: 1, widthM: 1 }).expect(201))
    .body.target;

interface Case {
  route: string;
  expect: Expect;
  /** Makes what the call works on, afresh for each person, and returns the call. */
  call: (agent: request.Agent) => Promise<request.Response>;
}

const cases: Case[] = [
  // Sites and posts
  { route: 'GET /sites', expect: { ...everyone(200), otherAdmin: 200, otherPlanner: 200 }, call: (a) => a.get('/api/v1/sites') },
  { route: 'GET /sites/:id', expect: everyone(200), call: (a) => a.get(`/api/v1/sites/${siteId}`) },
  {
    route: 'POST /sites',
    expect: { ...only(['planner'], 201), otherPlanner: 201 },
    call: (a) => a.post('/api/v1/sites').send({ name: 'Matrix new', kind: 'search-area' }),
  },
  {
    route: 'PATCH /sites/:id',
    expect: only(['planner'], 200),
    call: async (a) => {
      const s = await newSite();
      return a.patch(`/api/v1/sites/${s.id}`).send({ notes: 'x', version: s.version });
    },
  },
  {
    route: 'DELETE /sites/:id',
    expect: only(['planner'], 204),
    call: async (a) => a.delete(`/api/v1/sites/${(await newSite()).id}`),
  },
  { route: 'GET /sites/:id/posts', expect: everyone(200), call: (a) => a.get(`/api/v1/sites/${siteId}/posts`) },
  {
    route: 'POST /sites/:id/posts',
    expect: only(['planner'], 201),
    call: (a) =>
      a
        .post(`/api/v1/sites/${siteId}/posts`)
        .send({ name: 'M', kind: 'tower', location: { latDeg: 51.7, lonDeg: 15.3 }, groundElevationM: 1 }),
  },
  {
    route: 'PATCH /sites/:id/posts/:postId',
    expect: only(['planner'], 200),
    call: async (a) => {
      const p = await newPost();
      return a.patch(`/api/v1/sites/${siteId}/posts/${p.id}`).send({ eyeHeightM: 1.7, version: p.version });
    },
  },
  {
    route: 'DELETE /sites/:id/posts/:postId',
    expect: only(['planner'], 204),
    call: async (a) => a.delete(`/api/v1/sites/${siteId}/posts/${(await newPost()).id}`),
  },
  { route: 'GET /sites/:id/roster', expect: everyone(200), call: (a) => a.get(`/api/v1/sites/${siteId}/roster`) },

  // Libraries
  {
    route: 'GET /targets',
    expect: { ...everyone(200), otherAdmin: 200, otherPlanner: 200 },
    call: (a) => a.get('/api/v1/targets'),
  },
  {
    route: 'GET /conditions',
    expect: { ...everyone(200), otherAdmin: 200, otherPlanner: 200 },
    call: (a) => a.get('/api/v1/conditions'),
  },
  {
    route: 'POST /targets',
    expect: { ...only(['planner'], 201), otherPlanner: 201 },
    call: (a) => a.post('/api/v1/targets').send({ name: 'M', kind: 'raft', heightM: 1, widthM: 1 }),
  },
  {
    route: 'PATCH /targets/:id',
    expect: only(['planner'], 200),
    call: async (a) => {
      const t = await newTarget();
      return a.patch(`/api/v1/targets/${t.id}`).send({ heightM: 2, version: t.version });
    },
  },
  {
    route: 'DELETE /targets/:id',
    expect: only(['planner'], 204),
    call: async (a) => a.delete(`/api/v1/targets/${(await newTarget()).id}`),
  },

  // Plans
  { route: 'GET /plans', expect: { ...everyone(200), otherAdmin: 200, otherPlanner: 200 }, call: (a) => a.get('/api/v1/plans') },
  { route: 'GET /plans/:id (approved)', expect: everyone(200), call: (a) => a.get(`/api/v1/plans/${approvedPlanId}`) },
  {
    route: 'GET /plans/:id (draft)',
    expect: { ...everyone(200), observer: 404 },
    call: async (a) => a.get(`/api/v1/plans/${(await newPlan()).id}`),
  },
  {
    route: 'GET /plans/:id/preview',
    expect: { ...everyone(200), observer: 404 },
    call: async (a) => a.get(`/api/v1/plans/${(await newPlan()).id}/preview`),
  },
  { route: 'GET /plans/:id/revisions', expect: everyone(200), call: (a) => a.get(`/api/v1/plans/${approvedPlanId}/revisions`) },
  {
    route: 'GET /plans/:id/revisions/:n',
    expect: everyone(200),
    call: (a) => a.get(`/api/v1/plans/${approvedPlanId}/revisions/1`),
  },
  {
    route: 'POST /plans',
    // The other organisation's planner names a site that is not theirs: a field error, not a plan.
    expect: { ...only(['planner'], 201), otherPlanner: 400 },
    call: (a) =>
      a.post('/api/v1/plans').send({ siteId: coastSiteId, title: 'M', postIds: [coastPostId], targetIds, conditionSetIds }),
  },
  {
    route: 'PATCH /plans/:id',
    expect: only(['planner'], 200),
    call: async (a) => {
      const p = await newPlan();
      return a.patch(`/api/v1/plans/${p.id}`).send({ title: 'Renamed', rowVersion: p.rowVersion });
    },
  },
  {
    route: 'POST /plans/:id/submit',
    expect: only(['planner'], 200),
    call: async (a) => {
      const p = await newPlan();
      return a.post(`/api/v1/plans/${p.id}/submit`).send({ rowVersion: p.rowVersion });
    },
  },
  {
    route: 'POST /plans/:id/reviews',
    expect: { ...only(['reviewer'], 201), otherPlanner: 403, otherAdmin: 403 },
    call: async (a) => a.post(`/api/v1/plans/${(await submitted()).id}/reviews`).send({ decision: 'approve', revision: 1 }),
  },
  {
    route: 'POST /plans/:id/versions',
    expect: only(['planner'], 201),
    call: (a) => a.post(`/api/v1/plans/${approvedPlanId}/versions`).send({}),
  },

  // Watches, people, briefing
  {
    route: 'GET /assignments',
    expect: { ...everyone(200), otherAdmin: 200, otherPlanner: 200 },
    call: (a) => a.get('/api/v1/assignments'),
  },
  {
    route: 'POST /assignments',
    // The other organisation's planner names a post and a person that are not theirs: field errors.
    expect: only(['planner'], 201, 400),
    call: async (a) => {
      watchStart += 2 * 86_400_000;
      return a.post('/api/v1/assignments').send({
        postId: (await newPost()).id,
        userId: reviewerId,
        startsAt: new Date(watchStart).toISOString(),
        endsAt: new Date(watchStart + 3_600_000).toISOString(),
      });
    },
  },
  {
    route: 'PATCH /assignments/:id',
    expect: only(['planner'], 200),
    call: async (a) => {
      const w = await newWatch();
      return a.patch(`/api/v1/assignments/${w.id}`).send({ note: 'x', version: w.version });
    },
  },
  {
    route: 'DELETE /assignments/:id',
    expect: only(['planner'], 204),
    call: async (a) => a.delete(`/api/v1/assignments/${(await newWatch()).id}`),
  },
  {
    route: 'GET /audit-events?entityId (one record’s history)',
    expect: only(['admin', 'reviewer'], 200),
    call: async (a) => a.get(`/api/v1/audit-events?entityType=site&entityId=${(await newSite()).id}`),
  },
  {
    route: 'GET /audit-events (the organisation’s trail)',
    expect: { ...only(['admin', 'reviewer'], 200), otherAdmin: 200 },
    call: (a) => a.get('/api/v1/audit-events'),
  },
  {
    route: 'GET /people',
    expect: { ...only(['planner', 'reviewer', 'admin'], 200), otherAdmin: 200, otherPlanner: 200 },
    call: (a) => a.get('/api/v1/people'),
  },
  {
    route: 'GET /briefing',
    expect: { ...everyone(200), otherAdmin: 200, otherPlanner: 200 },
    call: (a) => a.get('/api/v1/briefing'),
  },

  // People administration
  { route: 'GET /users', expect: { ...only(['admin'], 200), otherAdmin: 200 }, call: (a) => a.get('/api/v1/users') },
  {
    route: 'PATCH /users/:id',
    expect: only(['admin'], 200),
    call: async (a) => {
      const u = (await agents.admin.get('/api/v1/users')).body.items.find(
        (x: { email: string }) => x.email === 'lookout.marrow@demo.kenning.test',
      );
      return a.patch(`/api/v1/users/${u.id}`).send({ role: 'observer', version: u.version });
    },
  },

  // Sweep-width tables: every role reads its own organisation's, planners write
  {
    route: 'GET /sweep-width-tables',
    expect: { ...everyone(200), otherAdmin: 200, otherPlanner: 200 },
    call: (a) => a.get('/api/v1/sweep-width-tables'),
  },
  {
    route: 'POST /sweep-width-tables',
    expect: { ...only(['planner'], 201), otherPlanner: 201 },
    call: (a) =>
      a.post('/api/v1/sweep-width-tables').send({
        name: 'M',
        edition: 'E',
        sourceName: 'S',
        rows: [{ searchObject: 'O', visibilityM: 1000, heightM: 1, sweepWidthM: 100 }],
      }),
  },
  {
    route: 'PATCH /sweep-width-tables/:id',
    expect: only(['planner'], 200),
    call: async (a) => {
      const t = await newSweepTable();
      return a.patch(`/api/v1/sweep-width-tables/${t.id}`).send({ notes: 'x', version: t.version });
    },
  },
  {
    route: 'POST /sweep-width-tables/:id/retire',
    expect: only(['planner'], 200),
    call: async (a) => {
      const t = await newSweepTable();
      return a.post(`/api/v1/sweep-width-tables/${t.id}/retire`).send({ version: t.version });
    },
  },
  // The calculator is for everyone signed in
  {
    route: 'POST /sightline',
    expect: { ...everyone(200), otherAdmin: 200, otherPlanner: 200 },
    call: (a) => a.post('/api/v1/sightline').send({ observerHeightM: 20, conditions: [{ k: 0.13 }] }),
  },
  {
    // A fix from two of the organisation's posts: the other organisation cannot name them.
    route: 'POST /fixes',
    expect: everyone(200),
    call: async (a) => {
      const fenwick = (await PostModel.findOne({ where: { name: 'Fenwick Head' } }))!.id;
      return a.post('/api/v1/fixes').send({
        observedAt: '2026-07-14T10:00:00Z',
        bearings: [
          { postId: coastPostId, bearingDeg: 45, bearingReference: 'true', bearingSigmaDeg: 1 },
          { postId: fenwick, bearingDeg: 315, bearingReference: 'true', bearingSigmaDeg: 1 },
        ],
      });
    },
  },
  {
    route: 'POST /sweep-width',
    expect: { ...everyone(200), otherAdmin: 200, otherPlanner: 200 },
    call: (a) => a.post('/api/v1/sweep-width').send({ sweepWidthM: 1000, trackSpacingM: 2000 }),
  },
];

describe('route × role × organisation', () => {
  it.each(cases.map((c) => [c.route, c] as const))('%s', async (_route, c) => {
    const got = {} as Expect;
    for (const who of WHO) got[who] = (await c.call(agents[who])).status;
    expect(got).toEqual(c.expect);
  });

  it('lists never show another organisation’s records', async () => {
    const theirs = async (path: string) => (await agents.otherPlanner.get(path)).body.items.map((x: { id: string }) => x.id);
    const ours = async (path: string) => (await agents.planner.get(path)).body.items.map((x: { id: string }) => x.id);
    for (const path of [
      '/api/v1/sites',
      '/api/v1/plans',
      '/api/v1/targets',
      '/api/v1/conditions',
      '/api/v1/assignments',
      '/api/v1/sweep-width-tables',
    ]) {
      const mine = await ours(path);
      expect(mine.length).toBeGreaterThan(0);
      expect((await theirs(path)).filter((id: string) => mine.includes(id))).toEqual([]);
    }
  });

  it('answers 401 on every route when signed out', async () => {
    const { default: supertest } = await import('supertest');
    for (const path of [
      '/api/v1/sites',
      '/api/v1/plans',
      '/api/v1/targets',
      '/api/v1/sweep-width-tables',
      '/api/v1/assignments',
      '/api/v1/briefing',
      '/api/v1/people',
      '/api/v1/users',
    ]) {
      expect((await supertest(app).get(path)).status).toBe(401);
    }
  });
});
