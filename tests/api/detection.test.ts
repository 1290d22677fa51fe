import type { Express } from 'express';
import { PlanCoverageSchema, type CoverageCase } from '@/shared/schemas/coverage';
import { PlanSnapshotSchema } from '@/shared/schemas/plan';
import { SightlineResponseSchema } from '@/shared/schemas/sightline';
import { PlanModel } from '@/server/data/models';
import { createTestApp } from '@/tests/support/test-db';
import { DEMO, signedInAgent } from '@/tests/support/agents';

/*
 * The detection model as people meet it through the API: the demo coast plan's
 * coverage (computed when the demo was seeded, on the flat datum) counts
 * detectable targets on the sea only, and the night flare of the target
 * library is limited by its luminous range in haze.
 */

let app: Express;
let close: () => Promise<void>;
let planner: Awaited<ReturnType<typeof signedInAgent>>;

beforeAll(async () => {
  ({ app, close } = await createTestApp());
  planner = await signedInAgent(app, DEMO.planner);
});
afterAll(() => close());

async function coastCases(): Promise<CoverageCase[]> {
  const plan = await PlanModel.findOne({ where: { title: 'Summer watch, Tallow Strand' } });
  const coverage = PlanCoverageSchema.parse((await planner.get(`/api/v1/plans/${plan!.id}/coverage`).expect(200)).body);
  expect(coverage.current?.status).toBe('done');
  return coverage.current!.cases;
}

const byTarget = (cases: CoverageCase[], name: string, conditionSetName = 'Standard day') => {
  const found = cases.find((c) => c.targetName === name && c.conditionSetName === conditionSetName);
  if (!found) throw new Error(`no case for ${name} under ${conditionSetName}`);
  return found;
};

describe('coverage of the demo coast plan counts detectable targets', () => {
  it('a person in the water is far below a small boat in seen share, and the target’s size decides it', async () => {
    const cases = await coastCases();
    const head = byTarget(cases, 'Person in the water (head)');
    const raft = byTarget(cases, 'Six-person life raft');
    const boat = byTarget(cases, 'Small open boat');
    // Source: angular-size limit, range = width / tan(resolving angle); at 1′ a 0.2 m head is
    // lost beyond ≈ 690 m, a raft of about 2 m beyond ≈ 7 km — common practice, no source (the
    // 1′ visual acuity of the normal eye, Snellen's definition). Far less sea is covered for
    // the head than for the boat, which the horizon or the visibility limits instead.
    expect(head.site.seenBy1.pct).toBeLessThan(boat.site.seenBy1.pct / 5);
    expect(head.site.seenBy1.pct).toBeLessThan(raft.site.seenBy1.pct);
    expect(raft.site.seenBy1.pct).toBeLessThanOrEqual(boat.site.seenBy1.pct);
    expect(head.detection).toMatchObject({ rangeLimitedBy: 'angular-size', decidedBy: 'angular-size', seaOnly: true });
    expect(head.detection!.rangeLimitM!).toBeLessThan(1500);
    expect(head.detectionModel).toMatch(/^kenning-detection\//);
    // Per-post shares differ with the target now (they were identical when only the view counted).
    expect(head.posts.map((p) => p.seenPct)).not.toEqual(boat.posts.map((p) => p.seenPct));
    // The plan's own target rule for the head is checked in the head's cases only.
    expect(head.check.rules.some((r) => r.id === 'target-site-seen')).toBe(true);
    expect(boat.check.rules.some((r) => r.id === 'target-site-seen')).toBe(false);
    // The detected area agrees with the share of the counted area.
    const d = head.detection!.areaM2;
    expect(d.detected).toBeCloseTo(head.site.seenBy1.area, 3);
    expect(d.detected + d.noData + d.view + d.range).toBeCloseTo(head.site.total.area, 0);
  });

  it('cells on land do not count for targets on the water: the site’s sea is the area judged', async () => {
    const cases = await coastCases();
    const boat = byTarget(cases, 'Small open boat');
    // Source: plane geometry (trapezoid rule on the invented shoreline of the demo seeder):
    // the site is 18 km × 12 km = 216 km²; south of the shoreline, which runs through
    // (530 km, 5 751.514 km), (536, 5 751.6), (541, 5 751.9), (548, 5 752.075) in UTM 33N,
    // lie 9.343 + 8.750 + 13.913 = 32.005 km² of land, leaving 184.0 km² of sea. The run's
    // local grid differs from UTM by its scale factor (< 0.1 % here) and the cells on the rims.
    const seaKm2 = 216 - 32.005;
    expect(boat.detection!.seaOnly).toBe(true);
    expect(Math.abs(boat.site.total.area / 1e6 / seaKm2 - 1)).toBeLessThan(0.02);
    expect(boat.site.total.area / 1e6).toBeLessThan(216 * 0.9);
  });
});

describe('plan results across the k band', () => {
  it('each result gives its detection range from k 0 to 0.3 and the set’s own conditions, with every limit met', async () => {
    const plan = await PlanModel.findOne({ where: { title: 'Summer watch, Tallow Strand' } });
    const preview = (await planner.get(`/api/v1/plans/${plan!.id}/preview`).expect(200)).body;
    const rows = PlanSnapshotSchema.parse(preview.snapshot).results;
    expect(rows.length).toBeGreaterThan(0);
    for (const row of rows) {
      const band = row.sensitivity!;
      expect(band.ks[0]).toBe(0);
      expect(band.ks).toContain(0.3);
      // A duct (k ≥ 1, here the cold-sea inversion) has no horizon and is left out of the band.
      if (row.result.k < 1) expect(band.ks).toContain(row.result.k);
      else expect(band.ks.every((k) => k < 1)).toBe(true);
      // The result itself lies within its band.
      if (row.result.detectionRangeM !== null) {
        expect(row.result.detectionRangeM).toBeGreaterThanOrEqual(band.detectionRangeM!.min - 1e-6);
        expect(row.result.detectionRangeM).toBeLessThanOrEqual(band.detectionRangeM!.max + 1e-6);
        expect(band.limitedBy).toContain(row.result.limitedBy);
      }
    }
    // A head in the water is limited by its size at every k: refraction does not move it.
    const head = rows.find((r) => r.targetName === 'Person in the water (head)' && r.conditionSetName === 'Standard day')!;
    expect(head.sensitivity!.limitedBy).toEqual(['angular-size']);
    expect(head.sensitivity!.spreadPct).toBeCloseTo(0, 9);
  });
});

describe('a light at night', () => {
  it('the demo hand flare is seen over kilometres in clear air and less in haze, limited by its luminous range', async () => {
    const targets = (await planner.get('/api/v1/targets').expect(200)).body.items as {
      name: string;
      heightM: number;
      widthM: number;
      lightIntensityCd: number | null;
      period: 'day' | 'night';
    }[];
    const sets = (await planner.get('/api/v1/conditions').expect(200)).body.items as {
      name: string;
      visibilityM: number;
      visibilityKind: string;
      backgroundLighting: 'none' | 'some' | 'much';
    }[];
    const flare = targets.find((t) => t.name === 'Hand flare')!;
    expect(flare).toMatchObject({ period: 'night', lightIntensityCd: 15_000 });
    const ask = async (setName: string) => {
      const set = sets.find((s) => s.name === setName)!;
      const res = await planner
        .post('/api/v1/sightline')
        .send({
          observerHeightM: 21.6,
          targetHeightM: flare.heightM,
          distanceM: 10_000,
          targetSizeM: flare.widthM,
          visibilityM: set.visibilityM,
          period: flare.period,
          lightIntensityCd: flare.lightIntensityCd,
          backgroundLighting: set.backgroundLighting,
          conditions: [{ k: 0.13 }],
        })
        .expect(200);
      return SightlineResponseSchema.parse(res.body).results[0]!;
    };
    const clear = await ask('Clear night');
    const haze = await ask('Hazy night, harbour lights');
    // Source: Allard's law E = I·T^(d/1 nmi)/d² with the night threshold 2·10⁻⁷ lx of IALA
    // Recommendation E-200-2 (from memory) and T = 0.05^(1 nmi / V): in 40 km air a 15 000 cd
    // light carries far beyond a 21.6 m eye's geographic range of a 1 m flare (≈ 23 km at k 0.13),
    // so the horizon decides; in 3 km haze, against some shore lights (threshold × 10), it
    // carries only a few kilometres.
    expect(clear.detectionRangeM!).toBeGreaterThan(15_000);
    expect(clear.limitedBy).toBe('horizon');
    expect(clear.luminousRangeM!).toBeGreaterThan(clear.detectionRangeM!);
    expect(haze.limitedBy).toBe('luminous-range');
    expect(haze.detectionRangeM!).toBeGreaterThan(1_000);
    expect(haze.detectionRangeM!).toBeLessThan(clear.detectionRangeM! / 2);
    expect(haze.detectionRangeM).toBeCloseTo(haze.luminousRangeM!, 6);
  });

  it('a light is needed at night, and the sea state is one or the other, with the field named', async () => {
    const base = { observerHeightM: 10, targetHeightM: 1, distanceM: 5000, conditions: [{ k: 0.13 }] };
    const night = await planner.post('/api/v1/sightline').send({ ...base, period: 'night', lightIntensityCd: -1 });
    expect(night.status).toBe(400);
    expect(JSON.stringify(night.body)).toMatch(/lightIntensityCd/);
    const both = await planner.post('/api/v1/sightline').send({ ...base, seaState: 4, significantWaveHeightM: 2 });
    expect(both.status).toBe(400);
    expect(JSON.stringify(both.body)).toMatch(/seaState|significantWaveHeightM/);
    // Rough sea hides a head in the water: the waves decide and nothing is detected.
    const rough = await planner
      .post('/api/v1/sightline')
      .send({ ...base, targetHeightM: 0.2, targetSizeM: 0.2, seaState: 5 })
      .expect(200);
    const r = SightlineResponseSchema.parse(rough.body).results[0]!;
    expect(r.limitedBy).toBe('sea-state');
    expect(r.detectionRangeM).toBe(0);
  });
});
