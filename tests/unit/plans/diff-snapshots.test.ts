import { buildSnapshot } from '@/server/domain/plans/build-snapshot';
import { diffSnapshots } from '@/shared/plans/diff-snapshots';
import type { ConditionSet, Target } from '@/shared/schemas/library';
import type { Post, Site } from '@/shared/schemas/site';

// Invented test data (no real place): a square district and two towers.
const ring: [number, number][] = [
  [14.0, 61.0],
  [14.2, 61.0],
  [14.2, 61.1],
  [14.0, 61.1],
  [14.0, 61.0],
];
const site: Site = {
  id: '00000000-0000-4000-8000-000000000001',
  name: 'Test district',
  kind: 'forest-district',
  notes: '',
  boundary: ring,
  priorityZones: [{ name: 'North block', weight: 5, ring }],
  defaultUnits: 'metric',
  timeZone: 'UTC',
  seaLevelMaxM: null,
  seaArea: null,
  targetGroundM: null,
  version: 0,
  updatedAt: '2026-01-01T00:00:00.000Z',
};
const post = (n: number, structureHeightM: number): Post => ({
  id: `00000000-0000-4000-8000-00000000010${n}`,
  siteId: site.id,
  name: `Tower ${n}`,
  kind: 'tower',
  location: { latDeg: 61.05, lonDeg: 14.05 + n * 0.05 },
  groundElevationM: 300,
  structureHeightM,
  eyeHeightM: 1.6,
  sector: null,
  status: 'existing',
  version: 0,
  updatedAt: site.updatedAt,
});
const smoke: Target = {
  id: '00000000-0000-4000-8000-000000000201',
  name: 'Smoke 30 m',
  kind: 'smoke-column',
  heightM: 30,
  // Wide enough that the horizon, not the angular size, limits detection.
  widthM: 200,
  requiredVisibleM: 10,
  period: 'day',
  lightIntensityCd: null,
  onWater: false,
  version: 0,
  updatedAt: site.updatedAt,
};
const standard: ConditionSet = {
  id: '00000000-0000-4000-8000-000000000301',
  name: 'Standard',
  conditions: [{ preset: 'standard-optical' }, { k: 0 }],
  visibilityM: null,
  visibilityKind: 'mor-5pct',
  seaState: null,
  significantWaveHeightM: null,
  backgroundLighting: 'none',
  version: 0,
  updatedAt: site.updatedAt,
};
const snap = (posts: Post[], minSeenPct = 70) =>
  buildSnapshot({
    title: 'Cover',
    standard: { minSeenPct, priorityMinPosts: 2, targetRules: [], crossBearingMinPct: null },
    site,
    posts,
    targets: [smoke],
    conditionSets: [standard],
  });

describe('diffSnapshots', () => {
  it('finds nothing between a snapshot and its recomputation', () => {
    const d = diffSnapshots(snap([post(1, 20)]), snap([post(1, 20)]));
    expect(d.same).toBe(true);
    expect(d.results).toEqual([]);
  });

  it('reports an added post and its new result lines', () => {
    const d = diffSnapshots(snap([post(1, 20)]), snap([post(1, 20), post(2, 20)]));
    expect(d.same).toBe(false);
    expect(d.posts).toEqual([{ id: post(2, 20).id, name: 'Tower 2', change: 'added', fields: [] }]);
    // One target × two conditions.
    expect(d.results.map((r) => [r.postName, r.change])).toEqual([
      ['Tower 2', 'added'],
      ['Tower 2', 'added'],
    ]);
  });

  it('reports a raised tower: the changed field and the longer detection ranges', () => {
    const d = diffSnapshots(snap([post(1, 20)]), snap([post(1, 30)]));
    expect(d.posts).toHaveLength(1);
    expect(d.posts[0]!.fields).toEqual([{ field: 'structureHeightM', before: 20, after: 30 }]);
    expect(d.results).toHaveLength(2);
    for (const r of d.results) {
      expect(r.change).toBe('changed');
      expect(r.detectionRangeM.after!).toBeGreaterThan(r.detectionRangeM.before!);
    }
  });

  it('reports the plan’s own fields and a removed post', () => {
    const d = diffSnapshots(snap([post(1, 20), post(2, 20)], 70), snap([post(1, 20)], 80));
    expect(d.plan).toEqual([
      {
        field: 'standard',
        before: { minSeenPct: 70, priorityMinPosts: 2, targetRules: [], crossBearingMinPct: null },
        after: { minSeenPct: 80, priorityMinPosts: 2, targetRules: [], crossBearingMinPct: null },
      },
    ]);
    expect(d.posts.map((p) => p.change)).toEqual(['removed']);
    expect(d.results.every((r) => r.change === 'removed' && r.detectionRangeM.after === null)).toBe(true);
  });

  it('does not modify either snapshot', () => {
    const a = snap([post(1, 20)]);
    const b = snap([post(1, 25), post(2, 20)]);
    const copies = [structuredClone(a), structuredClone(b)];
    diffSnapshots(a, b);
    expect([a, b]).toEqual(copies);
  });
});
