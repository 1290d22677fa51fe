import { buildSnapshot } from '@/server/domain/plans/build-snapshot';
import { smoothEarthGround } from '@/shared/plans/smooth-earth-ground';
import type { Site } from '@/shared/schemas/site';
import { testConditionSet, testPost, testSite, testSmoke } from '@/tests/support/plan-fixtures';

// Invented test data (no real place): an upland district with one tower on a 580 m ridge.
const site = (over: Partial<Site> = {}): Site => testSite({ name: 'Upland test district', ...over });
const tower = testPost({ name: 'Ridge tower', groundElevationM: 580, structureHeightM: 18.4 });
const smoke = testSmoke({ widthM: 500 });
const noRefraction = testConditionSet({ name: 'No refraction', conditions: [{ k: 0 }] });
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
