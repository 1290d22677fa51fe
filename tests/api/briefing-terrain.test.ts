import type { Express } from 'express';
import type request from 'supertest';
import { CoverageRunModel } from '@/server/data/models';
import { BriefingSchema, type Briefing } from '@/shared/schemas/assignment';
import { createTestApp } from '@/tests/support/test-db';
import { DEMO, signedInAgent } from '@/tests/support/agents';

let app: Express;
let close: () => Promise<void>;
let observer: request.Agent;

beforeAll(async () => {
  ({ app, close } = await createTestApp());
  observer = await signedInAgent(app, DEMO.observer);
});
afterAll(() => close());

async function briefing(): Promise<Briefing> {
  const { body } = await observer.get('/api/v1/briefing').expect(200);
  return BriefingSchema.parse(body);
}

/** Whether a blind range (degrees true, possibly across north) holds a bearing. */
const holds = (r: { fromDeg: number; toDeg: number }, deg: number) =>
  r.fromDeg < r.toDeg ? deg >= r.fromDeg && deg < r.toDeg : deg >= r.fromDeg || deg < r.toDeg;

describe('GET /api/v1/briefing on a site with terrain', () => {
  it('gives what this post sees from the approved plan’s frozen terrain coverage', async () => {
    const crane = (await briefing()).posts.find((p) => p.post.name === 'Crane Knoll Tower')!;
    expect(crane.basis).toBe('terrain');
    expect(crane.siteHasTerrain).toBe(true);
    const view = crane.terrainView!;
    expect(view).toMatchObject({ sectorDeg: 10, blindBelowPct: 25 });
    // UTM zone 33N (central meridian 15°E) at 51.82°N 15.235°E: γ = Δλ·sin φ ≈ 0.235° · 0.786 ≈ 0.185°.
    // Source: Snyder, Map Projections — A Working Manual (USGS PP 1395), grid convergence of the transverse
    // Mercator, first term γ ≈ Δλ sin φ (from memory).
    expect(view.gridConvergenceDeg).toBeCloseTo(0.185, 2);

    // The seen share per case is the frozen run's own figure for this post.
    const run = (await CoverageRunModel.findByPk(view.runId, { raw: true }))!;
    expect(view.cases.length).toBe(run.cases.length);
    for (const c of view.cases) {
      const frozen = run.cases.find((k) => k.key === c.caseKey)!;
      expect(c.seenPct).toBe(frozen.posts.find((p) => p.postId === crane.post.id)!.seenPct);
      expect(c.sectors).toHaveLength(36);
      expect(c.sectors[0]).toMatchObject({ fromDeg: 0, toDeg: 10 });
      // Detection range per target from the plan's result row for the same target and condition.
      const row = crane.results.find(
        (r) => r.targetId === c.targetId && r.conditionSetId === c.conditionSetId && r.conditionIndex === c.conditionIndex,
      )!;
      expect(c.detectionRangeM).toBe(row.result.detectionRangeM);
      expect(c.limitedBy).toBe(row.result.limitedBy);
      // Every listed blind range is made of sectors each seen below the threshold.
      for (const b of c.blindSectors) {
        expect(b.seenPct).toBeLessThan(25);
        for (const s of c.sectors) if (s.seenPct !== null && holds(b, s.fromDeg)) expect(s.seenPct).toBeLessThan(25);
      }
    }

    // The early smoke column (the standard's target) is seen on about a quarter of the district, and the knoll
    // south of the tower hides the ground due south: 180° true lies in a blind range. Source: the invented demo
    // terrain (assets/terrain/README.md) as the coverage run computed it — common practice, no source.
    const early = view.cases.find((c) => c.targetName === 'Early smoke column' && c.conditionLabel.includes('0.13'))!;
    expect(early.seenPct).toBeGreaterThan(20);
    expect(early.seenPct).toBeLessThan(35);
    expect(early.blindSectors.some((b) => holds(b, 180))).toBe(true);
    // … and northward it sees most of the ground in range.
    expect(early.sectors[0]!.seenPct).toBeGreaterThan(50);

    expect(crane.cautions.map((c) => c.code)).toEqual(
      expect.arrayContaining(['estimates-only', 'refraction-varies', 'visibility-not-detection', 'follow-procedures']),
    );
  });

  it('keeps smooth-earth figures, so labelled, for a post on a site without terrain', async () => {
    // The demo coast has no terrain; Ines Marrow keeps watch at Gull Point on it.
    const marrow = await signedInAgent(app, 'lookout.marrow@demo.kenning.test');
    const body = BriefingSchema.parse((await marrow.get('/api/v1/briefing').expect(200)).body);
    const gull = body.posts.find((p) => p.post.name === 'Gull Point')!;
    expect(gull).toMatchObject({ basis: 'smooth-earth', terrainView: null, siteHasTerrain: false });
  });
});
