import type { Express } from 'express';
import { Geodesic } from 'geographiclib-geodesic';
import request from 'supertest';
import { createApp } from '@/server/app';
import { PostModel, SiteModel } from '@/server/data/models';
import type { LatLon } from '@/shared/geo/types';
import { FixResultSchema, type FixVisibility } from '@/shared/schemas/fix';
import { IncidentDetailSchema, IncidentReportResultSchema } from '@/shared/schemas/incident';
import { TerrainProfileResponseSchema } from '@/shared/schemas/terrain';
import { DEMO, signedInAgent } from '@/tests/support/agents';
import { createTestDatabase, scratchFileStore, TEST_CONFIG } from '@/tests/support/test-db';

/*
 * The visibility check of a fix on the demo forest district (invented
 * terrain): each reporting post's answer must agree with the site's own
 * terrain profile from that post to the fix under the same refraction, and a
 * site without terrain must say it cannot tell.
 */

const WGS84 = Geodesic.WGS84;
let app: Express;
let drop: () => Promise<void>;
let forestId: string;
const posts: Record<string, { id: string; at: LatLon }> = {};

const agentFor = (email: string) => signedInAgent(app, email);
const azimuthDeg = (a: LatLon, b: LatLon) => {
  const azi = WGS84.Inverse(a.latDeg, a.lonDeg, b.latDeg, b.lonDeg).azi1!;
  return azi < 0 ? azi + 360 : azi;
};
const from = (post: string, azimuth: number, metres: number): LatLon => {
  const { at } = posts[post]!;
  const r = WGS84.Direct(at.latDeg, at.lonDeg, azimuth, metres);
  return { latDeg: r.lat2!, lonDeg: r.lon2! };
};
const bearingTo = (post: string, target: LatLon) => ({
  postId: posts[post]!.id,
  bearingDeg: azimuthDeg(posts[post]!.at, target),
  bearingReference: 'true',
  bearingSigmaDeg: 0.5,
});

beforeAll(async () => {
  let db;
  ({ db, drop } = await createTestDatabase());
  app = createApp({ db, config: TEST_CONFIG, mailer: null, files: scratchFileStore().files });
  forestId = (await SiteModel.findOne({ where: { name: 'Harrowmere Forest District' } }))!.id;
  for (const name of ['Crane Knoll Tower', 'Sedge Ridge Tower', 'Gull Point', 'Fenwick Head']) {
    const row = (await PostModel.findOne({ where: { name } }))!;
    const [lonDeg, latDeg] = row.location.coordinates;
    posts[name] = { id: row.id, at: { latDeg, lonDeg } };
  }
});
afterAll(() => drop());

/** The site's terrain profile from the post to the point, for one k (what the check must agree with). */
async function profileHidden(agent: request.Agent, post: string, target: LatLon, k: number) {
  const res = await agent
    .post(`/api/v1/sites/${forestId}/terrain/profile`)
    .send({
      postId: posts[post]!.id,
      target: { latDeg: target.latDeg, lonDeg: target.lonDeg },
      targetHeightM: 0,
      conditions: [{ k }],
    })
    .expect(200);
  return TerrainProfileResponseSchema.parse(res.body).results[0]!;
}

async function expectAgreesWithProfile(agent: request.Agent, v: FixVisibility, post: string, target: LatLon) {
  expect(v.postName).toBe(post);
  expect(['coverage-run', 'profile']).toContain(v.basis);
  expect(v.refractionK).not.toBeNull();
  const profile = await profileHidden(agent, post, target, v.refractionK!);
  if (v.basis === 'profile') expect(v.seesGround).toBe(profile.groundSeen);
  if (v.seesGround) expect(v.minSmokeHeightM).toBe(0);
  else if (v.minSmokeHeightM !== null) expect(v.minSmokeHeightM).toBeCloseTo(profile.hiddenHeightM, 1);
  expect(v.message.startsWith(post)).toBe(true);
}

describe('the visibility check of a fix', () => {
  it('POST /fixes: says for each post whether it sees the fix, as the terrain profile does', async () => {
    const planner = await agentFor(DEMO.planner);
    // Common practice, no source: a fix and a profile to the same point from the same eye must agree.
    // Several invented smokes around the forest, so that both "seen" and "hidden" answers are met.
    const smokes = [
      from('Crane Knoll Tower', 120, 7000),
      from('Crane Knoll Tower', 160, 5000),
      from('Sedge Ridge Tower', 250, 4000),
    ];
    const answers: FixVisibility[] = [];
    for (const smoke of smokes) {
      const res = await planner
        .post('/api/v1/fixes')
        .send({
          observedAt: new Date(Date.now() - 60_000).toISOString(),
          bearings: [bearingTo('Crane Knoll Tower', smoke), bearingTo('Sedge Ridge Tower', smoke)],
        })
        .expect(200);
      const { fix } = FixResultSchema.parse(res.body);
      expect(fix.visibility).toHaveLength(2);
      await expectAgreesWithProfile(planner, fix.visibility![0]!, 'Crane Knoll Tower', fix);
      await expectAgreesWithProfile(planner, fix.visibility![1]!, 'Sedge Ridge Tower', fix);
      answers.push(...fix.visibility!);
    }
    // The demo forest has ridges: some place is hidden from some tower, and says how high a smoke must rise.
    const hidden = answers.find((a) => a.seesGround === false && a.minSmokeHeightM !== null);
    expect(hidden).toBeDefined();
    expect(hidden!.minSmokeHeightM).toBeGreaterThan(0);
    expect(hidden!.message).toMatch(/cannot see the ground there; a smoke would have to rise at least \d+ m/);
  });

  it('on a site without terrain, says it cannot tell', async () => {
    const planner = await agentFor(DEMO.planner);
    // Common practice, no source: with no ground model there is no line of sight to compute.
    const vessel = from('Gull Point', 200, 6000);
    const res = await planner
      .post('/api/v1/fixes')
      .send({
        observedAt: new Date(Date.now() - 60_000).toISOString(),
        bearings: [bearingTo('Gull Point', vessel), bearingTo('Fenwick Head', vessel)],
      })
      .expect(200);
    const { fix } = FixResultSchema.parse(res.body);
    expect(fix.visibility!.map((v) => [v.basis, v.seesGround, v.minSmokeHeightM])).toEqual([
      ['no-terrain', null, null],
      ['no-terrain', null, null],
    ]);
  });

  it('an incident’s fix carries the check, stored with the fix in the log', async () => {
    const planner = await agentFor(DEMO.planner);
    const smoke = from('Crane Knoll Tower', 120, 7000);
    const opened = IncidentDetailSchema.parse(
      (await planner.post('/api/v1/incidents').send({ siteId: forestId, title: 'Visibility check smoke' }).expect(201)).body,
    );
    const send = (post: string, key: string) =>
      planner
        .post(`/api/v1/incidents/${opened.incident.id}/reports`)
        .send({
          ...bearingTo(post, smoke),
          observedAt: new Date(Date.now() - 60_000).toISOString(),
          kind: 'smoke',
          note: '',
          idempotencyKey: key,
        })
        .expect(201);
    await send('Crane Knoll Tower', `visibility-${Date.now()}-a`);
    const second = IncidentReportResultSchema.parse((await send('Sedge Ridge Tower', `visibility-${Date.now()}-b`)).body);
    const visibility = second.fix!.visibility!;
    expect(visibility.map((v) => v.postName)).toEqual(['Crane Knoll Tower', 'Sedge Ridge Tower']);
    await expectAgreesWithProfile(planner, visibility[0]!, 'Crane Knoll Tower', second.fix!);
    const detail = IncidentDetailSchema.parse((await planner.get(`/api/v1/incidents/${opened.incident.id}`).expect(200)).body);
    expect(detail.chain.intact).toBe(true);
    expect(detail.incident.fix!.visibility).toEqual(visibility);
  });
});
