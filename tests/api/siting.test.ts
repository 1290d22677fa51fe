import type { Express } from 'express';
import { Op } from 'sequelize';
import type request from 'supertest';
import { CoverageRunSchema, type CoverageRun } from '@/shared/schemas/coverage';
import { SitingRunSchema, type SitingRun } from '@/shared/schemas/siting';
import { fromUtm } from '@/shared/geo/from-utm';
import { toUtm } from '@/shared/geo/to-utm';
import { ConditionSetModel, PlanModel, PostModel, SiteModel, TargetProfileModel } from '@/server/data/models';
import { sitingRepository } from '@/server/data/repositories/siting-repository';
import { poolViewsheds, processCoverageRun } from '@/server/domain/coverage/process-coverage-run';
import { processSitingRun } from '@/server/domain/siting/process-siting-run';
import { reapStaleSitingRuns, SITING_JOB_LOST, SITING_WORKER_STOPPED } from '@/server/domain/siting/reap-stale-siting-runs';
import { startCoverageBoss, workCoverageQueue, workSitingQueue } from '@/server/queue/coverage-queue';
import { DEMO, signedInAgent } from '@/tests/support/agents';
import { gatedViewsheds, holdingGate, openQueueTestbed, type QueueTestbed } from '@/tests/support/queue-testbed';

/*
 * Siting runs through the real job queue (pg-boss on the test database) and a
 * worker in this process that takes both siting and coverage jobs.
 */

let bed: QueueTestbed;
let app: Express;
let planner: request.Agent;

const wait = (ms: number) => new Promise((r) => setTimeout(r, ms));
const utm33 = (easting: number, northing: number) => {
  const p = fromUtm({ zone: 33, hemisphere: 'N', easting, northing });
  return { latDeg: p.latDeg, lonDeg: p.lonDeg };
};

async function startWorker(options: { gate?: () => Promise<void> } = {}) {
  const worker = await startCoverageBoss(bed.url, { supervise: false });
  const viewsheds = poolViewsheds(bed.pool);
  const computeViewsheds = gatedViewsheds(bed.pool, options.gate);
  const outcomes: string[] = [];
  const deps = { db: bed.db, cache: bed.cache, computeViewsheds, progressEveryMs: 0 };
  await workSitingQueue(worker.boss, async (runId) => {
    outcomes.push(await processSitingRun(deps, runId));
  });
  await workCoverageQueue(worker.boss, async (runId) => {
    await processCoverageRun({ ...deps, computeViewsheds: viewsheds }, runId);
  });
  return { ...worker, outcomes };
}

async function waitFor<T>(agent: request.Agent, path: string, parse: (body: unknown) => T, until: (x: T) => boolean) {
  for (let i = 0; i < 900; i++) {
    const value = parse((await agent.get(path).expect(200)).body);
    if (until(value)) return value;
    await wait(200);
  }
  throw new Error(`${path} did not reach the expected state`);
}
const sitingRun = (agent: request.Agent, id: string, until: (r: SitingRun) => boolean) =>
  waitFor(agent, `/api/v1/siting-runs/${id}`, (b) => SitingRunSchema.parse((b as { run: unknown }).run), until);
const coverageRun = (agent: request.Agent, id: string, until: (r: CoverageRun) => boolean) =>
  waitFor(agent, `/api/v1/coverage-runs/${id}`, (b) => CoverageRunSchema.parse((b as { run: unknown }).run), until);

let forestId: string;
let existing: string[];
let proposed: string;
let targetId: string;
let conditionSetId: string;

/** Four candidates on the forest: the proposed Blackmoss tower and three points of the demo terrain. */
const fourCandidates = () => [
  { postId: proposed },
  { ...utm33(524_662.5, 5_740_437.5), name: 'High summit' },
  { ...utm33(518_500, 5_738_500), name: 'Old-growth knoll' },
  { ...utm33(521_000, 5_743_000), name: 'North shoulder' },
];

beforeAll(async () => {
  bed = await openQueueTestbed({ sitingQueue: true });
  ({ app, planner } = bed);
  const forest = await SiteModel.findOne({ where: { name: 'Harrowmere Forest District' } });
  forestId = forest!.id;
  const posts = await PostModel.findAll({ where: { siteId: forestId } });
  existing = posts.filter((p) => p.status === 'existing').map((p) => p.id);
  proposed = posts.find((p) => p.status === 'proposed')!.id;
  targetId = (await TargetProfileModel.findOne({
    where: { name: 'Early smoke column', organizationId: forest!.organizationId },
  }))!.id;
  conditionSetId = (await ConditionSetModel.findOne({
    where: { name: 'Refraction spread', organizationId: forest!.organizationId },
  }))!.id;
});
afterAll(() => bed.close());

const request1 = () => ({
  candidates: fourCandidates(),
  heightsM: [0, 15, 30],
  keepPostIds: existing,
  count: 2,
  targetId,
  conditionSetId,
  objective: { minPosts: 1, zoneWeights: true },
});

describe('siting runs', () => {
  it('reports the same seen area as a coverage run of the draft plan it makes (same cells, same figure)', async () => {
    const worker = await startWorker();
    try {
      const queued = await planner.post(`/api/v1/sites/${forestId}/siting-runs`).send(request1()).expect(202);
      expect(queued.body.run).toMatchObject({ status: 'queued', steps: [], chosen: [] });
      const done = await sitingRun(planner, queued.body.run.id, (r) => r.status === 'done');
      // 4 candidates × 3 heights = 12 options, 2 new posts: small enough to be solved exactly.
      expect(done.method).toBe('exact');
      expect(done.steps).toHaveLength(2);
      expect(new Set(done.chosen.map((c) => c.candidate.index)).size).toBe(2);
      // The curve rises (each step adds ≥ 0) from what the kept towers see.
      expect(done.steps[0]!.totalSeenM2).toBeGreaterThanOrEqual(done.keptSeenM2!);
      expect(done.steps[1]!.totalSeenM2).toBeGreaterThanOrEqual(done.steps[0]!.totalSeenM2);
      expect(done.steps[1]!.totalSeenM2 - done.steps[0]!.totalSeenM2).toBeCloseTo(done.steps[1]!.gainM2, 3);
      expect(done.addedLayer).not.toBeNull();

      // The same request again: the same frozen inputs and the same choice (reproducible).
      const again = await planner.post(`/api/v1/sites/${forestId}/siting-runs`).send(request1()).expect(202);
      const second = await sitingRun(planner, again.body.run.id, (r) => r.status === 'done');
      expect(second.inputsHash).toBe(done.inputsHash);
      expect(second.chosen).toEqual(done.chosen);

      // A draft plan with the kept and chosen posts …
      const made = await planner.post(`/api/v1/siting-runs/${done.id}/plan`).expect(201);
      const plan = made.body.plan;
      expect(plan).toMatchObject({ status: 'draft', siteId: forestId, targetIds: [targetId], conditionSetIds: [conditionSetId] });
      expect(plan.postIds).toHaveLength(existing.length + 2);
      expect((await planner.post(`/api/v1/siting-runs/${done.id}/plan`)).status).toBe(409);
      // … whose coverage run sees exactly what the siting run said, condition by condition.
      // Source: the objective counts a coverage run's own cells (countPostsPerCell, site mask), so the
      // areas must be equal to the cell (common practice, no source).
      const cov = await planner.post(`/api/v1/plans/${plan.id}/coverage`).send({}).expect(202);
      const run = await coverageRun(planner, cov.body.run.id, (r) => r.status === 'done' || r.status === 'failed');
      expect(run.status).toBe('done');
      const last = done.steps.at(-1)!;
      expect(last.byCondition.length).toBe(run.cases.length);
      for (const figure of last.byCondition) {
        const c = run.cases.find((k) => k.key === figure.caseKey)!;
        expect(c).toBeDefined();
        expect(figure.seenM2).toBe(c.site.seenBy1.area);
        expect(figure.seenPct).toBeCloseTo(c.site.seenBy1.pct, 9);
      }
    } finally {
      await worker.stop();
    }
  });

  it('the fix objective (two posts, good cross-bearings) matches the coverage run too', async () => {
    const worker = await startWorker();
    try {
      const body = { ...request1(), objective: { minPosts: 2, zoneWeights: false } };
      const queued = await planner.post(`/api/v1/sites/${forestId}/siting-runs`).send(body).expect(202);
      const done = await sitingRun(planner, queued.body.run.id, (r) => r.status === 'done');
      const plan = (await planner.post(`/api/v1/siting-runs/${done.id}/plan`).expect(201)).body.plan;
      const cov = await planner.post(`/api/v1/plans/${plan.id}/coverage`).send({}).expect(202);
      const run = await coverageRun(planner, cov.body.run.id, (r) => r.status === 'done');
      for (const figure of done.steps.at(-1)!.byCondition) {
        const c = run.cases.find((k) => k.key === figure.caseKey)!;
        expect(figure.seenM2).toBe(c.site.goodCrossBearing.area);
      }
    } finally {
      await worker.stop();
    }
  });

  it('a run cancelled while it computes keeps nothing', async () => {
    const { gate, inside, release } = holdingGate();
    const worker = await startWorker({ gate });
    try {
      const runId: string = (await planner.post(`/api/v1/sites/${forestId}/siting-runs`).send(request1()).expect(202)).body.run
        .id;
      await inside;
      await sitingRun(planner, runId, (r) => r.status === 'running');
      expect((await (await signedInAgent(app, DEMO.reviewer)).post(`/api/v1/siting-runs/${runId}/cancel`)).status).toBe(403);
      const cancelled = await planner.post(`/api/v1/siting-runs/${runId}/cancel`).expect(200);
      expect(cancelled.body.run.status).toBe('cancelled');
      release();
      for (let i = 0; i < 100 && worker.outcomes.length === 0; i++) await wait(100);
      expect(worker.outcomes).toEqual(['cancelled']);
      const after = SitingRunSchema.parse((await planner.get(`/api/v1/siting-runs/${runId}`).expect(200)).body.run);
      expect(after).toMatchObject({ status: 'cancelled', steps: [], chosen: [], addedLayer: null, method: null });
      expect((await sitingRepository.findById(runId))!.result).toBeNull();
      expect((await planner.post(`/api/v1/siting-runs/${runId}/cancel`)).status).toBe(409);
      const plans = await PlanModel.count({ where: { siteId: forestId } });
      expect((await planner.post(`/api/v1/siting-runs/${runId}/plan`)).status).toBe(409);
      expect(await PlanModel.count({ where: { siteId: forestId } })).toBe(plans);
    } finally {
      release();
      await worker.stop();
    }
  });

  it('refuses bad input with 400, the field and the reason, and stores nothing', async () => {
    const before = await sitingRepository.listInSite((await SiteModel.findByPk(forestId))!.organizationId, forestId, 100);
    const bad = await planner
      .post(`/api/v1/sites/${forestId}/siting-runs`)
      .send({ ...request1(), heightsM: [-5], count: 0, objective: { minPosts: 3 } })
      .expect(400);
    expect(bad.body.error.code).toBe('invalid_input');
    expect(bad.body.error.fields['heightsM.0']).toMatch(/negative/);
    expect(bad.body.error.fields.count).toMatch(/at least 1/i);
    expect(bad.body.error.fields['objective.minPosts']).toMatch(/1 or 2/);

    const strangers = await planner
      .post(`/api/v1/sites/${forestId}/siting-runs`)
      .send({ ...request1(), candidates: [{ postId: existing[0] }, { postId: '00000000-0000-4000-8000-000000000000' }] })
      .expect(400);
    expect(strangers.body.error.fields['candidates.0.postId']).toMatch(/kept already/);
    expect(strangers.body.error.fields['candidates.1.postId']).toMatch(/No such post/);

    // A place off the site's terrain is refused up front, by name, rather than failing the run later.
    const far = await planner
      .post(`/api/v1/sites/${forestId}/siting-runs`)
      .send({ ...request1(), candidates: [{ latDeg: 61.05, lonDeg: 14.1, name: 'Far hill' }] })
      .expect(400);
    expect(far.body.error.fields['candidates.0.latDeg']).toMatch(/Far hill lies outside the site's terrain/);

    const noTarget = await planner
      .post(`/api/v1/sites/${forestId}/siting-runs`)
      .send({ ...request1(), targetId: '00000000-0000-4000-8000-000000000000' })
      .expect(400);
    expect(noTarget.body.error.fields.targetId).toMatch(/No such target/);

    const budgetAlone = await planner
      .post(`/api/v1/sites/${forestId}/siting-runs`)
      .send({ ...request1(), budget: 100 })
      .expect(400);
    expect(budgetAlone.body.error.fields.budget).toMatch(/costs/);

    // Observers cannot start runs; another organisation's site is not found.
    expect(
      (await (await signedInAgent(app, DEMO.observer)).post(`/api/v1/sites/${forestId}/siting-runs`).send(request1())).status,
    ).toBe(403);
    expect(
      (await (await signedInAgent(app, DEMO.otherPlanner)).post(`/api/v1/sites/${forestId}/siting-runs`).send(request1())).status,
    ).toBe(404);
    const after = await sitingRepository.listInSite((await SiteModel.findByPk(forestId))!.organizationId, forestId, 100);
    expect(after.length).toBe(before.length);
  });

  it('picks candidates from the terrain at least spacingM apart, and near the access line when one is drawn', async () => {
    // Source: issue 18's definition of terrain candidates (summits and ridge cells, thinned to a
    // spacing, optionally only within a distance of an access line); distances measured on the
    // terrain's own grid (UTM zone 33, as the demo forest's terrain), common practice, no source.
    const worker = await startWorker();
    try {
      const spacingM = 1500;
      const body = {
        ...request1(),
        candidates: { fromTerrain: { spacingM, maxCandidates: 6 } },
        heightsM: [0, 20],
        count: 2,
      };
      const queued = await planner.post(`/api/v1/sites/${forestId}/siting-runs`).send(body).expect(202);
      const done = await sitingRun(planner, queued.body.run.id, (r) => r.status === 'done' || r.status === 'failed');
      expect(done.status).toBe('done');
      expect(done.candidates.length).toBeGreaterThan(1);
      expect(done.candidates.length).toBeLessThanOrEqual(6);
      const grid = done.candidates.map((c) => toUtm({ latDeg: c.latDeg, lonDeg: c.lonDeg }, 33));
      for (const c of done.candidates) {
        expect(c.source).toBe('terrain');
        expect(c.name).toMatch(/^(Summit|Ridge) \d+ \(\d+ m\)$/);
      }
      for (let a = 0; a < grid.length; a++) {
        for (let b = a + 1; b < grid.length; b++) {
          const d = Math.hypot(grid[a]!.easting - grid[b]!.easting, grid[a]!.northing - grid[b]!.northing);
          expect(d).toBeGreaterThanOrEqual(spacingM - 0.01);
        }
      }
      expect(done.chosen.every((c) => c.candidate.source === 'terrain')).toBe(true);

      // With an access line: every candidate within withinM of it (cell centres are tested).
      const line = [utm33(517_000, 5_739_000), utm33(526_000, 5_742_000)];
      const withinM = 1200;
      const near = await planner
        .post(`/api/v1/sites/${forestId}/siting-runs`)
        .send({
          ...body,
          candidates: {
            fromTerrain: { spacingM, maxCandidates: 6, accessLine: { line: line.map((p) => [p.lonDeg, p.latDeg]), withinM } },
          },
        })
        .expect(202);
      const nearDone = await sitingRun(planner, near.body.run.id, (r) => r.status === 'done' || r.status === 'failed');
      expect(nearDone.status).toBe('done');
      expect(nearDone.candidates.length).toBeGreaterThan(0);
      const [a, b] = line.map((p) => toUtm(p, 33));
      for (const c of nearDone.candidates) {
        const p = toUtm({ latDeg: c.latDeg, lonDeg: c.lonDeg }, 33);
        const ux = b!.easting - a!.easting;
        const uy = b!.northing - a!.northing;
        const t = Math.max(
          0,
          Math.min(1, ((p.easting - a!.easting) * ux + (p.northing - a!.northing) * uy) / (ux * ux + uy * uy)),
        );
        const d = Math.hypot(p.easting - a!.easting - t * ux, p.northing - a!.northing - t * uy);
        expect(d).toBeLessThanOrEqual(withinM + 0.01);
      }
      // The line narrows the choice: not the same places as without it.
      expect(nearDone.candidates.map((c) => c.name)).not.toEqual(done.candidates.map((c) => c.name));
    } finally {
      await worker.stop();
    }
  });

  it('fails a run whose worker stopped, or whose job the queue no longer holds, with the reason', async () => {
    // No worker runs here: the runs stay queued with their jobs waiting.
    const ask = async () =>
      SitingRunSchema.parse((await planner.post(`/api/v1/sites/${forestId}/siting-runs`).send(request1()).expect(202)).body.run);
    const [dead, lost, waiting] = [await ask(), await ask(), await ask()];
    const jobOf = async (id: string) => (await sitingRepository.findById(id))!.jobId!;
    // `dead`: taken by a worker that then went silent a minute ago.
    await bed.db.query(
      `UPDATE siting_runs SET status = 'running', heartbeat_at = now() - interval '1 minute', updated_at = now() - interval '1 minute'
        WHERE id = :id`,
      { replacements: { id: dead.id } },
    );
    // `lost`: its job gone from the queue (cancelled there) a minute ago; `waiting`: as old, job still waiting.
    await bed.boss.sitingQueue.cancel(await jobOf(lost.id));
    await bed.db.query(
      `UPDATE siting_runs SET heartbeat_at = now() - interval '1 minute', updated_at = now() - interval '1 minute' WHERE id IN (:ids)`,
      {
        replacements: { ids: [lost.id, waiting.id] },
      },
    );
    const reaped = await reapStaleSitingRuns(bed.db, { staleAfterS: 30 });
    expect(reaped.failed.sort()).toEqual([dead.id, lost.id].sort());
    const deadNow = await sitingRun(planner, dead.id, () => true);
    expect(deadNow).toMatchObject({ status: 'failed', error: SITING_WORKER_STOPPED, steps: [], chosen: [] });
    expect(deadNow.finishedAt).not.toBeNull();
    expect(await sitingRun(planner, lost.id, () => true)).toMatchObject({ status: 'failed', error: SITING_JOB_LOST });
    expect((await sitingRun(planner, waiting.id, () => true)).status).toBe('queued');
    // Reaping again changes nothing (the runs have ended; two reapers never both act).
    expect((await reapStaleSitingRuns(bed.db, { staleAfterS: 30 })).failed).toEqual([]);

    // An ended run is frozen by the database: its inputs, status and result cannot change, nor can it be
    // removed; only the draft plan made from it may be recorded (common practice, no source: as coverage runs).
    await expect(
      bed.db.query(`UPDATE siting_runs SET inputs = '{}' WHERE id = :id`, { replacements: { id: dead.id } }),
    ).rejects.toThrow(/has ended \(failed\) and cannot change/);
    await expect(
      bed.db.query(`UPDATE siting_runs SET status = 'queued' WHERE id = :id`, { replacements: { id: dead.id } }),
    ).rejects.toThrow(/cannot change/);
    await expect(bed.db.query(`DELETE FROM siting_runs WHERE id = :id`, { replacements: { id: dead.id } })).rejects.toThrow(
      /cannot change/,
    );
    const planId = (await PlanModel.findOne({ where: { siteId: forestId } }))!.id;
    await bed.db.query(`UPDATE siting_runs SET plan_id = :planId, updated_at = now() WHERE id = :id`, {
      replacements: { id: dead.id, planId },
    });
    const otherPlan = (await PlanModel.findOne({ where: { siteId: forestId, id: { [Op.ne]: planId } } }))!.id;
    await expect(
      bed.db.query(`UPDATE siting_runs SET plan_id = :otherPlan WHERE id = :id`, { replacements: { id: dead.id, otherPlan } }),
    ).rejects.toThrow(/cannot change/);

    // Withdraw the waiting run (and its job), so no later worker takes it.
    await planner.post(`/api/v1/siting-runs/${waiting.id}/cancel`).expect(200);
    await bed.boss.sitingQueue.cancel(await jobOf(dead.id));
  });
});
