import type { Express } from 'express';
import { Geodesic } from 'geographiclib-geodesic';
import { magvar } from 'magvar';
import request from 'supertest';
import { PostModel } from '@/server/data/models';
import type { LatLon } from '@/shared/geo/types';
import { FixResultSchema } from '@/shared/schemas/fix';
import { createTestApp } from '@/tests/support/test-db';
import { DEMO, signedInAgent } from '@/tests/support/agents';

/*
 * POST /api/v1/fixes with the demo towers. Bearings to an invented smoke are
 * computed with geographiclib-geodesic's inverse problem (the reference
 * library); the API must give the smoke back.
 */

const WGS84 = Geodesic.WGS84;
let app: Express;
let close: () => Promise<void>;
const posts: Record<string, { id: string; at: LatLon }> = {};

const azimuthDeg = (a: LatLon, b: LatLon) => {
  const azi = WGS84.Inverse(a.latDeg, a.lonDeg, b.latDeg, b.lonDeg).azi1!;
  return azi < 0 ? azi + 360 : azi;
};
const distanceM = (a: LatLon, b: LatLon) => WGS84.Inverse(a.latDeg, a.lonDeg, b.latDeg, b.lonDeg).s12!;

beforeAll(async () => {
  ({ app, close } = await createTestApp());
  for (const name of ['Crane Knoll Tower', 'Sedge Ridge Tower', 'Blackmoss Tower']) {
    const row = (await PostModel.findOne({ where: { name } }))!;
    const [lonDeg, latDeg] = row.location.coordinates;
    posts[name] = { id: row.id, at: { latDeg, lonDeg } };
  }
});
afterAll(() => close());

/** An invented smoke in the demo forest: 6 km from Crane Knoll Tower on 140°. */
const smoke = () => {
  const { at } = posts['Crane Knoll Tower']!;
  const r = WGS84.Direct(at.latDeg, at.lonDeg, 140, 6000);
  return { latDeg: r.lat2!, lonDeg: r.lon2! };
};
const towerBearing = (name: string, extra: Record<string, unknown> = {}) => ({
  postId: posts[name]!.id,
  bearingDeg: azimuthDeg(posts[name]!.at, smoke()),
  bearingReference: 'true',
  bearingSigmaDeg: 0.5,
  ...extra,
});
/** A tower's bearing to the smoke as read on a magnetic compass. */
const magneticBearing = (name: string, declinationDeg: number, extra: Record<string, unknown> = {}) =>
  towerBearing(name, {
    bearingReference: 'magnetic',
    ...extra,
    // Common practice (NOAA's convention, from memory): magnetic = true − declination (east positive).
    bearingDeg: (azimuthDeg(posts[name]!.at, smoke()) - declinationDeg + 360) % 360,
  });
const observedAt = '2026-07-14T13:20:00+02:00';

describe('POST /api/v1/fixes', () => {
  it('fixes a smoke from two demo towers, with the error area, the cut angle and a report per bearing', async () => {
    const observer = await signedInAgent(app, DEMO.observer);
    const res = await observer
      .post('/api/v1/fixes')
      .send({ observedAt, bearings: [towerBearing('Crane Knoll Tower'), towerBearing('Sedge Ridge Tower')] })
      .expect(200);
    const body = FixResultSchema.parse(res.body);
    // Source: geographiclib-geodesic round trip (Karney 2013).
    expect(distanceM(body.fix, smoke())).toBeLessThan(1);
    expect(body.fix.method).toBe('two-bearing-intersection');
    expect(body.fix.cutAngleDeg).toBeGreaterThan(0);
    expect(body.fix.errorAreaM2).toBeGreaterThan(0);
    const ring = body.fix.errorArea.coordinates[0]!;
    expect(ring).toHaveLength(5);
    expect(ring[4]).toEqual(ring[0]);
    expect(body.reports.map((r) => r.postName)).toEqual(['Crane Knoll Tower', 'Sedge Ridge Tower']);
    expect(body.reports[0]!.distanceM).toBeCloseTo(6000, 0);
    expect(body.reports[1]!.distanceM).toBeCloseTo(distanceM(posts['Sedge Ridge Tower']!.at, smoke()), 0);
    expect(body.reports[0]!.declinationDeg).toBe(0);
    expect(body.reports[0]!.eyeHeightM).toBeCloseTo(22 + 1.6, 6);
    expect(body.cautions.map((c) => c.code)).toEqual(['estimates-only', 'bearing-error', 'follow-procedures']);
    expect(JSON.stringify(res.body)).not.toMatch(/NaN|Infinity/);
  });

  it('takes a magnetic bearing with its declination and a typed observer, least squares from three', async () => {
    const planner = await signedInAgent(app, DEMO.planner);
    const declinationDeg = 5.5;
    const lookout = { latDeg: smoke().latDeg - 0.1, lonDeg: smoke().lonDeg + 0.05 };
    const res = await planner
      .post('/api/v1/fixes')
      .send({
        observedAt,
        bearings: [
          towerBearing('Crane Knoll Tower'),
          magneticBearing('Blackmoss Tower', declinationDeg, { declinationDeg }),
          {
            observer: { ...lookout, eyeHeightM: 1.7 },
            bearingDeg: azimuthDeg(lookout, smoke()),
            bearingReference: 'true',
            bearingSigmaDeg: 2,
            verticalAngleDeg: -1.2,
          },
        ],
      })
      .expect(200);
    const body = FixResultSchema.parse(res.body);
    expect(body.fix.method).toBe('least-squares');
    expect(distanceM(body.fix, smoke())).toBeLessThan(1);
    expect(body.fix.residualsDeg).toHaveLength(3);
    for (const r of body.fix.residualsDeg!) expect(Math.abs(r)).toBeLessThan(1e-5);
    expect(body.reports[1]).toMatchObject({ bearingReference: 'magnetic', declinationDeg, flagged: false });
    expect(body.reports[1]!.trueBearingDeg).toBeCloseTo(azimuthDeg(posts['Blackmoss Tower']!.at, smoke()), 9);
    expect(body.reports[2]).toMatchObject({ postId: null, postName: null, eyeHeightM: 1.7, verticalAngleDeg: -1.2 });
    expect(body.fix.warnings.join(' ')).toMatch(/Vertical angles/);
  });

  it('takes a magnetic bearing without a declination with the World Magnetic Model’s at the post and time', async () => {
    const observer = await signedInAgent(app, DEMO.observer);
    const at = posts['Blackmoss Tower']!.at;
    // Source: the `magvar` package (World Magnetic Model 2025, NOAA NCEI / BGS coefficients) as the reference.
    const declinationDeg = magvar(at.latDeg, at.lonDeg, 0, new Date(observedAt));
    const res = await observer
      .post('/api/v1/fixes')
      .send({
        observedAt,
        bearings: [towerBearing('Crane Knoll Tower'), magneticBearing('Blackmoss Tower', declinationDeg)],
      })
      .expect(200);
    const body = FixResultSchema.parse(res.body);
    expect(body.reports[1]).toMatchObject({ declinationSource: 'model' });
    expect(body.reports[1]!.declinationDeg).toBeCloseTo(declinationDeg, 2);
    expect(body.reports[0]).toMatchObject({ declinationSource: 'none', declinationDeg: 0 });
    // The model's declination is rounded to 0.01°: 6 km × 0.01° ≈ 1 m.
    expect(distanceM(body.fix, smoke())).toBeLessThan(5);
  });

  it('answers bad fields with the field at fault and the error shape', async () => {
    const observer = await signedInAgent(app, DEMO.observer);
    const res = await observer.post('/api/v1/fixes').send({
      observedAt: 'yesterday',
      bearings: [
        towerBearing('Crane Knoll Tower', { bearingReference: 'magnetic' }),
        { bearingDeg: 400, bearingReference: 'true', bearingSigmaDeg: 0 },
      ],
    });
    expect(res.status).toBe(400);
    expect(res.body.error).toMatchObject({ code: 'invalid_input', message: expect.any(String) });
    expect(Object.keys(res.body.error.fields).sort()).toEqual([
      'bearings.1.bearingDeg',
      'bearings.1.bearingSigmaDeg',
      'bearings.1.postId',
      'observedAt',
    ]);

    const one = await observer.post('/api/v1/fixes').send({ observedAt, bearings: [towerBearing('Crane Knoll Tower')] });
    expect(one.status).toBe(400);
    expect(one.body.error.fields.bearings).toMatch(/at least two/);
  });

  it('answers bearings that do not cross with a 422 naming them, not NaN', async () => {
    const observer = await signedInAgent(app, DEMO.observer);
    const crane = posts['Crane Knoll Tower']!.at;
    const sedge = posts['Sedge Ridge Tower']!.at;
    const away = (azimuthDeg(sedge, crane) + 180) % 360;
    const res = await observer.post('/api/v1/fixes').send({
      observedAt,
      bearings: [
        towerBearing('Crane Knoll Tower', { bearingDeg: azimuthDeg(sedge, crane) }),
        towerBearing('Sedge Ridge Tower', { bearingDeg: away }),
      ],
    });
    expect(res.status).toBe(422);
    expect(res.body.error).toMatchObject({
      code: 'fix_input',
      fields: { 'bearings.0.bearingDeg': expect.stringMatching(/parallel/), 'bearings.1.bearingDeg': expect.any(String) },
    });
  });

  it('does not let another organisation use the demo towers (404), and refuses the signed out (401)', async () => {
    const other = await signedInAgent(app, DEMO.otherPlanner);
    const res = await other
      .post('/api/v1/fixes')
      .send({ observedAt, bearings: [towerBearing('Crane Knoll Tower'), towerBearing('Sedge Ridge Tower')] });
    expect(res.status).toBe(404);
    expect(res.body.error).toMatchObject({ code: 'not_found', fields: { 'bearings.0.postId': expect.any(String) } });

    const signedOut = await request(app)
      .post('/api/v1/fixes')
      .send({ observedAt, bearings: [towerBearing('Crane Knoll Tower'), towerBearing('Sedge Ridge Tower')] });
    expect(signedOut.status).toBe(401);
  });
});
