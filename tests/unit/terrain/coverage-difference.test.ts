import { COVERAGE_CHANGE, compareCoverage } from '@/shared/terrain/coverage-difference';
import type { PostsPerCellRaster } from '@/shared/terrain/posts-per-cell';
import { countPostsPerCell } from '@/shared/terrain/posts-per-cell';
import { classifyVisibility } from '@/shared/terrain/visibility-classes';
import { computeHiddenHeightRaster } from '@/shared/terrain/hidden-height-raster';
import { gridOf, mismatches } from '@/tests/unit/terrain/coverage-fixtures';
import { flatPlain, PLAIN_CELL, PLAIN_CONDITIONS, PLAIN_POSTS, PLAIN_TARGET } from '@/tests/unit/terrain/flat-plain';

const grid = gridOf(4, 2, 10);
const raster = (counts: number[], noData: number[] = new Array(8).fill(0)): PostsPerCellRaster => ({
  ...grid,
  counts: Uint8Array.from(counts),
  noData: Uint8Array.from(noData),
  layer: new Uint8Array(8),
  postCount: 3,
});

describe('compareCoverage', () => {
  // Hand-made pairs, one per kind of change (cells of 100 m²):
  //   before: 0 0 1 2 | 3 1 2 0
  //   after:  0 1 0 3 | 1 1 1 N
  const before = raster([0, 0, 1, 2, 3, 1, 2, 0]);
  const after = raster([0, 1, 0, 3, 1, 1, 1, 0], [0, 0, 0, 0, 0, 0, 0, 1]);
  const diff = compareCoverage(before, after);

  test('classifies each cell', () => {
    const { unchanged, gained, lost, morePosts, fewerPosts, noData } = COVERAGE_CHANGE;
    expect(Array.from(diff.changes)).toEqual([unchanged, gained, lost, morePosts, fewerPosts, unchanged, fewerPosts, noData]);
  });

  test('sums areas gained and lost, seen by ≥ 1 and by ≥ 2', () => {
    const s = diff.statistics;
    expect(s.compared).toEqual({ cells: 7, area: 700 });
    expect(s.gainedSeenBy1).toEqual({ cells: 1, area: 100 });
    expect(s.lostSeenBy1).toEqual({ cells: 1, area: 100 });
    expect(s.gainedSeenBy2).toEqual({ cells: 0, area: 0 });
    expect(s.lostSeenBy2).toEqual({ cells: 2, area: 200 }); // 3 → 1 and 2 → 1
    expect(s.netSeenBy1Area).toBe(0);
    expect(s.netSeenBy2Area).toBe(-200);
    expect(s.byChange.fewerPosts).toEqual({ cells: 2, area: 200 });
    expect(s.byChange.unchanged).toEqual({ cells: 2, area: 200 });
  });

  test('a mask limits the comparison', () => {
    const masked = compareCoverage(before, after, Uint8Array.from([0, 1, 1, 0, 0, 0, 0, 0]));
    expect(Array.from(masked.changes)).toEqual([0, COVERAGE_CHANGE.gained, COVERAGE_CHANGE.lost, 0, 0, 0, 0, 0]);
    expect(masked.statistics.compared.cells).toBe(2);
  });

  test('comparing a raster with itself changes nothing; swapping swaps gained and lost', () => {
    const same = compareCoverage(before, before);
    expect(same.statistics.byChange.unchanged.cells).toBe(8);
    const back = compareCoverage(after, before);
    expect(back.statistics.gainedSeenBy1).toEqual(diff.statistics.lostSeenBy1);
    expect(back.statistics.lostSeenBy2).toEqual(diff.statistics.gainedSeenBy2);
    expect(back.statistics.byChange.morePosts).toEqual(diff.statistics.byChange.fewerPosts);
  });

  test('raising a tower on a flat plain gains exactly the ring between the two geographic ranges', () => {
    // Source: geographic range D = √(2R′h) + √(2R′T) (see flat-plain.ts): raising the eye from
    // 5 m to 15 m widens the circle from 3000 m to √(2·100 km·15 m) + 2000 m = 3732 m.
    const terrain = flatPlain();
    const post = PLAIN_POSTS[1];
    const countFor = (eyeHeight: number) => {
      const hidden = computeHiddenHeightRaster(terrain, { ...post, eyeHeight }, PLAIN_CONDITIONS);
      return countPostsPerCell(terrain, [
        { col: post.col, row: post.row, classes: classifyVisibility(hidden, PLAIN_TARGET).classes },
      ]);
    };
    const raised = compareCoverage(countFor(5), countFor(15));
    const r0 = 3000;
    const r1 = Math.sqrt(2 * 100_000 * 15) + 2000;
    // The grid is 6500 m tall: the larger circle is cut at the north and south edges, so
    // compare with the cells whose centres fall between the two circles.
    let ring = 0;
    for (let row = 0; row < terrain.height; row++) {
      for (let col = 0; col < terrain.width; col++) {
        const d = Math.hypot(col - post.col, row - post.row) * PLAIN_CELL;
        if (d > r0 && d <= r1) ring++;
      }
    }
    expect(Math.abs(raised.statistics.gainedSeenBy1.cells / ring - 1)).toBeLessThan(0.005);
    expect(raised.statistics.lostSeenBy1.cells).toBe(0);
    expect(raised.statistics.netSeenBy1Area).toBe(raised.statistics.gainedSeenBy1.area);
  });

  test('does not mutate its inputs; rejects other grids and wrong layers', () => {
    const copies = [before.counts, after.counts, after.noData].map((a) => Uint8Array.from(a));
    compareCoverage(before, after);
    [before.counts, after.counts, after.noData].forEach((a, i) => expect(mismatches(a, copies[i]!)).toBe(0));
    expect(() => compareCoverage(before, { ...after, width: 8, height: 1 })).toThrow(
      expect.objectContaining({ code: 'grid-mismatch', field: 'after' }),
    );
    expect(() => compareCoverage(before, { ...after, cellSize: 20 })).toThrow(expect.objectContaining({ code: 'grid-mismatch' }));
    expect(() => compareCoverage(before, { ...after, noData: new Uint8Array(7) })).toThrow(
      expect.objectContaining({ code: 'invalid-layer', field: 'after.noData' }),
    );
    expect(() => compareCoverage(before, after, new Uint8Array(9))).toThrow(
      expect.objectContaining({ code: 'invalid-layer', field: 'mask' }),
    );
  });
});
