import type { Express } from 'express';
import type { Agent } from 'supertest';
import { Geodesic } from 'geographiclib-geodesic';
import { AuditEventModel, PostModel, TrainerDrillModel } from '@/server/data/models';
import { DrillResultSchema, DrillSchema } from '@/shared/schemas/drill';
import { smoothEarthGround } from '@/shared/plans/smooth-earth-ground';
import { horizonDistance } from '@/shared/sightline';
import { createTestApp } from '@/tests/support/test-db';
import { DEMO, signedInAgent } from '@/tests/support/agents';

let app: Express;
let close: () => Promise<void>;

beforeAll(async () => {
  ({ app, close } = await createTestApp());
});
afterAll(() => close());

/** One of the organisation's posts with its site, as the agent sees them. */
async function aPost(agent: Agent) {
  const sites = (await agent.get('/api/v1/sites').expect(200)).body.items as { id: string }[];
  for (const { id } of sites) {
    const posts = (await agent.get(`/api/v1/sites/${id}/posts`).expect(200)).body.items;
    if (posts[0]) return { post: posts[0], site: (await agent.get(`/api/v1/sites/${id}`).expect(200)).body.site };
  }
  throw new Error('no post in the organisation');
}

const horizonKm = (inputs: { eyeHeightM: number; k: number }) =>
  (horizonDistance(inputs.eyeHeightM, { k: inputs.k }).value ?? NaN) / 1000;

describe('POST /api/v1/drills', () => {
  it('sets a question on one of the organisation’s posts, the same again from the same seed', async () => {
    const observer = await signedInAgent(app, DEMO.observer);
    const { post, site } = await aPost(observer);
    const first = DrillSchema.parse(
      (await observer.post('/api/v1/drills').send({ kind: 'hidden-height', postId: post.id, seed: 4242 }).expect(201)).body.drill,
    );
    const again = DrillSchema.parse(
      (await observer.post('/api/v1/drills').send({ kind: 'hidden-height', postId: post.id, seed: 4242 }).expect(201)).body.drill,
    );
    expect(again.id).not.toBe(first.id);
    expect(again.question).toEqual(first.question);
    expect(first).toMatchObject({ kind: 'hidden-height', seed: 4242, postId: post.id, result: null, question: { unit: 'm' } });
    expect(first.question.text).toContain(post.name);
    // The height of eye is counted as the plans count it: above the ground the post's targets stand on.
    const datum = smoothEarthGround(site, post);
    expect(first.question.inputs.eyeHeightM).toBeCloseTo(
      post.groundElevationM + post.structureHeightM + post.eyeHeightM - datum.groundM,
      9,
    );
    expect(first.question.inputs.distanceM).toBeGreaterThan(0);
    // The solution is not sent before the answer.
    expect(JSON.stringify(first)).not.toMatch(/correctValue|explanation/);
  });

  it('sets an open-water question without a post, with a seed of its own when none is given', async () => {
    const observer = await signedInAgent(app, DEMO.observer);
    const drill = (await observer.post('/api/v1/drills').send({ kind: 'horizon-distance', units: 'nautical' }).expect(201)).body
      .drill;
    expect(drill).toMatchObject({ postId: null, units: 'nautical', question: { unit: 'nmi' } });
    expect(Number.isInteger(drill.seed)).toBe(true);
  });

  it('answers bad requests with the field at fault; other organisations’ posts are not found', async () => {
    const planner = await signedInAgent(app, DEMO.planner);
    const kind = await planner.post('/api/v1/drills').send({ kind: 'guess-the-weather' });
    expect(kind.status).toBe(400);
    expect(kind.body.error.fields.kind).toMatch(/horizon-distance/);
    const seed = await planner.post('/api/v1/drills').send({ kind: 'horizon-distance', seed: -1 });
    expect(seed.body.error.fields.seed).toMatch(/0 or more/);
    const other = await signedInAgent(app, DEMO.otherPlanner);
    const { post } = await aPost(planner);
    const foreign = await other.post('/api/v1/drills').send({ kind: 'horizon-distance', postId: post.id });
    expect(foreign.status).toBe(404);
    expect(foreign.body.error.fields).toHaveProperty('postId');
  });

  it('landmark-range on a demo tower asks the range to a demo landmark, scored against the geodesic distance', async () => {
    const observer = await signedInAgent(app, DEMO.observer);
    const post = (await PostModel.findOne({ where: { name: 'Crane Knoll Tower' } }))!;
    const res = await observer.post('/api/v1/drills').send({ kind: 'landmark-range', postId: post.id, seed: 4 }).expect(201);
    const drill = DrillSchema.parse(res.body.drill);
    const siteMarks = (await observer.get(`/api/v1/sites/${post.siteId}/landmarks`).expect(200)).body.items as {
      name: string;
      latDeg: number;
      lonDeg: number;
    }[];
    const mark = siteMarks.find((m) => m.name === drill.question.inputs.landmarkName)!;
    const [lonDeg, latDeg] = post.location.coordinates;
    // Source: Karney (2013) inverse problem (geographiclib-geodesic), independently here.
    const s12 = Geodesic.WGS84.Inverse(latDeg, lonDeg, mark.latDeg, mark.lonDeg).s12!;
    const answered = await observer
      .post(`/api/v1/drills/${drill.id}/answer`)
      .send({ value: s12 / 1000 })
      .expect(200);
    expect(answered.body.score).toBe(1);
    expect(answered.body.correctValue).toBeCloseTo(s12 / 1000, 6);
    const again = await observer.post('/api/v1/drills').send({ kind: 'landmark-range', postId: post.id, seed: 4 }).expect(201);
    expect(again.body.drill.question.text).toBe(drill.question.text);
  });

  it.each([
    ['landmark-range', {}],
    ['bearing-fix', {}],
  ])('%s without a post is not available here: 422 with the reason', async (kind, extra) => {
    const observer = await signedInAgent(app, DEMO.observer);
    const res = await observer.post('/api/v1/drills').send({ kind, ...extra });
    expect(res.status).toBe(422);
    expect(res.body.error).toMatchObject({
      code: 'drill_unavailable',
      fields: { kind: expect.stringMatching(/post/) },
    });
  });

  it('sets target-visible on the terrain profile for a post whose site has terrain', async () => {
    const observer = await signedInAgent(app, DEMO.observer);
    const sites = (await observer.get('/api/v1/sites').expect(200)).body.items as { id: string }[];
    let postId: string | null = null;
    for (const { id } of sites) {
      if ((await observer.get(`/api/v1/sites/${id}/terrain`)).status !== 200) continue;
      postId = (await observer.get(`/api/v1/sites/${id}/posts`).expect(200)).body.items[0]?.id ?? null;
      if (postId) break;
    }
    expect(postId).not.toBeNull();
    const drill = (await observer.post('/api/v1/drills').send({ kind: 'target-visible', postId, seed: 2 }).expect(201)).body
      .drill;
    expect(drill.question).toMatchObject({ unit: 'yes-no', inputs: { basis: 'terrain', part: expect.any(String) } });
    const answer = (await observer.post(`/api/v1/drills/${drill.id}/answer`).send({ value: true }).expect(200)).body;
    expect(answer.explanation.sideView).toMatchObject({ basis: 'terrain', eyeElevationM: expect.any(Number) });
  });

  it('sets a bearing-fix question on a post with a second post on its site', async () => {
    const observer = await signedInAgent(app, DEMO.observer);
    const sites = (await observer.get('/api/v1/sites').expect(200)).body.items as { id: string }[];
    let postId: string | null = null;
    for (const { id } of sites) {
      const posts = (await observer.get(`/api/v1/sites/${id}/posts`).expect(200)).body.items;
      if (posts.length >= 2) postId = posts[0].id;
      if (postId) break;
    }
    expect(postId).not.toBeNull();
    const drill = (await observer.post('/api/v1/drills').send({ kind: 'bearing-fix', postId, seed: 3 }).expect(201)).body.drill;
    expect(drill.question).toMatchObject({
      unit: 'km',
      inputs: { bearingDeg: expect.any(Number), otherPostName: expect.any(String) },
    });
    const answer = (await observer.post(`/api/v1/drills/${drill.id}/answer`).send({ value: 5 }).expect(200)).body;
    expect(answer.explanation.sideView.cutAngleDeg).toBeGreaterThanOrEqual(30);
  });

  it('sets a detection-range question from the organisation’s libraries', async () => {
    const observer = await signedInAgent(app, DEMO.observer);
    const { post } = await aPost(observer);
    const res = await observer.post('/api/v1/drills').send({ kind: 'detection-range', postId: post.id, seed: 77 }).expect(201);
    expect(res.body.drill.question.inputs).toMatchObject({
      targetName: expect.any(String),
      conditionSetName: expect.any(String),
    });
  });
});

describe('POST /api/v1/drills/:id/answer', () => {
  it('scores by the stated bands and explains with the formula, side view and cautions', async () => {
    const observer = await signedInAgent(app, DEMO.observer);
    const set = async () =>
      (await observer.post('/api/v1/drills').send({ kind: 'horizon-distance', seed: 31 }).expect(201)).body.drill;
    const exact = await set();
    const correctKm = horizonKm(exact.question.inputs);

    const full = DrillResultSchema.parse(
      (
        await observer
          .post(`/api/v1/drills/${exact.id}/answer`)
          .send({ value: correctKm * 1.03 })
          .expect(200)
      ).body,
    );
    // Source: The American Practical Navigator (Bowditch), Table 12, D = √(2r₀h/β₀), β₀ = 1 − k: the exact
    // arc differs from it by far less than the tolerance 0.1 %.
    expect(Math.abs((full.correctValue as number) - correctKm) / correctKm).toBeLessThan(0.001);
    expect(full.score).toBe(1);
    expect(full.explanation.formula).toContain(String(exact.question.inputs.eyeHeightM));
    expect(full.explanation.sideView).toMatchObject({ eyeHeightM: exact.question.inputs.eyeHeightM, k: exact.question.inputs.k });
    expect(full.explanation.scoring).toMatchObject({ fullCreditWithinPct: 5, partialCreditWithinPct: 15, partialCredit: 0.5 });
    expect(full.explanation.scoring.why).toMatch(/refraction/);
    expect(full.explanation.cautions.map((c) => c.code)).toEqual([
      'estimates-only',
      'refraction-varies',
      'visibility-not-detection',
      'follow-procedures',
    ]);

    const partial = await set();
    const half = (
      await observer
        .post(`/api/v1/drills/${partial.id}/answer`)
        .send({ value: correctKm * 0.9 })
        .expect(200)
    ).body;
    expect(half.score).toBe(0.5);
    const wrong = await set();
    const none = (
      await observer
        .post(`/api/v1/drills/${wrong.id}/answer`)
        .send({ value: correctKm * 1.3 })
        .expect(200)
    ).body;
    expect(none.score).toBe(0);

    const shown = DrillSchema.parse((await observer.get(`/api/v1/drills/${exact.id}`).expect(200)).body.drill);
    expect(shown.result).toMatchObject({ score: 1, value: correctKm * 1.03 });
  });

  it('is answered once: a second answer is 409, two at once land one, and the database refuses a change', async () => {
    const observer = await signedInAgent(app, DEMO.observer);
    const drill = (await observer.post('/api/v1/drills').send({ kind: 'refraction-effect', seed: 5 }).expect(201)).body.drill;
    const first = (await observer.post(`/api/v1/drills/${drill.id}/answer`).send({ value: 10 }).expect(200)).body;
    expect(first.replayed).toBe(false);
    // The same answer sent again (a phone resending after a lost response) gets the same result back, counted once.
    const resent = (await observer.post(`/api/v1/drills/${drill.id}/answer`).send({ value: 10 }).expect(200)).body;
    expect(resent).toEqual({ ...first, replayed: true });
    expect(await AuditEventModel.count({ where: { entityType: 'drill', entityId: drill.id, action: 'answer' } })).toBe(1);
    const again = await observer.post(`/api/v1/drills/${drill.id}/answer`).send({ value: 11 });
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('already_answered');

    const race = (await observer.post('/api/v1/drills').send({ kind: 'refraction-effect', seed: 6 }).expect(201)).body.drill;
    const answers = await Promise.all(
      [1, 2, 3, 4].map((value) => observer.post(`/api/v1/drills/${race.id}/answer`).send({ value })),
    );
    expect(answers.map((a) => a.status).sort()).toEqual([200, 409, 409, 409]);

    // The same answer sent twice at once: both get the result, only one counts.
    const twice = (await observer.post('/api/v1/drills').send({ kind: 'refraction-effect', seed: 7 }).expect(201)).body.drill;
    const both = await Promise.all([1, 2].map(() => observer.post(`/api/v1/drills/${twice.id}/answer`).send({ value: 12 })));
    expect(both.map((a) => a.status)).toEqual([200, 200]);
    expect(both.map((a) => a.body.replayed).sort()).toEqual([false, true]);
    expect(await AuditEventModel.count({ where: { entityType: 'drill', entityId: twice.id, action: 'answer' } })).toBe(1);

    await expect(TrainerDrillModel.update({ score: 1 }, { where: { id: drill.id } })).rejects.toThrow(
      /answered and cannot change/,
    );
    await expect(TrainerDrillModel.destroy({ where: { id: drill.id } })).rejects.toThrow(/answered and cannot change/);
  });

  it('refuses an answer of the wrong sort with the field, and other people’s drills are not found', async () => {
    const observer = await signedInAgent(app, DEMO.observer);
    const yesNo = (await observer.post('/api/v1/drills').send({ kind: 'target-visible', seed: 8 }).expect(201)).body.drill;
    expect(yesNo.question.unit).toBe('yes-no');
    const number = await observer.post(`/api/v1/drills/${yesNo.id}/answer`).send({ value: 3 });
    expect(number.status).toBe(400);
    expect(number.body.error.fields.value).toMatch(/yes \(true\) or no \(false\)/);
    const missing = await observer.post(`/api/v1/drills/${yesNo.id}/answer`).send({});
    expect(missing.body.error.fields).toHaveProperty('value');

    const planner = await signedInAgent(app, DEMO.planner);
    expect((await planner.post(`/api/v1/drills/${yesNo.id}/answer`).send({ value: true })).status).toBe(404);
    expect((await planner.get(`/api/v1/drills/${yesNo.id}`)).status).toBe(404);
    const answered = await observer.post(`/api/v1/drills/${yesNo.id}/answer`).send({ value: true }).expect(200);
    expect([0, 1]).toContain(answered.body.score);
  });
});
