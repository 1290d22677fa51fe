import { checkCoverageStandard, COVERAGE_STANDARD_RULES } from '@/shared/terrain/check-coverage-standard';
import { computeCoverageStatistics } from '@/shared/terrain/coverage-statistics';
import { patchInteriorPoint } from '@/shared/terrain/patch-interior-point';
import { CROSS_BEARING_CLASS, type CrossBearingRaster } from '@/shared/terrain/cross-bearing-quality';
import type { PostsPerCellRaster } from '@/shared/terrain/posts-per-cell';
import { gridOf, mismatches } from '@/tests/unit/terrain/coverage-fixtures';

/**
 * A hand-made 6 × 5 grid of 10 m cells (100 m² each). Counts per cell, N = no data:
 *
 *   row 0:  0 0 1 2 3 0
 *   row 1:  0 1 1 2 0 0
 *   row 2:  1 1 0 0 0 1
 *   row 3:  2 2 0 N 1 1
 *   row 4:  0 1 1 1 0 0
 *
 * The site is every cell but column 5. Its blind patches (8-connected):
 *   P1 = (0,0) (1,0) (0,1)                      3 cells
 *   P2 = (4,1) (2,2) (3,2) (4,2) (2,3)          5 cells ((4,1) touches (3,2) at a corner)
 *   P3 = (0,4), P4 = (4,4)                      1 cell each
 * All values below are counted by hand from this picture.
 */
const N = 255;
const picture = [
  [0, 0, 1, 2, 3, 0],
  [0, 1, 1, 2, 0, 0],
  [1, 1, 0, 0, 0, 1],
  [2, 2, 0, N, 1, 1],
  [0, 1, 1, 1, 0, 0],
];
const grid = gridOf(6, 5, 10, 500_000, 5_700_000);
const yTop = 5_700_000 + 50;
const counts = Uint8Array.from(picture.flat().map((v) => (v === N ? 0 : v)));
const noData = Uint8Array.from(picture.flat().map((v) => (v === N ? 1 : 0)));
const postsPerCell: PostsPerCellRaster = { ...grid, counts, noData, layer: new Uint8Array(30), postCount: 3 };
// Good at (3,0) and (4,0); weak at the other cells seen by two or more; a stray "good" on a
// single-post cell (2,0) must not be counted (good needs two posts).
const crossClasses = counts.map((c) =>
  c >= 2 ? CROSS_BEARING_CLASS.weak : c === 1 ? CROSS_BEARING_CLASS.single : CROSS_BEARING_CLASS.none,
);
crossClasses[3] = CROSS_BEARING_CLASS.good;
crossClasses[4] = CROSS_BEARING_CLASS.good;
crossClasses[2] = CROSS_BEARING_CLASS.good;
const crossBearings: CrossBearingRaster = {
  ...grid,
  classes: crossClasses,
  bestAngle: new Float32Array(30),
  minCrossingAngle: Math.PI / 6,
};
const siteMask = Uint8Array.from(picture.flat().map((_, i) => (i % 6 === 5 ? 0 : 1)));
const zoneA = Uint8Array.from(picture.flat().map((_, i) => (i < 12 && i % 6 < 5 ? 1 : 0))); // rows 0–1, cols 0–4
const zoneB = new Uint8Array(30);
zoneB[3 * 6 + 3] = 1; // the no-data cell
zoneB[4 * 6 + 4] = 1; // P4
const zones = [
  { name: 'North strip', weight: 3, mask: zoneA },
  { name: 'Wet hollow', weight: 1, mask: zoneB },
];

describe('computeCoverageStatistics on a hand-counted grid', () => {
  const stats = computeCoverageStatistics(postsPerCell, crossBearings, siteMask, zones, { blindAreaMinArea: 300 });

  test('site shares: 25 cells, 1 without data, 10 unseen, 14 / 5 / 1 seen by ≥ 1 / 2 / 3, 2 good', () => {
    const s = stats.site;
    expect(stats.cellArea).toBe(100);
    expect([s.total.cells, s.noData.cells, s.unseen.cells, s.seenBy1.cells, s.seenBy2.cells, s.seenBy3.cells]).toEqual([
      25, 1, 10, 14, 5, 1,
    ]);
    expect(s.goodCrossBearing.cells).toBe(2);
    expect(s.seenBy1.area).toBe(1400);
    expect(s.seenBy1.pct).toBeCloseTo(56, 10);
    expect(s.noData.pct).toBeCloseTo(4, 10);
    expect(s.total.pct).toBe(100);
  });

  test('zones and their weighted mean', () => {
    const [a, b] = stats.zones;
    expect(a!.name).toBe('North strip');
    expect([
      a!.total.cells,
      a!.unseen.cells,
      a!.seenBy1.cells,
      a!.seenBy2.cells,
      a!.seenBy3.cells,
      a!.goodCrossBearing.cells,
    ]).toEqual([10, 4, 6, 3, 1, 2]);
    expect([b!.total.cells, b!.noData.cells, b!.unseen.cells, b!.seenBy1.cells]).toEqual([2, 1, 1, 0]);
    expect(b!.noData.pct).toBeCloseTo(50, 10);
    expect(stats.zonesWeighted!.seenBy1Pct).toBeCloseTo((3 * 60 + 1 * 0) / 4, 10);
    expect(stats.zonesWeighted!.seenBy2Pct).toBeCloseTo((3 * 30) / 4, 10);
    expect(stats.zonesWeighted!.totalWeight).toBe(4);
  });

  test('blind areas: 8-connected, listed from 300 m² up, largest first, with centroid and bounds', () => {
    // Source: 8-connectivity of digital image processing (common practice, no source).
    expect(stats.blindSummary).toEqual({
      count: 4,
      area: 1000,
      minArea: 300,
      belowThreshold: { count: 2, area: 200 },
      notListed: { count: 0, area: 0 },
    });
    expect(stats.blindAreas).toHaveLength(2);
    const [p2, p1] = stats.blindAreas;
    expect(p2!.cells).toBe(5);
    expect(p2!.area).toBe(500);
    expect(p2!.centroid.col).toBeCloseTo(3, 12); // (4 + 2 + 3 + 4 + 2) / 5
    expect(p2!.centroid.row).toBeCloseTo(2, 12); // (1 + 2 + 2 + 2 + 3) / 5
    expect(p2!.centroid.x).toBeCloseTo(500_000 + 3.5 * 10, 9);
    expect(p2!.centroid.y).toBeCloseTo(yTop - 2.5 * 10, 9);
    expect(p2!.bounds).toEqual({
      minCol: 2,
      maxCol: 4,
      minRow: 1,
      maxRow: 3,
      west: 500_020,
      east: 500_050,
      south: yTop - 40,
      north: yTop - 10,
    });
    expect(p1!.cells).toBe(3);
    expect(p1!.centroid.col).toBeCloseTo(1 / 3, 12);
    expect(p1!.centroid.row).toBeCloseTo(1 / 3, 12);
  });

  test('each blind area has an interior point in one of its own cells (regression: the map link landed on seen ground)', () => {
    const [p2, p1] = stats.blindAreas;
    // P2's cell farthest from its edge: every cell of it touches seen ground, so 1 cell, and the
    // tie goes to the cell nearest its centroid (3, 2), which is in it.
    expect(p2!.interior).toMatchObject({ col: 3, row: 2, edgeDistance: 10 });
    expect(p2!.interior.x).toBeCloseTo(500_000 + 3.5 * 10, 9);
    expect(p1!.interior).toMatchObject({ col: 0, row: 0 });

    // A U-shaped blind patch on a 7 × 6 grid: its centroid (col 3, row ≈ 2.6) is seen ground.
    const u = [
      [1, 1, 1, 1, 1, 1, 1],
      [1, 0, 1, 1, 1, 0, 1],
      [1, 0, 1, 1, 1, 0, 1],
      [1, 0, 1, 1, 1, 0, 1],
      [1, 0, 0, 0, 0, 0, 1],
      [1, 1, 1, 1, 1, 1, 1],
    ].flat();
    const uGrid = gridOf(7, 6, 10, 500_000, 5_700_000);
    const uCounts = Uint8Array.from(u);
    const uPosts: PostsPerCellRaster = {
      ...uGrid,
      counts: uCounts,
      noData: new Uint8Array(42),
      layer: new Uint8Array(42),
      postCount: 1,
    };
    const uCross: CrossBearingRaster = {
      ...uGrid,
      classes: new Uint8Array(42),
      bestAngle: new Float32Array(42),
      minCrossingAngle: Math.PI / 6,
    };
    const [patch] = computeCoverageStatistics(uPosts, uCross, null, [], { blindAreaMinArea: 0 }).blindAreas;
    expect(patch!.cells).toBe(11);
    const at = (col: number, row: number) => uCounts[row * 7 + col];
    expect(at(Math.round(patch!.centroid.col), Math.round(patch!.centroid.row))).toBe(1); // centroid on seen ground
    expect(at(patch!.interior.col, patch!.interior.row)).toBe(0); // interior point blind
  });

  test('the list is cut at maxBlindAreas; without a site mask the whole grid counts', () => {
    const cut = computeCoverageStatistics(postsPerCell, crossBearings, siteMask, [], { blindAreaMinArea: 0, maxBlindAreas: 1 });
    expect(cut.blindAreas.map((b) => b.cells)).toEqual([5]);
    expect(cut.blindSummary.notListed).toEqual({ count: 3, area: 500 });
    expect(cut.zonesWeighted).toBeNull();
    const whole = computeCoverageStatistics(postsPerCell, crossBearings, null, [], { blindAreaMinArea: 0 });
    expect(whole.site.total.cells).toBe(30);
    // Column 5 joins in: (5,0) and (5,1) touch (4,1) of P2 (→ 7 cells); (5,4) touches P4 (→ 2).
    expect(whole.blindAreas.map((b) => b.cells)).toEqual([7, 3, 2, 1]);
  });

  test('does not mutate its inputs', () => {
    const copies = [counts, noData, crossClasses, siteMask, zoneA, zoneB].map((a) => Uint8Array.from(a));
    computeCoverageStatistics(postsPerCell, crossBearings, siteMask, zones);
    [counts, noData, crossClasses, siteMask, zoneA, zoneB].forEach((a, i) => expect(mismatches(a, copies[i]!)).toBe(0));
  });

  test('rejects layers of the wrong size, other grids and bad options, naming the field', () => {
    expect(() => computeCoverageStatistics(postsPerCell, crossBearings, new Uint8Array(29))).toThrow(
      expect.objectContaining({ code: 'invalid-layer', field: 'siteMask' }),
    );
    expect(() => computeCoverageStatistics(postsPerCell, { ...crossBearings, xll: 0 }, siteMask)).toThrow(
      expect.objectContaining({ code: 'grid-mismatch', field: 'crossBearings' }),
    );
    expect(() =>
      computeCoverageStatistics(postsPerCell, crossBearings, siteMask, [{ name: 'x', weight: 1, mask: new Uint8Array(3) }]),
    ).toThrow(expect.objectContaining({ code: 'invalid-layer', field: 'zones.0.mask' }));
    expect(() =>
      computeCoverageStatistics(postsPerCell, crossBearings, siteMask, [{ name: 'x', weight: 0, mask: zoneA }]),
    ).toThrow(expect.objectContaining({ code: 'invalid-option', field: 'zones.0.weight' }));
    expect(() => computeCoverageStatistics(postsPerCell, crossBearings, siteMask, [], { blindAreaMinArea: -1 })).toThrow(
      expect.objectContaining({ code: 'invalid-option', field: 'blindAreaMinArea' }),
    );
    expect(() => computeCoverageStatistics(postsPerCell, crossBearings, siteMask, [], { maxBlindAreas: 1.5 })).toThrow(
      expect.objectContaining({ code: 'invalid-option', field: 'maxBlindAreas' }),
    );
  });
});

describe('checkCoverageStandard', () => {
  const stats = computeCoverageStatistics(postsPerCell, crossBearings, siteMask, zones, { blindAreaMinArea: 300 });

  test('the plan default 70 % / 2 posts: the site (56 %) and both zones fail, with where and by how much', () => {
    const verdict = checkCoverageStandard(stats, { minSeenPct: 70, priorityMinPosts: 2 });
    expect(verdict.passed).toBe(false);
    expect(verdict.interpretation).toBe(COVERAGE_STANDARD_RULES.version);
    const [site, north, wet] = verdict.rules;
    expect(site).toMatchObject({ id: 'site-seen', zoneName: null, minPosts: 1, minPct: 70, passed: false });
    expect(site!.actualPct).toBeCloseTo(56, 10);
    expect(site!.shortfallPct).toBeCloseTo(14, 10);
    expect(site!.shortfallArea).toBe(400); // ceil(0.7 × 25) − 14 = 4 cells
    expect(site!.reasons.join(' ')).toMatch(/56\.0 % seen by at least one post, 14\.0 points short of the 70\.0 %/);
    expect(site!.reasons.join(' ')).toMatch(/largest blind areas .*around E 500035 m, N 5700025 m \(col 3, row 2\)/);
    expect(site!.reasons.join(' ')).toMatch(/has no terrain data and counts as not seen/);
    expect(north).toMatchObject({ id: 'priority-zone-seen', zoneName: 'North strip', minPosts: 2, passed: false });
    expect(north!.text).toBe('At least 70 % of priority zone “North strip” is seen by at least 2 posts.');
    expect(north!.actualPct).toBeCloseTo(30, 10);
    expect(north!.shortfallArea).toBe(400); // 7 − 3 cells
    expect(north!.reasons[0]).toMatch(/Priority zone “North strip”: 30\.0 % seen by at least 2 posts, 40\.0 points short/);
    expect(wet).toMatchObject({ zoneName: 'Wet hollow', passed: false, actualPct: 0 });
    expect(verdict.reasons.length).toBeGreaterThanOrEqual(3);
  });

  test('60 % / 1 post: a share exactly on the limit passes; the site is 4 points short', () => {
    const verdict = checkCoverageStandard(stats, { minSeenPct: 60, priorityMinPosts: 1 });
    const [site, north] = verdict.rules;
    expect(north!.passed).toBe(true); // 6 of 10 cells = 60 %
    expect(north!.shortfallPct).toBe(0);
    expect(north!.reasons[0]).toMatch(/passes/);
    expect(site!.passed).toBe(false);
    expect(site!.shortfallArea).toBe(100); // ceil(15) − 14 = 1 cell
    // Failing rules' reasons come first.
    expect(verdict.reasons[0]).toMatch(/^The site: 56\.0 %/);
  });

  test('50 % / 1 post passes everywhere but the wet hollow; no zones → the site rule alone', () => {
    const verdict = checkCoverageStandard(stats, { minSeenPct: 50, priorityMinPosts: 1 });
    expect(verdict.rules.map((r) => r.passed)).toEqual([true, true, false]);
    const siteOnly = computeCoverageStatistics(postsPerCell, crossBearings, siteMask, []);
    const alone = checkCoverageStandard(siteOnly, { minSeenPct: 50, priorityMinPosts: 2 });
    expect(alone.rules).toHaveLength(1);
    expect(alone.passed).toBe(true);
    expect(alone.standard).toEqual({ minSeenPct: 50, priorityMinPosts: 2, crossBearingMinPct: null, targetRules: [] });
  });

  test('a zone with no cells on the grid fails with a reason', () => {
    const off = computeCoverageStatistics(postsPerCell, crossBearings, siteMask, [
      { name: 'Beyond the map', weight: 5, mask: new Uint8Array(30) },
    ]);
    const verdict = checkCoverageStandard(off, { minSeenPct: 10, priorityMinPosts: 1 });
    expect(verdict.rules[1]!.passed).toBe(false);
    expect(verdict.rules[1]!.reasons[0]).toMatch(/“Beyond the map” has no cells on the terrain grid/);
  });

  test('the verdict is plain data (survives JSON) and the input is not changed', () => {
    const before = JSON.stringify(stats);
    const verdict = checkCoverageStandard(stats, { minSeenPct: 70, priorityMinPosts: 2 });
    expect(JSON.parse(JSON.stringify(verdict))).toEqual(verdict);
    expect(JSON.stringify(stats)).toBe(before);
  });

  test('rejects standards outside the schema’s range', () => {
    for (const standard of [
      { minSeenPct: 101, priorityMinPosts: 2 },
      { minSeenPct: -1, priorityMinPosts: 2 },
      { minSeenPct: NaN, priorityMinPosts: 2 },
    ]) {
      expect(() => checkCoverageStandard(stats, standard)).toThrow(
        expect.objectContaining({ code: 'invalid-standard', field: 'standard.minSeenPct' }),
      );
    }
    for (const priorityMinPosts of [0, 4, 1.5]) {
      expect(() => checkCoverageStandard(stats, { minSeenPct: 70, priorityMinPosts })).toThrow(
        expect.objectContaining({ code: 'invalid-standard', field: 'standard.priorityMinPosts' }),
      );
    }
  });
});

describe('blind-area interior points on random grids', () => {
  test('each listed area’s interior is patchInteriorPoint of that area alone (one transform serves all areas)', () => {
    // Source: patchInteriorPoint's rule (farthest from the edge, ties to the centroid, then row order), applied
    // here to each patch cut out on its own bounding box — common practice, no source.
    let seed = 5;
    const rand = () => (seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31;
    let checked = 0;
    for (let t = 0; t < 8; t++) {
      const width = 20 + Math.floor(rand() * 40);
      const height = 20 + Math.floor(rand() * 40);
      const g = gridOf(width, height, 10, 500_000, 5_700_000);
      const cellCounts = Uint8Array.from({ length: width * height }, () => (rand() < 0.45 ? 0 : 1));
      const ppc: PostsPerCellRaster = {
        ...g,
        counts: cellCounts,
        noData: new Uint8Array(width * height),
        layer: new Uint8Array(width * height),
        postCount: 1,
      };
      const cross: CrossBearingRaster = {
        ...g,
        classes: new Uint8Array(width * height),
        bestAngle: new Float32Array(width * height),
        minCrossingAngle: Math.PI / 6,
      };
      const result = computeCoverageStatistics(ppc, cross, null, [], { blindAreaMinArea: 0, maxBlindAreas: 1000 });
      for (const area of result.blindAreas) {
        const { minCol, maxCol, minRow, maxRow } = area.bounds;
        const w = maxCol - minCol + 1;
        const h = maxRow - minRow + 1;
        // The patch alone: flood-filled from the cell the statistics put inside it.
        const alone = new Uint8Array(w * h);
        const stack = [[area.interior.col, area.interior.row]];
        alone[(area.interior.row - minRow) * w + area.interior.col - minCol] = 1;
        while (stack.length > 0) {
          const [c, r] = stack.pop()!;
          for (let dr = -1; dr <= 1; dr++)
            for (let dc = -1; dc <= 1; dc++) {
              const cc = c! + dc;
              const rr = r! + dr;
              if (cc < minCol || cc > maxCol || rr < minRow || rr > maxRow) continue;
              const k = (rr - minRow) * w + cc - minCol;
              if (alone[k] === 0 && cellCounts[rr * width + cc] === 0) {
                alone[k] = 1;
                stack.push([cc, rr]);
              }
            }
        }
        expect(alone.reduce((n, v) => n + v, 0)).toBe(area.cells);
        const own = patchInteriorPoint(alone, w, h)!;
        expect({ col: area.interior.col, row: area.interior.row }).toEqual({ col: minCol + own.col, row: minRow + own.row });
        expect(area.interior.edgeDistance).toBe(own.edgeDistanceCells * 10);
        checked++;
      }
    }
    expect(checked).toBeGreaterThan(100);
  });
});
