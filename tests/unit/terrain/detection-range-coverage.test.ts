/**
 * Coverage of detectable targets: the per-post detection range cuts each
 * post's seen area, the site's undetected cells are split by what decided
 * them, and the standard's target rules and cross-bearing share are checked.
 */
import { checkCoverageStandard } from '@/shared/terrain/check-coverage-standard';
import { computeCoverageStatistics } from '@/shared/terrain/coverage-statistics';
import { evaluateNetworkCoverage } from '@/shared/terrain/network-coverage';
import { rasterizePolygon, type PolygonRing } from '@/shared/terrain/rasterize-polygon';
import { classifyVisibility, VISIBILITY_CLASS } from '@/shared/terrain/visibility-classes';
import {
  PLAIN_CELL,
  PLAIN_POSTS,
  PLAIN_RANGE,
  PLAIN_TARGET,
  flatPlain,
  plainHiddenRasters,
} from '@/tests/unit/terrain/flat-plain';
import { oneRowHidden } from '@/tests/unit/terrain/one-row-raster';

jest.setTimeout(60_000);

const STANDARD = { minSeenPct: 70, priorityMinPosts: 2 };

describe('classifyVisibility with a detection range', () => {
  // common practice, no source: a cell farther than the detection range cannot count, whatever the view.
  const raster = oneRowHidden([0, 0, 5, 50, 0, NaN]);
  test('cells beyond the range (centre to centre) are out of range, the rest keep their class', () => {
    const classes = classifyVisibility(raster, 30, { rangeLimit: { col: 0, row: 0, maxDistance: 60 } }).classes;
    expect(Array.from(classes)).toEqual([
      VISIBILITY_CLASS.seen,
      VISIBILITY_CLASS.seen,
      VISIBILITY_CLASS.targetOnly,
      VISIBILITY_CLASS.outOfRange,
      VISIBILITY_CLASS.outOfRange,
      VISIBILITY_CLASS.outOfRange,
    ]);
  });
  test('a range of 0 m (unlit at night, under the wave crests) reaches no cell, not even the post’s own', () => {
    const classes = classifyVisibility(raster, 30, { rangeLimit: { col: 0, row: 0, maxDistance: 0 } }).classes;
    expect(Array.from(classes).every((c) => c === VISIBILITY_CLASS.outOfRange)).toBe(true);
  });
  test('a negative or missing range is refused', () => {
    expect(() => classifyVisibility(raster, 30, { rangeLimit: { col: 0, row: 0, maxDistance: -1 } })).toThrow(
      expect.objectContaining({ code: 'invalid-option' }),
    );
    expect(() => classifyVisibility(raster, 30, { rangeLimit: { col: 0, row: 0, maxDistance: NaN } })).toThrow(
      expect.objectContaining({ code: 'invalid-option' }),
    );
  });
});

describe('evaluateNetworkCoverage with a detection range on the flat plain', () => {
  const hidden = plainHiddenRasters();
  const posts = hidden.map((h, i) => ({ post: PLAIN_POSTS[i]!, hidden: h }));
  const cellArea = PLAIN_CELL * PLAIN_CELL;

  test('a range shorter than the geographic range shrinks each post’s circle to it, and the range decides the rest', () => {
    // Source: area of a disc, πr² (plane geometry); on a flat plain every cell within the
    // geographic range (3000 m here, see flat-plain.ts) is in view, so a 1500 m detection
    // range leaves three discs of 1500 m that do not overlap (posts 4000 m apart).
    const range = 1500;
    const result = evaluateNetworkCoverage({
      posts,
      targetHeight: PLAIN_TARGET,
      siteMask: null,
      standard: STANDARD,
      rangeLimit: range,
    });
    const seenArea = result.statistics.site.seenBy1.area;
    const discs = 3 * Math.PI * range * range;
    expect(Math.abs(seenArea / discs - 1)).toBeLessThan(0.01);
    expect(result.statistics.site.seenBy2.cells).toBe(0);
    const { detectedCells, noDataCells, viewCells, rangeCells } = result.limits;
    expect(detectedCells).toBe(result.statistics.site.seenBy1.cells);
    expect(noDataCells).toBe(0);
    // Within 1500 m of a post everything is in view: nothing is left for the view to decide.
    expect(viewCells).toBe(0);
    expect(detectedCells + rangeCells).toBe(result.postsPerCell.counts.length);
    expect(result.limits.cellArea).toBe(cellArea);
    // Each post's own layer marks the cells beyond its range.
    const own = result.postClasses[0]!;
    const farCell = 130 * 580 + (130 + Math.ceil(range / PLAIN_CELL) + 2);
    expect(own[farCell]).toBe(VISIBILITY_CLASS.outOfRange);
  });

  test('a range beyond the geographic range changes nothing: the horizon (the view) decides', () => {
    const free = evaluateNetworkCoverage({ posts, targetHeight: PLAIN_TARGET, siteMask: null, standard: STANDARD });
    const far = evaluateNetworkCoverage({
      posts,
      targetHeight: PLAIN_TARGET,
      siteMask: null,
      standard: STANDARD,
      rangeLimit: PLAIN_RANGE + 500,
    });
    expect(far.statistics.site.seenBy1.cells).toBe(free.statistics.site.seenBy1.cells);
    expect(far.statistics.site.seenBy2.cells).toBe(free.statistics.site.seenBy2.cells);
    expect(free.limits.rangeCells).toBe(0);
    expect(free.limits.viewCells).toBe(free.postsPerCell.counts.length - free.limits.detectedCells);
    // A two-post overlap exists at the full range (A–B, 4000 m apart, 3000 m each) …
    expect(free.statistics.site.seenBy2.cells).toBeGreaterThan(0);
    // … and vanishes when the detection range is under half the spacing.
    const short = evaluateNetworkCoverage({
      posts,
      targetHeight: PLAIN_TARGET,
      siteMask: null,
      standard: STANDARD,
      rangeLimit: 1900,
    });
    expect(short.statistics.site.seenBy2.cells).toBe(0);
  });

  test('a range of 0 m detects nothing anywhere', () => {
    const none = evaluateNetworkCoverage({
      posts,
      targetHeight: PLAIN_TARGET,
      siteMask: null,
      standard: STANDARD,
      rangeLimit: 0,
    });
    expect(none.statistics.site.seenBy1.cells).toBe(0);
    expect(none.limits.rangeCells).toBe(none.postsPerCell.counts.length);
    expect(none.check.passed).toBe(false);
  });
});

describe('checkCoverageStandard: target rules and the cross-bearing share', () => {
  const terrain = flatPlain();
  const hidden = plainHiddenRasters(terrain);
  const posts = hidden.map((h, i) => ({ post: PLAIN_POSTS[i]!, hidden: h }));
  // A zone square in the A–B overlap off their axis, where bearings cross steeply (cols 200–220, rows 60–90), another far east beyond C's reach.
  const grid = terrain;
  const square = (x0: number, y0: number, x1: number, y1: number): PolygonRing[] => [
    [
      [grid.xll + x0 * PLAIN_CELL, grid.yll + (grid.height - y0) * PLAIN_CELL],
      [grid.xll + x1 * PLAIN_CELL, grid.yll + (grid.height - y0) * PLAIN_CELL],
      [grid.xll + x1 * PLAIN_CELL, grid.yll + (grid.height - y1) * PLAIN_CELL],
      [grid.xll + x0 * PLAIN_CELL, grid.yll + (grid.height - y1) * PLAIN_CELL],
      [grid.xll + x0 * PLAIN_CELL, grid.yll + (grid.height - y0) * PLAIN_CELL],
    ],
  ];
  const zones = [
    { name: 'Overlap', weight: 1, mask: rasterizePolygon(grid, square(200, 60, 220, 90)) },
    { name: 'Far east', weight: 1, mask: rasterizePolygon(grid, square(560, 0, 580, 40)) },
  ];
  const result = evaluateNetworkCoverage({ posts, targetHeight: PLAIN_TARGET, siteMask: null, standard: STANDARD });
  const stats = computeCoverageStatistics(result.postsPerCell, result.crossBearings, null, zones);

  test('a site rule for a target is checked against the share seen by its number of posts', () => {
    // common practice, no source: "x % of the site by ≥ n posts" is a share of the site's cells.
    const site1 = stats.site.seenBy1.pct;
    const pass = checkCoverageStandard(stats, {
      minSeenPct: 0,
      priorityMinPosts: 1,
      targetRules: [{ targetName: 'Person in the water', area: 'site', minPosts: 1, minPct: Math.floor(site1) }],
    });
    const rule = pass.rules.find((r) => r.id === 'target-site-seen')!;
    expect(rule.passed).toBe(true);
    expect(rule.actualPct).toBeCloseTo(site1, 9);
    expect(rule.text).toMatch(/^Person in the water: at least \d+ % of the site is seen by at least 1 posts?\./);
    const fail = checkCoverageStandard(stats, {
      minSeenPct: 0,
      priorityMinPosts: 1,
      targetRules: [{ targetName: 'Person in the water', area: 'site', minPosts: 2, minPct: Math.ceil(site1) }],
    });
    const failing = fail.rules.find((r) => r.id === 'target-site-seen')!;
    expect(failing.passed).toBe(false);
    expect(failing.actualPct).toBeCloseTo(stats.site.seenBy2.pct, 9);
    expect(fail.passed).toBe(false);
    expect(fail.reasons[0]).toMatch(/^Person in the water, the site/);
  });

  test('a zone rule for a target gives one rule per priority zone and names the zone that fails', () => {
    const verdict = checkCoverageStandard(stats, {
      minSeenPct: 0,
      priorityMinPosts: 1,
      targetRules: [{ targetName: 'Life raft', area: 'priority-zones', minPosts: 2, minPct: 90 }],
    });
    const zoneRules = verdict.rules.filter((r) => r.id === 'target-zone-seen');
    expect(zoneRules.map((r) => [r.zoneName, r.passed])).toEqual([
      ['Overlap', true],
      ['Far east', false],
    ]);
    expect(zoneRules[1]!.actualPct).toBe(0);
  });

  test('the cross-bearing share counts only good crossings in each zone', () => {
    const overlap = stats.zones[0]!;
    expect(overlap.goodCrossBearing.pct).toBeGreaterThan(0);
    const verdict = checkCoverageStandard(stats, { minSeenPct: 0, priorityMinPosts: 1, crossBearingMinPct: 1 });
    const cross = verdict.rules.filter((r) => r.id === 'priority-zone-cross-bearing');
    expect(cross).toHaveLength(2);
    expect(cross[0]!.actualPct).toBeCloseTo(overlap.goodCrossBearing.pct, 9);
    expect(cross[0]!.passed).toBe(overlap.goodCrossBearing.pct >= 1);
    expect(cross[1]!.passed).toBe(false);
    expect(verdict.standard.crossBearingMinPct).toBe(1);
    expect(() => checkCoverageStandard(stats, { minSeenPct: 0, priorityMinPosts: 1, crossBearingMinPct: 101 })).toThrow(
      expect.objectContaining({ code: 'invalid-standard', field: 'standard.crossBearingMinPct' }),
    );
  });
});
