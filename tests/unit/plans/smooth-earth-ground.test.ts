import { buildSnapshot } from '@/server/domain/plans/build-snapshot';
import { smoothEarthGround } from '@/shared/plans/smooth-earth-ground';
import type { ConditionSet, Target } from '@/shared/schemas/library';
import type { Post, Site } from '@/shared/schemas/site';

// Invented test data (no real place): an upland district with one tower on a 580 m ridge.
const ring: [number, number][] = [
  [14.0, 61.0],
  [14.2, 61.0],
  [14.2, 61.1],
  [14.0, 61.1],
  [14.0, 61.0],
];
const stamp = '2026-01-01T00:00:00.000Z';
const site = (over: Partial<Site> = {}): Site => ({
  id: '00000000-0000-4000-8000-000000000001',
  name: 'Upland test district',
  kind: 'forest-district',
  notes: '',
  boundary: ring,
  priorityZones: [],
  defaultUnits: 'metric',
  timeZone: 'UTC',
  seaLevelMaxM: null,
  seaArea: null,
  targetGroundM: null,
  version: 0,
  updatedAt: stamp,
  ...over,
});
const tower: Post = {
  id: '00000000-0000-4000-8000-000000000101',
  siteId: site().id,
  name: 'Ridge tower',
  kind: 'tower',
  location: { latDeg: 61.05, lonDeg: 14.1 },
  groundElevationM: 580,
  structureHeightM: 18.4,
  eyeHeightM: 1.6,
  sector: null,
  status: 'existing',
  version: 0,
  updatedAt: stamp,
};
const smoke: Target = {
  id: '00000000-0000-4000-8000-000000000201',
  name: 'Smoke 30 m',
  kind: 'smoke-column',
  heightM: 30,
  widthM: 500,
  requiredVisibleM: 0,
  period: 'day',
  lightIntensityCd: null,
  onWater: false,
  version: 0,
  updatedAt: stamp,
};
const noRefraction: ConditionSet = {
  id: '00000000-0000-4000-8000-000000000301',
  name: 'No refraction',
  conditions: [{ k: 0 }],
  visibilityM: null,
  visibilityKind: 'mor-5pct',
  seaState: null,
  significantWaveHeightM: null,
  backgroundLighting: 'none',
  version: 0,
  updatedAt: stamp,
};
const resultFor = (s: Site) =>
  buildSnapshot({
    title: 'Datum',
    standard: { minSeenPct: 70, priorityMinPosts: 1, targetRules: [], crossBearingMinPct: null },
    site: s,
    posts: [tower],
    targets: [smoke],
    conditionSets: [noRefraction],
  }).results[0]!;

describe('smoothEarthGround', () => {
  test('stated ground first, else sea level on a coast and the post’s own ground inland', () => {
    // common practice, no source: height of eye is counted above the surface the horizon lies on.
    expect(smoothEarthGround({ kind: 'forest-district', targetGroundM: 420 }, tower)).toEqual({ groundM: 420, basis: 'stated' });
    expect(smoothEarthGround({ kind: 'coast-stretch', targetGroundM: null }, tower)).toEqual({ groundM: 0, basis: 'sea-level' });
    expect(smoothEarthGround({ kind: 'forest-district', targetGroundM: null }, tower)).toEqual({
      groundM: 580,
      basis: 'post-ground',
    });
  });

  test('a ridge tower’s smooth-earth horizon is counted from its own ground, not from sea level', () => {
    // Source: horizon distance √(2Rh) at k = 0 with R = 6 371 008.8 m — common practice, no source.
    // 20 m above the ridge: ≈ 16.0 km; counted from sea level (600 m) it would be ≈ 87 km.
    const R = 6_371_008.8;
    const inland = resultFor(site());
    expect(inland.datum).toEqual({ groundM: 580, basis: 'post-ground' });
    expect(inland.observerHeightM).toBeCloseTo(20, 9);
    expect(Math.abs(inland.result.horizonDistanceM! / Math.sqrt(2 * R * 20) - 1)).toBeLessThan(1e-3);
    // A stated ground 100 m below the ridge (a valley floor) gives the tower 120 m of height.
    const valley = resultFor(site({ targetGroundM: 480 }));
    expect(valley.observerHeightM).toBeCloseTo(120, 9);
    expect(valley.datum!.basis).toBe('stated');
    // On a coast the eye is counted from the sea.
    const coast = resultFor(site({ kind: 'coast-stretch' }));
    expect(coast.observerHeightM).toBeCloseTo(600, 9);
    expect(coast.datum!.basis).toBe('sea-level');
  });

  test('an eye below the stated ground counts as 0 m, never negative', () => {
    expect(resultFor(site({ targetGroundM: 700 })).observerHeightM).toBe(0);
  });
});
