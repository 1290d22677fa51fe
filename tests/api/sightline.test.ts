import type { Express } from 'express';
import request from 'supertest';
import { SightlineResponseSchema, RefractionPresetListSchema } from '@/shared/schemas/sightline';
import { createTestApp } from '@/tests/support/test-db';
import { DEMO, signedInAgent } from '@/tests/support/agents';

let app: Express;
let close: () => Promise<void>;
let agent: Awaited<ReturnType<typeof signedInAgent>>;

beforeAll(async () => {
  ({ app, close } = await createTestApp());
  agent = await signedInAgent(app, DEMO.observer);
});
afterAll(() => close());

const numbersIn = (v: unknown): number[] =>
  typeof v === 'number' ? [v] : v && typeof v === 'object' ? Object.values(v).flatMap(numbersIn) : [];

describe('POST /api/v1/sightline', () => {
  it('answers the contract example with one result per condition, in order', async () => {
    const body = {
      observerHeightM: 30,
      targetHeightM: 10,
      distanceM: 25000,
      requiredVisibleM: 0,
      earthRadiusM: 6371008.8,
      visibilityM: 20000,
      targetSizeM: 3,
      conditions: [
        { k: 0.13 },
        { preset: 'radio-four-thirds' },
        { pressureHpa: 1013.25, temperatureC: 15, lapseRateKPerM: 0.0065 },
      ],
    };
    const res = await agent.post('/api/v1/sightline').send(body);
    expect(res.status).toBe(200);
    const parsed = SightlineResponseSchema.parse(res.body);
    expect(parsed.results).toHaveLength(3);
    expect(parsed.results.map((r) => r.k)).toEqual([0.13, 0.25, expect.closeTo(0.171, 2)]);
    // Horizon of a 30 m eye at k = 0.13: √(2·R/(1−k)·h) ≈ 20.98 km (arc form agrees to < 1 m).
    // Source: the √(2R′h) horizon formula, common practice, no source.
    expect(parsed.results[0]!.horizonDistanceM!).toBeCloseTo(Math.sqrt((2 * 6371008.8 * 30) / 0.87), -1);
    expect(parsed.cautions.map((c) => c.code)).toEqual(
      expect.arrayContaining(['estimates-only', 'refraction-varies', 'visibility-not-detection', 'follow-procedures']),
    );
    expect(numbersIn(res.body).every(Number.isFinite)).toBe(true);
  });

  it('flags ducting with nulls and warnings, never NaN or Infinity', async () => {
    const res = await agent
      .post('/api/v1/sightline')
      .send({ observerHeightM: 20, targetHeightM: 5, distanceM: 40000, conditions: [{ k: 1.2 }] });
    expect(res.status).toBe(200);
    const [r] = res.body.results;
    expect(r.regime).toBe('ducting');
    expect(r.horizonDistanceM).toBeNull();
    expect(r.warnings.map((w: { code: string }) => w.code)).toContain('ducting');
    expect(JSON.stringify(res.body)).not.toMatch(/NaN|Infinity/);
  });

  it.each([
    [{ observerHeightM: -2, conditions: [{ k: 0.13 }] }, 'observerHeightM'],
    [{ conditions: [{ k: 0.13 }] }, 'observerHeightM'],
    [{ observerHeightM: 10 }, 'conditions'],
    [{ observerHeightM: 10, conditions: [] }, 'conditions'],
    [{ observerHeightM: 10, conditions: [{ k: 99 }] }, 'conditions.0.k'],
    [{ observerHeightM: 10, conditions: [{ preset: 'no-such' }] }, 'conditions.0.preset'],
    [{ observerHeightM: 10, distanceM: 5e9, conditions: [{ k: 0 }] }, 'distanceM'],
    [{ observerHeightM: 'tall', conditions: [{ k: 0 }] }, 'observerHeightM'],
  ])('answers %j with 400 naming %s', async (body, field) => {
    const res = await agent.post('/api/v1/sightline').send(body);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_input');
    expect(res.body.error.fields).toHaveProperty([field]);
  });

  it('is 401 signed out', async () => {
    const res = await request(app)
      .post('/api/v1/sightline')
      .send({ observerHeightM: 10, conditions: [{ k: 0 }] });
    expect(res.status).toBe(401);
  });
});

describe('GET /api/v1/refraction-presets', () => {
  it('lists the named conditions with their k and source', async () => {
    const res = await agent.get('/api/v1/refraction-presets').expect(200);
    const { presets } = RefractionPresetListSchema.parse(res.body);
    const byId = Object.fromEntries(presets.map((p) => [p.id, p]));
    // common practice, no source: no refraction k = 0; standard optical 0.13; 4/3 earth k = 0.25.
    expect(byId['no-refraction']!.k).toBe(0);
    expect(byId['standard-optical']!.k).toBeCloseTo(0.13, 10);
    expect(byId['radio-four-thirds']!.k).toBeCloseTo(0.25, 10);
    expect(presets.find((p) => p.k < 0)).toBeDefined();
    expect(presets.find((p) => p.k >= 1)).toBeDefined();
    for (const p of presets) expect(p.source.length).toBeGreaterThan(5);
  });
});
