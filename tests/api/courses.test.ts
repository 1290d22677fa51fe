import type { Express } from 'express';
import type { Agent } from 'supertest';
import { CourseAttemptSchema, CourseResultsSchema, CourseSchema, QualificationListSchema } from '@/shared/schemas/course';
import { DrillResultSchema, type Drill } from '@/shared/schemas/drill';
import { hiddenHeight, horizonDistance } from '@/shared/sightline';
import { createTestApp } from '@/tests/support/test-db';
import { DEMO, signedInAgent } from '@/tests/support/agents';

let app: Express;
let close: () => Promise<void>;

beforeAll(async () => {
  ({ app, close } = await createTestApp());
});
afterAll(() => close());

const idOf = async (agent: Agent) => (await agent.get('/api/me').expect(200)).body.user.id as string;

async function aPostId(agent: Agent): Promise<string> {
  const sites = (await agent.get('/api/v1/sites').expect(200)).body.items as { id: string }[];
  for (const { id } of sites) {
    const post = (await agent.get(`/api/v1/sites/${id}/posts`).expect(200)).body.items[0];
    if (post) return post.id;
  }
  throw new Error('no post');
}

/** The right answer from the question's own inputs, worked with the sightline core (km and m). */
function rightAnswer(drill: Drill): number {
  const { eyeHeightM, k, distanceM } = drill.question.inputs;
  if (drill.kind === 'horizon-distance') return (horizonDistance(eyeHeightM, { k }).value ?? NaN) / 1000;
  if (drill.kind === 'hidden-height') return hiddenHeight(eyeHeightM, distanceM ?? NaN, { k }).value ?? NaN;
  throw new Error(`no reference answer for ${drill.kind}`);
}

const course = (postId: string, assigneeIds: string[]) => ({
  name: 'Horizon and hidden height, autumn',
  kinds: ['horizon-distance', 'hidden-height'],
  postIds: [postId],
  questionCount: 3,
  passMarkPct: 60,
  validityDays: 30,
  assigneeIds,
});

describe('courses', () => {
  it('a planner composes and assigns a course; bad fields are named; others cannot write', async () => {
    const planner = await signedInAgent(app, DEMO.planner);
    const observer = await signedInAgent(app, DEMO.observer);
    const postId = await aPostId(planner);
    const created = await planner.post('/api/v1/courses').send(course(postId, [await idOf(observer)]));
    expect(created.status).toBe(201);
    const body = CourseSchema.parse(created.body.course);
    expect(body).toMatchObject({ questionCount: 3, passMarkPct: 60, validityDays: 30, units: 'metric' });
    expect(body.assignees.map((a) => a.id)).toEqual([await idOf(observer)]);

    const other = await signedInAgent(app, DEMO.otherPlanner);
    const bad = await planner.post('/api/v1/courses').send({
      ...course(postId, [await idOf(other)]),
      kinds: ['crystal-ball'],
      questionCount: 0,
      passMarkPct: 120,
    });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['kinds.0', 'passMarkPct', 'questionCount']);
    const foreignPerson = await planner.post('/api/v1/courses').send(course(postId, [await idOf(other)]));
    expect(foreignPerson.status).toBe(400);
    expect(foreignPerson.body.error.fields).toHaveProperty(['assigneeIds.0']);
    const foreignPost = await other.post('/api/v1/courses').send(course(postId, []));
    expect(foreignPost.body.error.fields).toHaveProperty(['postIds.0']);

    expect((await observer.post('/api/v1/courses').send(course(postId, []))).status).toBe(403);
    expect((await other.get(`/api/v1/courses/${body.id}`)).status).toBe(404);
    const listed = (await observer.get('/api/v1/courses').expect(200)).body.items.map((c: { id: string }) => c.id);
    expect(listed).toContain(body.id);
  });

  it('an assigned observer passes an attempt, is qualified for the validity, and a later fail does not undo it', async () => {
    const planner = await signedInAgent(app, DEMO.planner);
    const observer = await signedInAgent(app, DEMO.observer);
    const reviewer = await signedInAgent(app, DEMO.reviewer);
    const id = (
      await planner
        .post('/api/v1/courses')
        .send(course(await aPostId(planner), [await idOf(observer)]))
        .expect(201)
    ).body.course.id;

    const attempt = CourseAttemptSchema.parse((await observer.post(`/api/v1/courses/${id}/attempts`).expect(201)).body.attempt);
    expect(attempt.drills.map((d) => d.kind)).toEqual(['horizon-distance', 'hidden-height', 'horizon-distance']);
    expect(attempt).toMatchObject({ answered: 0, completedAt: null, passed: null });

    let last;
    for (const drill of attempt.drills) {
      last = DrillResultSchema.parse(
        (
          await observer
            .post(`/api/v1/drills/${drill.id}/answer`)
            .send({ value: rightAnswer(drill) })
            .expect(200)
        ).body,
      );
      expect(last.score).toBe(1);
    }
    expect(last?.attempt).toMatchObject({ id: attempt.id, scorePct: 100, passed: true });

    const failing = CourseAttemptSchema.parse((await observer.post(`/api/v1/courses/${id}/attempts`).expect(201)).body.attempt);
    for (const drill of failing.drills) {
      await observer
        .post(`/api/v1/drills/${drill.id}/answer`)
        .send({ value: rightAnswer(drill) * 3 + 10 })
        .expect(200);
    }
    const seen = CourseAttemptSchema.parse(
      (await planner.get(`/api/v1/courses/${id}/attempts/${failing.id}`).expect(200)).body.attempt,
    );
    expect(seen).toMatchObject({ scorePct: 0, passed: false, answered: 3 });

    // Planners and reviewers see everyone's results; the observer only their own.
    const results = CourseResultsSchema.parse((await reviewer.get(`/api/v1/courses/${id}/results`).expect(200)).body);
    const observerId = await idOf(observer);
    const person = results.people.find((p) => p.user.id === observerId)!;
    expect(person.attempts.map((a) => a.passed)).toEqual([true, false]);
    expect(person.qualified).toBe(true);
    expect(person.trendPct).toBe(-100);
    const passedAt = Date.parse(person.lastPassedAt!);
    // Source: none — the course's own rule: qualified until completion + validityDays (30 × 86 400 000 ms).
    expect(Date.parse(person.qualifiedUntil!) - passedAt).toBe(30 * 86_400_000);
    expect(person.byKind).toEqual([
      { kind: 'horizon-distance', answered: 4, meanScore: 0.5 },
      { kind: 'hidden-height', answered: 2, meanScore: 0.5 },
    ]);
    // The qualification list (for the roster and the briefing) says the same, for this course.
    const quals = QualificationListSchema.parse(
      (await planner.get(`/api/v1/qualifications?userId=${observerId}&courseId=${id}`).expect(200)).body,
    );
    expect(quals.items).toEqual([
      expect.objectContaining({ qualified: true, due: false, qualifiedUntil: person.qualifiedUntil }),
    ]);
    const mineOnly = (await observer.get('/api/v1/qualifications').expect(200)).body.items;
    expect(mineOnly.every((q: { user: { id: string } }) => q.user.id === observerId)).toBe(true);
    const own = CourseResultsSchema.parse((await observer.get(`/api/v1/courses/${id}/results`).expect(200)).body);
    expect(own.people.map((p) => p.user.id)).toEqual([await idOf(observer)]);
  });

  it('only assigned people take it; someone assigned later is not qualified until they pass', async () => {
    const planner = await signedInAgent(app, DEMO.planner);
    const reviewer = await signedInAgent(app, DEMO.reviewer);
    const id = (
      await planner
        .post('/api/v1/courses')
        .send({ ...course(await aPostId(planner), []), postIds: [] })
        .expect(201)
    ).body.course.id;
    const refused = await reviewer.post(`/api/v1/courses/${id}/attempts`);
    expect(refused.status).toBe(403);
    expect(refused.body.error.code).toBe('not_assigned');

    const assigned = await planner
      .post(`/api/v1/courses/${id}/assignees`)
      .send({ userIds: [await idOf(reviewer)] })
      .expect(200);
    expect(assigned.body.course.assignees.map((a: { id: string }) => a.id)).toEqual([await idOf(reviewer)]);
    const results = CourseResultsSchema.parse((await planner.get(`/api/v1/courses/${id}/results`).expect(200)).body);
    expect(results.people).toEqual([expect.objectContaining({ qualified: false, qualifiedUntil: null, attempts: [] })]);
    // Putting them on a watch warns the planner, and keeps the watch.
    const watch = await planner.post('/api/v1/assignments').send({
      postId: await aPostId(planner),
      userId: await idOf(reviewer),
      startsAt: '2031-03-01T08:00:00Z',
      endsAt: '2031-03-01T16:00:00Z',
    });
    expect(watch.status).toBe(201);
    expect(watch.body.assignment.id).toEqual(expect.any(String));
    expect(watch.body.warnings).toEqual([
      expect.stringMatching(/has not passed “Horizon and hidden height, autumn” yet.*warning only/),
    ]);

    const attempt = (await reviewer.post(`/api/v1/courses/${id}/attempts`).expect(201)).body.attempt;
    // No posts in the course: open water.
    expect(attempt.drills.every((d: Drill) => d.postId === null)).toBe(true);
  });
});
