import { buildSnapshot } from '@/server/domain/plans/build-snapshot';
import { diffSnapshots } from '@/shared/plans/diff-snapshots';
import type { Post } from '@/shared/schemas/site';
import { SQUARE_RING, testConditionSet, testPost, testSite, testSmoke } from '@/tests/support/plan-fixtures';

// Invented test data (no real place): a square district and two towers.
const site = testSite({ priorityZones: [{ name: 'North block', weight: 5, ring: SQUARE_RING }] });
const post = (n: number, structureHeightM: number): Post =>
  testPost({
    id: `00000000-0000-4000-8000-00000000010${n}`,
    name: `Tower ${n}`,
    location: { latDeg: 61.05, lonDeg: 14.05 + n * 0.05 },
    structureHeightM,
  });
// Wide enough that the horizon, not the angular size, limits detection.
const smoke = testSmoke({ widthM: 200, requiredVisibleM: 10 });
const standard = testConditionSet({ conditions: [{ preset: 'standard-optical' }, { k: 0 }] });
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
