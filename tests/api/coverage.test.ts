import type { Express } from 'express';
import type request from 'supertest';
import { CoverageComparisonSchema, CoverageRunSchema, PlanCoverageSchema, type CoverageRun } from '@/shared/schemas/coverage';
import { decodeClassRaster } from '@/shared/terrain/decode-class-raster';
import { COVERAGE_LAYER } from '@/shared/terrain/posts-per-cell';
import { createApp } from '@/server/app';
import { PlanModel, SiteModel } from '@/server/data/models';
import { coverageRepository } from '@/server/data/repositories/coverage-repository';
import { processCoverageRun } from '@/server/domain/coverage/process-coverage-run';
import { startCoverageBoss, workCoverageQueue } from '@/server/queue/coverage-queue';
import { DEMO, signedInAgent } from '@/tests/support/agents';
import { gatedViewsheds, holdingGate, openQueueTestbed, type QueueTestbed } from '@/tests/support/queue-testbed';
import { scratchFileStore, TEST_CONFIG } from '@/tests/support/test-db';

/*
 * Coverage runs through the real job queue (pg-boss on the test database)
 * and a worker in this process, started and stopped by the tests.
 */

let bed: QueueTestbed;
let app: Express;
let planner: request.Agent;

const wait = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** A worker on its own pg-boss (as a separate process would have); `gate` can hold each viewshed batch. */
async function startWorker(options: { gate?: () => Promise<void> } = {}) {
  const worker = await startCoverageBoss(bed.url, { supervise: false });
  const computeViewsheds = gatedViewsheds(bed.pool, options.gate);
  const outcomes: string[] = [];
  await workCoverageQueue(worker.boss, async (runId) => {
    outcomes.push(await processCoverageRun({ db: bed.db, cache: bed.cache, computeViewsheds, progressEveryMs: 0 }, runId));
  });
  return { ...worker, outcomes };
}

async function waitForRun(agent: request.Agent, runId: string, until: (run: CoverageRun) => boolean, seconds = 120) {
  for (let i = 0; i < seconds * 5; i++) {
    const run = CoverageRunSchema.parse((await agent.get(`/api/v1/coverage-runs/${runId}`).expect(200)).body.run);
    if (until(run)) return run;
    await wait(200);
  }
  throw new Error(`run ${runId} did not reach the expected state`);
}

const planId = async (title: string) => (await PlanModel.findOne({ where: { title } }))!.id;

/** What the planner creates by POSTing `body` to `path`: the answer's `key` (a 201). */
const created = async (path: string, body: object, key: string) => (await planner.post(path).send(body).expect(201)).body[key];

beforeAll(async () => {
  bed = await openQueueTestbed();
  ({ app, planner } = bed);
});
afterAll(() => bed.close());

describe('coverage runs on the queue', () => {
  it('a run queued while no worker runs survives a restart of the queue, then a worker computes it', async () => {
    const draft = await planId('Blackmoss tower proposal');
    const before = PlanCoverageSchema.parse((await planner.get(`/api/v1/plans/${draft}/coverage`).expect(200)).body);
    expect(before).toMatchObject({ current: null, hasTerrain: true });

    const queued = await planner.post(`/api/v1/plans/${draft}/coverage`).send({}).expect(202);
    const runId: string = queued.body.run.id;
    expect(queued.body.run).toMatchObject({ status: 'queued', progress: 0, current: true, datum: 'terrain' });
    // Asking again for the same inputs gives the same run.
    const again = await planner.post(`/api/v1/plans/${draft}/coverage`).send({}).expect(200);
    expect(again.body.run.id).toBe(runId);

    // The server stops and starts again; the job is in PostgreSQL.
    await bed.boss.stop();
    bed.boss = await startCoverageBoss(bed.url);
    app = createApp({
      db: bed.db,
      config: TEST_CONFIG,
      files: scratchFileStore().files,
      terrainCache: bed.cache,
      coverageQueue: bed.boss.queue,
    });
    planner = await signedInAgent(app, DEMO.planner);

    const worker = await startWorker();
    try {
      const done = await waitForRun(planner, runId, (r) => r.status === 'done');
      expect(worker.outcomes).toEqual(['done']);
      // One case per target × condition, less the ducts (k ≥ 1), which are listed with the reason.
      const sets = (await planner.get('/api/v1/conditions').expect(200)).body.items;
      const plan = (await planner.get(`/api/v1/plans/${draft}`).expect(200)).body.plan;
      const conditionCount = sets
        .filter((s: { id: string }) => plan.conditionSetIds.includes(s.id))
        .reduce((n: number, s: { conditions: unknown[] }) => n + s.conditions.length, 0);
      expect(done.cases.length + done.skippedConditions.length).toBe(plan.targetIds.length * conditionCount);
      expect(done.cases.length).toBeGreaterThan(0);
      for (const skipped of done.skippedConditions) expect(skipped.reason).toMatch(/k ≥ 1/);
      expect(done).toMatchObject({ progress: 1, current: true, error: null });
      expect(done.elapsedS).toBeGreaterThan(0);
      for (const c of done.cases) {
        // Shares of the site add up: seen by one or more + unseen + no data = all of it.
        expect(c.site.seenBy1.pct + c.site.unseen.pct + c.site.noData.pct).toBeCloseTo(100, 6);
        expect(c.site.seenBy2.area).toBeLessThanOrEqual(c.site.seenBy1.area);
        expect(c.check.rules[0]!.id).toBe('site-seen');
        expect(c.posts).toHaveLength(3);
      }

      // Layers: the posts-per-cell layer agrees with the case's figures cell for cell.
      const c0 = done.cases[0]!;
      const layer = (
        await planner.get(`/api/v1/coverage-runs/${runId}/layers/posts-per-cell`).query({ caseKey: c0.key }).expect(200)
      ).body;
      expect(layer).toMatchObject({ format: 'kenning-rle8/1', width: done.grid!.width, height: done.grid!.height });
      const codes = decodeClassRaster(layer);
      const site = await SiteModel.findOne({ where: { name: 'Harrowmere Forest District' } });
      expect(site).not.toBeNull();
      const seenAnywhere = codes.filter((v) => v >= COVERAGE_LAYER.onePost).length;
      // The site lies inside the grid, so the grid has at least the site's seen cells.
      expect(seenAnywhere).toBeGreaterThanOrEqual(c0.site.seenBy1.cells);
      const postId = c0.posts[0]!.postId;
      const view = await planner
        .get(`/api/v1/coverage-runs/${runId}/layers/post-visibility`)
        .query({ caseKey: c0.key, postId })
        .expect(200);
      expect(decodeClassRaster(view.body)).toHaveLength(codes.length);
    } finally {
      await worker.stop();
    }
  });

  it('a run cancelled while it computes stops, and leaves no layers behind', async () => {
    const title = 'Fire season cover, cancel test';
    const season = await PlanModel.findOne({ where: { title: 'Fire season cover 2026' } });
    const created = await planner
      .post('/api/v1/plans')
      .send({
        siteId: season!.siteId,
        title,
        postIds: season!.postIds,
        targetIds: season!.targetIds,
        conditionSetIds: season!.conditionSetIds,
      })
      .expect(201);
    const id: string = created.body.plan.id;
    const { gate, inside, release } = holdingGate();
    const worker = await startWorker({ gate });
    try {
      const runId: string = (await planner.post(`/api/v1/plans/${id}/coverage`).send({}).expect(202)).body.run.id;
      await inside;
      const running = await waitForRun(planner, runId, (r) => r.status === 'running');
      expect(running.stage).not.toBe('');
      // Only planners cancel.
      expect((await (await signedInAgent(app, DEMO.reviewer)).post(`/api/v1/coverage-runs/${runId}/cancel`)).status).toBe(403);
      const cancelled = await planner.post(`/api/v1/coverage-runs/${runId}/cancel`).expect(200);
      expect(cancelled.body.run.status).toBe('cancelled');
      release();
      for (let i = 0; i < 100 && worker.outcomes.length === 0; i++) await wait(100);
      expect(worker.outcomes).toEqual(['cancelled']);
      expect(await coverageRepository.countLayers(runId)).toBe(0);
      const after = await planner.get(`/api/v1/coverage-runs/${runId}`).expect(200);
      expect(after.body.run).toMatchObject({ status: 'cancelled', cases: [] });
      // Cancelling twice is a conflict, and the plan has no current run.
      expect((await planner.post(`/api/v1/coverage-runs/${runId}/cancel`)).status).toBe(409);
      expect((await planner.get(`/api/v1/plans/${id}/coverage`)).body.current).toBeNull();
      // Layers of an unfinished run are refused.
      const layer = await planner.get(`/api/v1/coverage-runs/${runId}/layers/posts-per-cell`).query({ caseKey: 'x' });
      expect(layer.status).toBe(409);
      // Submitting still needs a run.
      const submit = await planner.post(`/api/v1/plans/${id}/submit`).send({ rowVersion: 0 });
      expect(submit.body.error.code).toBe('coverage_missing');
    } finally {
      release();
      await worker.stop();
    }
  });
});

describe('who may see and do what', () => {
  it('answers by role and organisation, and explains bad input per field', async () => {
    const approved = await planId('Fire season cover 2026');
    const draft = await planId('Blackmoss tower proposal');
    const seeded = (await planner.get(`/api/v1/plans/${approved}/coverage`).expect(200)).body;
    const runId: string = seeded.current.id;
    expect(seeded.current.status).toBe('done');

    const observer = await signedInAgent(app, DEMO.observer);
    const reviewer = await signedInAgent(app, DEMO.reviewer);
    const stranger = await signedInAgent(app, DEMO.otherPlanner);
    // Observers read the runs of approved plans only.
    expect((await observer.get(`/api/v1/coverage-runs/${runId}`)).status).toBe(200);
    const draftRun = (await planner.get(`/api/v1/plans/${draft}/coverage`)).body.latest;
    expect((await observer.get(`/api/v1/coverage-runs/${draftRun.id}`)).status).toBe(404);
    expect((await observer.get(`/api/v1/plans/${draft}/coverage`)).status).toBe(404);
    // Reviewers read but do not start runs; other organisations see nothing.
    expect((await reviewer.get(`/api/v1/coverage-runs/${runId}`)).status).toBe(200);
    expect((await reviewer.post(`/api/v1/plans/${draft}/coverage`)).status).toBe(403);
    expect((await stranger.get(`/api/v1/coverage-runs/${runId}`)).status).toBe(404);
    expect((await stranger.post(`/api/v1/plans/${draft}/coverage`)).status).toBe(404);
    expect((await stranger.get(`/api/v1/coverage-compare`).query({ a: runId, b: runId, caseKey: 'x' })).status).toBe(404);
    // An approved plan's coverage is frozen with its revision.
    const frozen = await planner.post(`/api/v1/plans/${approved}/coverage`);
    expect(frozen.status).toBe(409);
    expect(frozen.body.error.code).toBe('plan_frozen');

    const badLayer = await planner.get(`/api/v1/coverage-runs/${runId}/layers/heat-map`).query({ caseKey: 'x' });
    expect(badLayer.status).toBe(400);
    expect(badLayer.body.error.fields).toHaveProperty('layer');
    const noCase = await planner.get(`/api/v1/coverage-runs/${runId}/layers/posts-per-cell`);
    expect(noCase.body.error.fields).toHaveProperty('caseKey');
    const wrongCase = await planner.get(`/api/v1/coverage-runs/${runId}/layers/posts-per-cell`).query({ caseKey: 'nope' });
    expect(wrongCase.status).toBe(400);
    expect(wrongCase.body.error.fields).toHaveProperty('caseKey');
    const noPost = await planner
      .get(`/api/v1/coverage-runs/${runId}/layers/post-visibility`)
      .query({ caseKey: seeded.current.cases[0].key });
    expect(noPost.body.error.fields).toHaveProperty('postId');
    const badCompare = await planner.get('/api/v1/coverage-compare').query({ a: 'x', b: runId });
    expect(badCompare.status).toBe(400);
    expect(Object.keys(badCompare.body.error.fields)).toEqual(expect.arrayContaining(['a', 'caseKey']));
    expect((await planner.get(`/api/v1/coverage-runs/not-a-uuid`)).status).toBe(400);
  });
});

describe('comparing two plans', () => {
  it('adding a tower only gains coverage, and the difference map adds up to the change in the figures', async () => {
    const approved = (await planner.get(`/api/v1/plans/${await planId('Fire season cover 2026')}/coverage`)).body.current;
    const draft = (await planner.get(`/api/v1/plans/${await planId('Blackmoss tower proposal')}/coverage`)).body.current;
    expect(draft?.status).toBe('done');
    // The same target and condition in both plans.
    const shared = approved.cases.find((c: { key: string }) => draft.cases.some((d: { key: string }) => d.key === c.key));
    expect(shared).toBeDefined();
    const res = await planner
      .get('/api/v1/coverage-compare')
      .query({ a: approved.id, b: draft.id, caseKey: shared.key })
      .expect(200);
    const comparison = CoverageComparisonSchema.parse(res.body);
    const { statistics: s } = comparison;
    // The draft has the approved plan's towers and one more: nothing can be lost.
    // Source: a cell seen by a set of posts is seen by any superset — common practice, no source.
    expect(s.byChange.lost.cells).toBe(0);
    expect(s.byChange.fewerPosts.cells).toBe(0);
    expect(s.byChange.gained.cells + s.byChange.morePosts.cells).toBeGreaterThan(0);
    // Inside the site the map's gains are exactly the change of the site's figures.
    expect(s.netSeenBy1Area).toBeCloseTo(comparison.b.site.seenBy1.area - comparison.a.site.seenBy1.area, 3);
    expect(s.netSeenBy2Area).toBeCloseTo(comparison.b.site.seenBy2.area - comparison.a.site.seenBy2.area, 3);
    const changes = decodeClassRaster(comparison.difference);
    expect(changes).toHaveLength(approved.grid.width * approved.grid.height);

    // Runs on different sites cannot be compared cell by cell.
    const coast = (await planner.get(`/api/v1/plans/${await planId('Summer watch, Tallow Strand')}/coverage`)).body.current;
    const apart = await planner.get('/api/v1/coverage-compare').query({ a: approved.id, b: coast.id, caseKey: shared.key });
    expect(apart.status).toBe(409);
    expect(apart.body.error.code).toBe('runs_not_comparable');
  });
});

describe('a site without terrain', () => {
  it('is covered on the flat datum out to the horizon and the geographic range', async () => {
    // An invented stretch of open sea, about 104 km × 111 km, with one post in the middle: wider than both ranges.
    // The targets are wide (the sea surface itself, a 150 m ship) and the air has no stated visibility, so that
    // only the geometry limits them: at 1′ their angular-size limits are thousands of kilometres.
    const centre = { latDeg: 48.0, lonDeg: -4.5 };
    const ring = [
      [-5.2, 47.5],
      [-3.8, 47.5],
      [-3.8, 48.5],
      [-5.2, 48.5],
    ];
    const site = await created(
      '/api/v1/sites',
      { name: 'Flat sea test', kind: 'coast-stretch', boundary: ring, timeZone: 'UTC' },
      'site',
    );
    const eyeM = 20;
    const post = await created(
      `/api/v1/sites/${site.id}/posts`,
      {
        name: 'Mast',
        kind: 'shore-post',
        location: centre,
        groundElevationM: 0,
        structureHeightM: eyeM - 1.6,
        eyeHeightM: 1.6,
      },
      'post',
    );
    const ground = await created(
      '/api/v1/targets',
      { name: 'Sea surface', kind: 'light', heightM: 0, widthM: 5000, requiredVisibleM: 0, period: 'day' },
      'target',
    );
    const mast = await created(
      '/api/v1/targets',
      { name: 'Ship 30 m', kind: 'vessel', heightM: 30, widthM: 150, requiredVisibleM: 0, period: 'day' },
      'target',
    );
    const k = 0.13;
    const set = await created('/api/v1/conditions', { name: 'Plain k', conditions: [{ k }] }, 'conditionSet');
    const plan = await created(
      '/api/v1/plans',
      {
        siteId: site.id,
        title: 'Flat sea',
        postIds: [post.id],
        targetIds: [ground.id, mast.id],
        conditionSetIds: [set.id],
      },
      'plan',
    );
    const worker = await startWorker();
    try {
      const runId = (await planner.post(`/api/v1/plans/${plan.id}/coverage`).send({}).expect(202)).body.run.id;
      const run = await waitForRun(planner, runId, (r) => r.status === 'done' || r.status === 'failed');
      expect(run).toMatchObject({ status: 'done', datum: 'flat', terrainId: null });
      // Source: horizon distance d = √(2 R h / (1 − k)), geographic range = d(eye) + d(target), and the
      // hidden height beyond the horizon (d − d(eye))² / (2 R / (1 − k)) on the effective radius — common
      // practice, no source (the navigation manuals' distance-to-horizon tables). R = 6 371 008.8 m, the
      // mean radius the run uses. The sea surface counts as seen while less than 1 mm of it is hidden
      // (classifyVisibility's documented ground tolerance), i.e. out to d(eye) + d(0.001 m).
      const effective = 6_371_008.8 / (1 - k);
      const horizon = (h: number) => Math.sqrt(2 * effective * h);
      const [sea, top] = run.cases;
      for (const [c, range] of [
        [sea!, horizon(eyeM) + horizon(0.001)],
        [top!, horizon(eyeM) + horizon(30)],
      ] as const) {
        const disc = Math.PI * range ** 2;
        // Cells straddle the rim: allow the rim's ring of cells (circumference × one cell).
        const rim = 2 * Math.PI * range * run.grid!.cellSizeM;
        expect(Math.abs(c.site.seenBy1.area - disc)).toBeLessThan(rim);
        expect(c.site.seenBy2.area).toBe(0);
        expect(c.posts[0]!.seenPct).toBeCloseTo(c.site.seenBy1.pct, 1);
      }
      // A submit on a site without terrain does not wait for coverage, but takes it when there is one.
      // (The default standard, 70 % of this wide square, fails: the submission carries an exception note.)
      const submitted = await planner
        .post(`/api/v1/plans/${plan.id}/submit`)
        .send({ rowVersion: plan.rowVersion, exceptionNote: 'A test of the flat datum, not of the standard.' })
        .expect(200);
      const revision = (await planner.get(`/api/v1/plans/${plan.id}/revisions/${submitted.body.revision}`)).body.revision;
      expect(revision.snapshot.coverage).toMatchObject({ runId, datum: 'flat' });
    } finally {
      await worker.stop();
    }
  });
});
