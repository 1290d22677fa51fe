import type { Express } from 'express';
import type { Agent } from 'supertest';
import { AuditEventModel, FieldCalibrationModel } from '@/server/data/models';
import { CalibrationListSchema, CalibrationSchema } from '@/shared/schemas/calibration';
import { ConditionSetSchema } from '@/shared/schemas/library';
import { horizonDip, refractionPreset } from '@/shared/sightline';
import { convertAngle } from '@/shared/units';
import { createTestApp } from '@/tests/support/test-db';
import { DEMO, signedInAgent } from '@/tests/support/agents';

let app: Express;
let close: () => Promise<void>;

beforeAll(async () => {
  ({ app, close } = await createTestApp());
});
afterAll(() => close());

/** The id of one of the organisation's posts, as the agent sees it. */
async function aPost(agent: Agent): Promise<string> {
  const sites = (await agent.get('/api/v1/sites').expect(200)).body.items as { id: string }[];
  for (const site of sites) {
    const posts = (await agent.get(`/api/v1/sites/${site.id}/posts`).expect(200)).body.items as { id: string }[];
    if (posts[0]) return posts[0].id;
  }
  throw new Error('no post in the organisation');
}

/** A site with one post of the agent's own (a planner), for an organisation the demo gives none. */
async function newPost(agent: Agent): Promise<string> {
  const site = (await agent.post('/api/v1/sites').send({ name: 'Calibration test coast', kind: 'coast-stretch' }).expect(201))
    .body.site;
  const post = await agent
    .post(`/api/v1/sites/${site.id}/posts`)
    .send({ name: 'Test headland', kind: 'shore-post', location: { latDeg: 10.5, lonDeg: -20.25 }, groundElevationM: 35 })
    .expect(201);
  return post.body.post.id;
}

// A dip read at 16 m under the nautical tables' refraction: 1.76′ √16 = 7.04′.
const dipReading = { method: 'dip', eyeHeightM: 16, observedDipArcmin: 7.04, accuracyArcmin: 0.2 };

describe('POST /api/v1/calibrations', () => {
  it('solves k from a dip, logs post, observer and weather, and returns the range and warnings', async () => {
    const observer = await signedInAgent(app, DEMO.observer);
    const postId = await aPost(observer);
    const res = await observer
      .post('/api/v1/calibrations')
      .send({
        ...dipReading,
        postId,
        observedAt: '2026-11-02T07:30:00Z',
        weather: { pressureHpa: 1013.25, temperatureC: 15, lapseRateKPerM: 0.0065 },
      })
      .expect(201);
    const calibration = CalibrationSchema.parse(res.body.calibration);
    // Source: The Nautical Almanac / Bowditch, dip = 1.76′ √h(m) under standard refraction (from memory);
    // Bowditch's β₀ = 0.8279 is k = 0.1721. Tolerance 0.02 (1.76 is rounded).
    expect(Math.abs((calibration.k ?? NaN) - refractionPreset('nautical-tables').k)).toBeLessThan(0.02);
    expect(calibration.kMin ?? NaN).toBeLessThan(calibration.k ?? NaN);
    expect(calibration.kMax ?? NaN).toBeGreaterThan(calibration.k ?? NaN);
    expect(calibration).toMatchObject({
      method: 'dip',
      postId,
      observedAt: '2026-11-02T07:30:00.000Z',
      measurement: { eyeHeightM: 16, observedDipArcmin: 7.04, accuracyArcmin: 0.2 },
      weather: { pressureHpa: 1013.25, temperatureC: 15, lapseRateKPerM: 0.0065 },
      resultKind: 'estimate',
      regime: 'standard',
      conditionSetId: null,
    });
    expect(calibration.observer.name).not.toBe('');
    expect(calibration.effectiveRadiusM).toBeGreaterThan(6_371_000);
    expect(calibration.kFromWeather).not.toBeNull();
    expect(calibration.cautions.map((c) => c.code)).toEqual(
      expect.arrayContaining(['estimates-only', 'refraction-varies', 'visibility-not-detection', 'follow-procedures']),
    );
    expect(res.body.conditionSet).toBeNull();
    const audit = await AuditEventModel.findOne({ where: { entityType: 'calibration', entityId: calibration.id } });
    expect(audit?.action).toBe('create');
  });

  it('warns of a duct when the sea horizon stands above the horizontal', async () => {
    const observer = await signedInAgent(app, DEMO.observer);
    const res = await observer
      .post('/api/v1/calibrations')
      .send({ ...dipReading, observedDipArcmin: -0.4 })
      .expect(201);
    expect(res.body.calibration).toMatchObject({ k: null, kMin: 1, kMax: null, resultKind: 'lower-bound', regime: 'ducting' });
    expect(res.body.calibration.warnings.map((w: { code: string }) => w.code)).toContain('ducting');
  });

  it('solves reciprocal zenith angles and a reference mark (a bound when only “visible” is known)', async () => {
    const planner = await signedInAgent(app, DEMO.planner);
    // Constructed from k = 1 − R(z₁ + z₂ − π)/S (Bomford, Geodesy — from memory): S = 8 km, k = 0.13 →
    // z₁ + z₂ − 180° = 0.87 · 8 000 / 6 371 008.8 rad.
    const excessDeg = convertAngle((0.87 * 8000) / 6_371_008.8, 'rad', 'deg');
    const reciprocal = await planner
      .post('/api/v1/calibrations')
      .send({
        method: 'reciprocal',
        distanceM: 8000,
        zenithAngle1Deg: 89.8,
        zenithAngle2Deg: 90.2 + excessDeg,
        accuracyArcsec: 3,
      })
      .expect(201);
    expect(Math.abs(reciprocal.body.calibration.k - 0.13)).toBeLessThan(1e-9);

    const mark = await planner
      .post('/api/v1/calibrations')
      .send({ method: 'mark', eyeHeightM: 6, distanceM: 35_000, markHeightM: 40, markVisible: true })
      .expect(201);
    expect(mark.body.calibration).toMatchObject({ k: null, kMax: null, resultKind: 'lower-bound' });
    expect(typeof mark.body.calibration.kMin).toBe('number');
  });

  it('answers bad input with the field at fault and keeps nothing', async () => {
    const observer = await signedInAgent(app, DEMO.observer);
    const before = await FieldCalibrationModel.count();

    const noMethod = await observer.post('/api/v1/calibrations').send({ eyeHeightM: 10 });
    expect(noMethod.status).toBe(400);
    expect(noMethod.body.error).toMatchObject({ code: 'invalid_input', fields: { method: expect.any(String) } });

    const badDip = await observer
      .post('/api/v1/calibrations')
      .send({ method: 'dip', eyeHeightM: -3, observedDipArcmin: 'five', accuracyArcmin: 0.2 });
    expect(badDip.status).toBe(400);
    expect(badDip.body.error.fields.eyeHeightM).toMatch(/more than 0/);
    expect(badDip.body.error.fields.observedDipArcmin).toMatch(/minutes of arc/);

    const zenith = await observer
      .post('/api/v1/calibrations')
      .send({ method: 'reciprocal', distanceM: 5000, zenithAngle1Deg: 190, zenithAngle2Deg: 90, accuracyArcsec: 2 });
    expect(zenith.body.error.fields).toEqual({ zenithAngle1Deg: expect.stringMatching(/less than 180/) });

    const markless = await observer
      .post('/api/v1/calibrations')
      .send({ method: 'mark', eyeHeightM: 5, distanceM: 20_000, markHeightM: 30 });
    expect(markless.body.error.fields.observedVisibleFromM).toMatch(/visible/);
    const above = await observer
      .post('/api/v1/calibrations')
      .send({ method: 'mark', eyeHeightM: 5, distanceM: 20_000, markHeightM: 30, observedVisibleFromM: 31 });
    expect(above.body.error.fields.observedVisibleFromM).toMatch(/above the top/);

    const window = await observer.get('/api/v1/calibrations?from=2026-11-03T00:00:00Z&to=2026-11-01T00:00:00Z');
    expect(window.status).toBe(400);
    expect(window.body.error.fields).toHaveProperty('to');

    // An observer may not save a condition set: refused before anything is written.
    const save = await observer.post('/api/v1/calibrations').send({ ...dipReading, saveAsConditionSet: true });
    expect(save.status).toBe(403);
    expect(await FieldCalibrationModel.count()).toBe(before);
  });
});

describe('organisation scoping and listing', () => {
  it('another organisation’s post is not found, and neither organisation sees the other’s calibrations', async () => {
    const planner = await signedInAgent(app, DEMO.planner);
    const other = await signedInAgent(app, DEMO.otherPlanner);
    const theirPost = await newPost(other);
    const refused = await planner.post('/api/v1/calibrations').send({ ...dipReading, postId: theirPost });
    expect(refused.status).toBe(404);
    expect(refused.body.error.fields).toHaveProperty('postId');

    const mine = (await planner.post('/api/v1/calibrations').send(dipReading).expect(201)).body.calibration.id;
    const theirs = CalibrationListSchema.parse((await other.get('/api/v1/calibrations').expect(200)).body);
    expect(theirs.items.map((c) => c.id)).not.toContain(mine);
    expect((await other.post(`/api/v1/calibrations/${mine}/condition-set`).send({})).status).toBe(404);
  });

  it('filters by post and observation window, newest first', async () => {
    const observer = await signedInAgent(app, DEMO.observer);
    const postId = await aPost(observer);
    const at = (iso: string, post?: string) =>
      observer
        .post('/api/v1/calibrations')
        .send({ ...dipReading, observedAt: iso, ...(post && { postId: post }) })
        .expect(201)
        .then((r) => r.body.calibration.id as string);
    const early = await at('2025-06-01T06:00:00Z', postId);
    const late = await at('2025-06-01T18:00:00Z', postId);
    const elsewhere = await at('2025-06-01T12:00:00Z');
    const nextDay = await at('2025-06-02T06:00:00Z', postId);

    const day = CalibrationListSchema.parse(
      (await observer.get('/api/v1/calibrations?from=2025-06-01T00:00:00Z&to=2025-06-02T00:00:00Z').expect(200)).body,
    );
    expect(day.items.map((c) => c.id)).toEqual([late, elsewhere, early]);

    const atPost = CalibrationListSchema.parse(
      (await observer.get(`/api/v1/calibrations?postId=${postId}&from=2025-06-01T00:00:00Z&to=2025-06-03T00:00:00Z`).expect(200))
        .body,
    );
    expect(atPost.items.map((c) => c.id)).toEqual([nextDay, late, early]);
    expect(atPost.total).toBe(3);
  });
});

describe('saving a calibration as a condition set', () => {
  it('a planner saves it as “observed, <date>” with k and its ends; it can be used as a condition set, once', async () => {
    const planner = await signedInAgent(app, DEMO.planner);
    const k = 0.3;
    const dip = convertAngle(horizonDip(20, { k }).value ?? NaN, 'rad', 'arcmin');
    const res = await planner
      .post('/api/v1/calibrations')
      .send({
        method: 'dip',
        eyeHeightM: 20,
        observedDipArcmin: dip,
        accuracyArcmin: 0.1,
        observedAt: '2026-10-14T09:00:00+02:00',
      })
      .expect(201);
    const id = res.body.calibration.id;

    const saved = await planner.post(`/api/v1/calibrations/${id}/condition-set`).send({}).expect(201);
    const set = ConditionSetSchema.parse(saved.body.conditionSet);
    expect(set.name).toBe('observed, 2026-10-14');
    const ks = set.conditions.map((c) => c.k as number);
    expect(ks).toHaveLength(3);
    // Source: none — the saved set holds the solved k first (round trip of the dip), then kMin and kMax.
    expect(Math.abs((ks[0] ?? NaN) - k)).toBeLessThan(1e-3);
    expect(ks[1]).toBeLessThan(ks[0] ?? NaN);
    expect(ks[2]).toBeGreaterThan(ks[0] ?? NaN);
    expect(saved.body.calibration.conditionSetId).toBe(set.id);

    const listed = (await planner.get('/api/v1/conditions?q=observed').expect(200)).body.items.map((c: { id: string }) => c.id);
    expect(listed).toContain(set.id);
    // The sightline accepts the saved set's conditions as they are.
    const check = await planner.post('/api/v1/sightline').send({ observerHeightM: 20, conditions: set.conditions }).expect(200);
    expect(check.body.results).toHaveLength(3);

    const again = await planner.post(`/api/v1/calibrations/${id}/condition-set`).send({});
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('already_saved');
    const observer = await signedInAgent(app, DEMO.observer);
    expect((await observer.post(`/api/v1/calibrations/${id}/condition-set`).send({})).status).toBe(403);
  });

  it('saves in the same request when a planner asks, and a bound alone becomes a one-condition set', async () => {
    const planner = await signedInAgent(app, DEMO.planner);
    const res = await planner
      .post('/api/v1/calibrations')
      .send({
        method: 'mark',
        eyeHeightM: 6,
        distanceM: 35_000,
        markHeightM: 40,
        markVisible: true,
        observedAt: '2026-09-30T17:45:00Z',
        saveAsConditionSet: true,
      })
      .expect(201);
    expect(res.body.conditionSet).toMatchObject({ name: 'observed, 2026-09-30' });
    expect(res.body.conditionSet.conditions).toHaveLength(1);
    expect(res.body.calibration.conditionSetId).toBe(res.body.conditionSet.id);
  });
});
