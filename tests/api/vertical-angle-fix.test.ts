import type { Express } from 'express';
import { Geodesic } from 'geographiclib-geodesic';
import request from 'supertest';
import { PostModel, SiteModel } from '@/server/data/models';
import { DEMO_PASSWORD } from '@/server/seeders/demo';
import type { LatLon } from '@/shared/geo/types';
import { FixResultSchema } from '@/shared/schemas/fix';
import { IncidentReportResultSchema } from '@/shared/schemas/incident';
import { DEMO, signedInAgent } from '@/tests/support/agents';
import { createTestApp } from '@/tests/support/test-db';

/*
 * One-post fixes from a bearing and a vertical angle: over the demo forest's
 * terrain (Crane Knoll Tower), and over a smooth earth for a typed position
 * (checked against Bowditch's dip short of the horizon).
 */

const WGS84 = Geodesic.WGS84;
const RAD = Math.PI / 180;
let app: Express;
let close: () => Promise<void>;
let siteId: string;
const posts: Record<string, { id: string; at: LatLon }> = {};

beforeAll(async () => {
  ({ app, close } = await createTestApp());
  siteId = (await SiteModel.findOne({ where: { name: 'Harrowmere Forest District' } }))!.id;
  for (const name of ['Crane Knoll Tower', 'Sedge Ridge Tower']) {
    const row = (await PostModel.findOne({ where: { name } }))!;
    const [lonDeg, latDeg] = row.location.coordinates;
    posts[name] = { id: row.id, at: { latDeg, lonDeg } };
  }
});
afterAll(() => close());

const observedAt = () => new Date(Date.now() - 60_000).toISOString();

/** Asks for a fix from these bearings, observed a minute ago, as the demo observer; expects `status`. */
const askFix = async (bearings: unknown[], status: number) =>
  (await signedInAgent(app, DEMO.observer)).post('/api/v1/fixes').send({ observedAt: observedAt(), bearings }).expect(status);

describe('POST /api/v1/fixes with one bearing and a vertical angle', () => {
  it('over a smooth earth (a typed position, no terrain) inverts Bowditch’s dip short of the horizon, and says so', async () => {
    // Source: N. Bowditch, The American Practical Navigator (NGA Pub. 9), Table 14, Ds = 60·tan⁻¹(h/(6076.1 d) + d/8268):
    // 60 ft eye, waterline at 2 NM → Ds ≈ 7.33′ (the table is built for k = 0.168; the API uses k = 0.13, hence 1.5 %).
    const dsArcmin = 60 * (Math.atan(60 / (6076.1 * 2) + 2 / 8268) / RAD);
    const res = await askFix(
      [
        {
          observer: { latDeg: 54.1, lonDeg: 10.9, eyeHeightM: 60 * 0.3048 },
          bearingDeg: 300,
          bearingReference: 'true',
          bearingSigmaDeg: 0.5,
          verticalAngleDeg: -dsArcmin / 60,
        },
      ],
      200,
    );
    const body = FixResultSchema.parse(res.body);
    expect(body.fix.method).toBe('vertical-angle');
    expect(body.fix.range!.basis).toBe('smooth-earth');
    expect(body.fix.warnings.join(' ')).toMatch(/No terrain: smooth-earth estimate/);
    expect(Math.abs(body.fix.range!.distanceM - 2 * 1852) / (2 * 1852)).toBeLessThan(0.015);
    expect(body.fix.range!.minM).toBeLessThan(body.fix.range!.distanceM);
    expect(body.fix.range!.maxM!).toBeGreaterThan(body.fix.range!.distanceM);
    expect(body.fix.range!.verticalAngleSigmaDeg).toBe(0.1);
    expect(body.cautions.map((c) => c.code)).toContain('vertical-angle');
  });

  it('from a demo tower meets the demo terrain on the bearing, inside its range interval', async () => {
    const res = await askFix(
      [
        {
          postId: posts['Crane Knoll Tower']!.id,
          bearingDeg: 140,
          bearingReference: 'true',
          bearingSigmaDeg: 0.5,
          verticalAngleDeg: -1.5,
          verticalAngleSigmaDeg: 0.2,
        },
      ],
      200,
    );
    const { fix } = FixResultSchema.parse(res.body);
    expect(fix.range!.basis).toBe('terrain');
    expect(fix.range!.verticalAngleSigmaDeg).toBe(0.2);
    // Source: Karney (2013) inverse problem (geographiclib-geodesic): the fix lies on the bearing at the range.
    const at = posts['Crane Knoll Tower']!.at;
    const inv = WGS84.Inverse(at.latDeg, at.lonDeg, fix.latDeg, fix.lonDeg);
    expect(inv.azi1!).toBeCloseTo(140, 5);
    expect(inv.s12!).toBeCloseTo(fix.range!.distanceM, 0);
    expect(fix.range!.minM).toBeLessThanOrEqual(fix.range!.distanceM);
    if (fix.range!.maxM !== null) expect(fix.range!.maxM).toBeGreaterThanOrEqual(fix.range!.distanceM);
  });

  it('one bearing without a vertical angle is still refused, naming the field', async () => {
    const res = await askFix(
      [{ postId: posts['Crane Knoll Tower']!.id, bearingDeg: 140, bearingReference: 'true', bearingSigmaDeg: 0.5 }],
      400,
    );
    expect(JSON.stringify(res.body)).toMatch(/at least two bearings, or one with a vertical angle/);
  });

  it('a sight above the horizon over a smooth earth is a 422 under the bearing', async () => {
    const res = await askFix(
      [
        {
          observer: { latDeg: 54.1, lonDeg: 10.9, eyeHeightM: 20 },
          bearingDeg: 10,
          bearingReference: 'true',
          bearingSigmaDeg: 1,
          verticalAngleDeg: 0.3,
        },
      ],
      422,
    );
    expect(JSON.stringify(res.body)).toMatch(/no fix/);
  });
});

describe('an incident with bearings from one post', () => {
  it('is fixed from the vertical angle, and the report keeps the angle’s uncertainty and reference', async () => {
    const agent = request.agent(app);
    await agent.post('/api/auth/sign-in').send({ email: DEMO.observer, password: DEMO_PASSWORD }).expect(200);
    const opened = await agent.post('/api/v1/incidents').send({ siteId, title: 'Smoke below Crane Knoll (test)' }).expect(201);
    const id = opened.body.incident.id as string;
    const base = {
      postId: posts['Crane Knoll Tower']!.id,
      observedAt: observedAt(),
      bearingDeg: 140,
      bearingReference: 'true',
      bearingSigmaDeg: 0.5,
      kind: 'smoke',
      note: '',
    };
    const first = IncidentReportResultSchema.parse(
      (
        await agent
          .post(`/api/v1/incidents/${id}/reports`)
          .send({ ...base, idempotencyKey: `va-1-${Date.now()}` })
          .expect(201)
      ).body,
    );
    expect(first.fix).toBeNull();
    expect(first.fixProblem).toMatch(/Bearings from one post so far/);
    const second = IncidentReportResultSchema.parse(
      (
        await agent
          .post(`/api/v1/incidents/${id}/reports`)
          .send({ ...base, verticalAngleDeg: -1.5, idempotencyKey: `va-2-${Date.now()}` })
          .expect(201)
      ).body,
    );
    expect(second.report.verticalAngleSigmaDeg).toBe(0.1);
    expect(second.report.verticalAngleReference).toBe('horizontal');
    expect(second.fix!.method).toBe('vertical-angle');
    expect(second.fix!.range!.basis).toBe('terrain');
    expect(second.fix!.fromReports).toEqual([second.report.seq]);
    expect(second.fix!.errorArea.coordinates[0]!.length).toBeGreaterThan(4);
  });
});
