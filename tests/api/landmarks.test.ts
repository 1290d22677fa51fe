import type { Express } from 'express';
import { Geodesic } from 'geographiclib-geodesic';
import { PostModel, SiteModel } from '@/server/data/models';
import { LandmarkSchema } from '@/shared/schemas/landmark';
import { IncidentReportResultSchema } from '@/shared/schemas/incident';
import { DEMO, signedInAgent } from '@/tests/support/agents';
import { createTestApp } from '@/tests/support/test-db';

/*
 * A site's landmarks (named reference marks): planners write, every role
 * reads; a report can give the position from one ("1.2 km at 040° from …"),
 * checked against geographiclib-geodesic's direct problem (Karney 2013).
 */

let app: Express;
let close: () => Promise<void>;
let siteId: string;
let craneKnoll: string;

beforeAll(async () => {
  ({ app, close } = await createTestApp());
  siteId = (await SiteModel.findOne({ where: { name: 'Harrowmere Forest District' } }))!.id;
  craneKnoll = (await PostModel.findOne({ where: { name: 'Crane Knoll Tower' } }))!.id;
});
afterAll(() => close());

/** A smoke report from Crane Knoll placed 1200 m on 40° from a landmark. */
const reportOffFrom = (landmarkId: string, idempotencyKey: string) => ({
  postId: craneKnoll,
  observedAt: new Date(Date.now() - 60_000).toISOString(),
  bearingDeg: 150,
  bearingReference: 'true',
  bearingSigmaDeg: 0.5,
  landmarkOffset: { landmarkId, distanceM: 1200, bearingDeg: 40 },
  kind: 'smoke',
  note: '',
  idempotencyKey,
});

describe('/api/v1/sites/:siteId/landmarks', () => {
  it('lists the demo landmarks to every role, by name', async () => {
    const reviewer = await signedInAgent(app, DEMO.reviewer);
    const res = await reviewer.get(`/api/v1/sites/${siteId}/landmarks`).expect(200);
    const names = (res.body.items as unknown[]).map((l) => LandmarkSchema.parse(l).name);
    expect(names).toEqual(['Marrow Fen Mast', 'Owlstone Cairn', 'Tarnwick Fire Hut']);
  });

  it('a planner adds, edits and deletes one; a stale version and a duplicate name are 409s; bad input names the field', async () => {
    const planner = await signedInAgent(app, DEMO.planner);
    const created = LandmarkSchema.parse(
      (
        await planner
          .post(`/api/v1/sites/${siteId}/landmarks`)
          .send({ name: 'Test Boulder', latDeg: 51.65, lonDeg: 15.25, heightM: 3 })
          .expect(201)
      ).body.landmark,
    );
    expect(created).toMatchObject({ name: 'Test Boulder', heightM: 3, version: 1 });
    const dup = await planner
      .post(`/api/v1/sites/${siteId}/landmarks`)
      .send({ name: 'test boulder', latDeg: 51.66, lonDeg: 15.26 })
      .expect(409);
    expect(dup.body.error.code).toBe('duplicate_name');
    const bad = await planner.post(`/api/v1/sites/${siteId}/landmarks`).send({ name: '', latDeg: 95, lonDeg: 15 }).expect(400);
    expect(JSON.stringify(bad.body)).toMatch(/latDeg/);
    expect(JSON.stringify(bad.body)).toMatch(/name/);
    const edited = LandmarkSchema.parse(
      (
        await planner
          .patch(`/api/v1/sites/${siteId}/landmarks/${created.id}`)
          .send({ version: 1, name: 'Test Boulder (split)' })
          .expect(200)
      ).body.landmark,
    );
    expect(edited).toMatchObject({ name: 'Test Boulder (split)', version: 2 });
    await planner.patch(`/api/v1/sites/${siteId}/landmarks/${created.id}`).send({ version: 1, heightM: 4 }).expect(409);
    await planner.delete(`/api/v1/sites/${siteId}/landmarks/${created.id}`).expect(204);
    await planner.delete(`/api/v1/sites/${siteId}/landmarks/${created.id}`).expect(404);
  });

  it('observers and reviewers cannot write', async () => {
    const observer = await signedInAgent(app, DEMO.observer);
    await observer.post(`/api/v1/sites/${siteId}/landmarks`).send({ name: 'Nope', latDeg: 51.6, lonDeg: 15.2 }).expect(403);
  });
});

describe('a report giving the position from a landmark', () => {
  it('places the incident’s fix at the landmark’s distance and bearing (direct geodesic)', async () => {
    const observer = await signedInAgent(app, DEMO.observer);
    const marks = (await observer.get(`/api/v1/sites/${siteId}/landmarks`).expect(200)).body.items as {
      id: string;
      name: string;
      latDeg: number;
      lonDeg: number;
    }[];
    const hut = marks.find((m) => m.name === 'Tarnwick Fire Hut')!;
    const opened = await observer.post('/api/v1/incidents').send({ siteId, title: 'Smoke near the fire hut (test)' }).expect(201);
    const res = await observer
      .post(`/api/v1/incidents/${opened.body.incident.id}/reports`)
      .send(reportOffFrom(hut.id, `landmark-${Date.now()}`))
      .expect(201);
    const body = IncidentReportResultSchema.parse(res.body);
    // Source: Karney (2013) direct problem, as geographiclib-geodesic computes it independently here.
    const expected = Geodesic.WGS84.Direct(hut.latDeg, hut.lonDeg, 40, 1200);
    expect(body.fix!.method).toBe('landmark-offset');
    expect(body.fix!.latDeg).toBeCloseTo(expected.lat2!, 9);
    expect(body.fix!.lonDeg).toBeCloseTo(expected.lon2!, 9);
    expect(body.fix!.fromLandmark).toMatchObject({ name: 'Tarnwick Fire Hut', distanceM: 1200, bearingDeg: 40 });
    expect(body.report.landmark!.name).toBe('Tarnwick Fire Hut');
  });

  it('an unknown landmark is a 404 under landmarkOffset.landmarkId', async () => {
    const observer = await signedInAgent(app, DEMO.observer);
    const opened = await observer.post('/api/v1/incidents').send({ siteId, title: 'Unknown landmark (test)' }).expect(201);
    const res = await observer
      .post(`/api/v1/incidents/${opened.body.incident.id}/reports`)
      .send(reportOffFrom('00000000-0000-4000-8000-000000000000', `landmark-missing-${Date.now()}`))
      .expect(404);
    expect(JSON.stringify(res.body)).toMatch(/landmarkOffset\.landmarkId/);
  });
});
