import type { Express } from 'express';
import type request from 'supertest';
import { AssignmentModel, PostModel, UserModel } from '@/server/data/models';
import { createTestApp } from '@/tests/support/test-db';
import { DEMO, signedInAgent } from '@/tests/support/agents';

let app: Express;
let close: () => Promise<void>;
let planner: request.Agent;
let observer: request.Agent;
let postId: string;
let otherPostId: string;
let observerId: string;

const DAY = 86_400_000;
const iso = (ms: number) => new Date(ms).toISOString();
const base = Date.UTC(2030, 5, 1);

beforeAll(async () => {
  ({ app, close } = await createTestApp());
  planner = await signedInAgent(app, DEMO.planner);
  observer = await signedInAgent(app, DEMO.observer);
  postId = (await PostModel.findOne({ where: { name: 'Blackmoss Tower' } }))!.id;
  otherPostId = (await PostModel.findOne({ where: { name: 'Fenwick Head' } }))!.id;
  observerId = (await UserModel.findOne({ where: { email: DEMO.observer } }))!.id;
});
afterAll(() => close());

describe('watches', () => {
  it('a planner puts someone on a post; a clash with another watch of the same person is refused and names it', async () => {
    const marrow = (await UserModel.findOne({ where: { email: 'lookout.marrow@demo.kenning.test' } }))!;
    const tolliver = (await UserModel.findOne({ where: { email: 'lookout.tolliver@demo.kenning.test' } }))!.id;
    const first = await planner
      .post('/api/v1/assignments')
      .send({ postId: otherPostId, userId: tolliver, startsAt: iso(base), endsAt: iso(base + 2 * DAY), note: 'Test' });
    expect(first.status).toBe(201);
    expect(first.body.assignment).toMatchObject({ postName: 'Fenwick Head', person: { name: 'Bram Tolliver' }, version: 0 });
    const before = await AssignmentModel.count();
    const clash = await planner
      .post('/api/v1/assignments')
      .send({ postId, userId: tolliver, startsAt: iso(base + DAY), endsAt: iso(base + 3 * DAY) });
    expect(clash.status).toBe(409);
    expect(clash.body.error.code).toBe('assignment_overlap');
    expect(clash.body.error.message).toMatch(/Bram Tolliver already watches Fenwick Head/);
    // The demo puts Ines Marrow on Gull Point until further notice: any later watch of hers clashes with it.
    const open = await planner.post('/api/v1/assignments').send({ postId, userId: marrow.id, startsAt: iso(base + 400 * DAY) });
    expect(open.status).toBe(409);
    expect(open.body.error.message).toMatch(/Ines Marrow already watches Gull Point from .* on\./);
    expect(await AssignmentModel.count()).toBe(before);
  });

  it('answers bad input with field errors and writes nothing', async () => {
    const before = await AssignmentModel.count();
    const bad = await planner
      .post('/api/v1/assignments')
      .send({ postId: 'x', userId: observerId, startsAt: 'tomorrow', endsAt: iso(base) });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields)).toEqual(expect.arrayContaining(['postId', 'startsAt']));
    const reversed = await planner
      .post('/api/v1/assignments')
      .send({ postId, userId: observerId, startsAt: iso(base + DAY), endsAt: iso(base) });
    expect(reversed.body.error.fields).toEqual({ endsAt: 'The watch must end after it starts.' });
    const stranger = await UserModel.findOne({ where: { email: DEMO.otherPlanner } });
    const foreign = await planner.post('/api/v1/assignments').send({ postId, userId: stranger!.id, startsAt: iso(base) });
    expect(foreign.status).toBe(400);
    expect(foreign.body.error.fields).toEqual({ userId: 'No such person in your organisation.' });
    expect(await AssignmentModel.count()).toBe(before);
  });

  it('edits with the version last seen (409 when stale), deletes softly, and keeps observers to their own', async () => {
    const tolliver = (await UserModel.findOne({ where: { email: 'lookout.tolliver@demo.kenning.test' } }))!.id;
    const { body } = await planner
      .post('/api/v1/assignments')
      .send({ postId, userId: tolliver, startsAt: iso(base + 10 * DAY), endsAt: iso(base + 11 * DAY) })
      .expect(201);
    const id = body.assignment.id;
    const edited = await planner.patch(`/api/v1/assignments/${id}`).send({ note: 'Night relief', version: 0 });
    expect(edited.body.assignment).toMatchObject({ note: 'Night relief', version: 1 });
    expect((await planner.patch(`/api/v1/assignments/${id}`).send({ note: 'x', version: 0 })).status).toBe(409);
    expect((await observer.patch(`/api/v1/assignments/${id}`).send({ note: 'x', version: 1 })).status).toBe(403);

    const window = `from=${iso(base + 9 * DAY)}&to=${iso(base + 12 * DAY)}`;
    const planners = (await planner.get(`/api/v1/assignments?${window}`)).body.items.map((a: { id: string }) => a.id);
    expect(planners).toContain(id);
    const mine = (await observer.get(`/api/v1/assignments?${window}`)).body.items;
    expect(mine.every((a: { person: { id: string } }) => a.person.id === observerId)).toBe(true);
    expect(mine.map((a: { id: string }) => a.id)).not.toContain(id);

    await planner.delete(`/api/v1/assignments/${id}`).expect(204);
    expect((await planner.get(`/api/v1/assignments?${window}`)).body.items.map((a: { id: string }) => a.id)).not.toContain(id);
    expect(await AssignmentModel.count({ where: { id }, paranoid: false })).toBe(1);
  });
});

describe('roster', () => {
  it('lists each post of a site with its watches and the stretches nobody covers', async () => {
    const tolliver = (await UserModel.findOne({ where: { email: 'lookout.tolliver@demo.kenning.test' } }))!.id;
    const from = base + 20 * DAY;
    await planner
      .post('/api/v1/assignments')
      .send({ postId, userId: tolliver, startsAt: iso(from + DAY), endsAt: iso(from + 2 * DAY) })
      .expect(201);
    const site = (await PostModel.findByPk(postId))!.siteId;
    const roster = (await observer.get(`/api/v1/sites/${site}/roster?from=${iso(from)}&to=${iso(from + 3 * DAY)}`).expect(200))
      .body;
    const blackmoss = roster.posts.find((p: { postName: string }) => p.postName === 'Blackmoss Tower');
    expect(blackmoss.gaps).toEqual([
      { from: iso(from), to: iso(from + DAY) },
      { from: iso(from + 2 * DAY), to: iso(from + 3 * DAY) },
    ]);
    // Crane Knoll Tower is watched until further notice.
    expect(roster.posts.find((p: { postName: string }) => p.postName === 'Crane Knoll Tower').gaps).toEqual([]);
    const bad = await observer.get(`/api/v1/sites/${site}/roster?from=${iso(from)}&to=${iso(from - DAY)}`);
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toHaveProperty('to');
  });
});

describe('briefing and people', () => {
  it('briefs a lookout on their post with the approved plan’s figures for it', async () => {
    const { body } = await observer.get('/api/v1/briefing').expect(200);
    const crane = body.posts.find((p: { post: { name: string } }) => p.post.name === 'Crane Knoll Tower');
    expect(crane.plan).toMatchObject({ title: 'Fire season cover 2026', revision: 1 });
    expect(crane.results.length).toBeGreaterThan(0);
    expect(crane.results.every((r: { postName: string }) => r.postName === 'Crane Knoll Tower')).toBe(true);
    expect(crane.cautions.map((c: { code: string }) => c.code)).toContain('visibility-not-detection');
  });

  it('lists the organisation’s people for planners, not for observers', async () => {
    const people = (await planner.get('/api/v1/people').expect(200)).body.items;
    expect(people.map((p: { name: string }) => p.name)).toEqual(expect.arrayContaining(['Sami Rookwood', 'Ines Marrow']));
    expect(people.map((p: { name: string }) => p.name)).not.toContain('Joss Fenwright');
    expect((await observer.get('/api/v1/people')).status).toBe(403);
  });
});
