// geotiff's CommonJS build requires quick-lru, which ships only as an ES module that
// Jest's CommonJS runtime cannot load; it is used for remote sources only, so a Map stands in.
jest.mock('quick-lru', () => ({ __esModule: true, default: class QuickLRU extends Map {} }));

import { readFileSync } from 'node:fs';
import path from 'node:path';
import { DEMO_SITES } from '@/server/seeders/demo';
import { toUtm } from '@/shared/geo/to-utm';
import { utmGridConvergence } from '@/shared/geo/utm-grid-convergence';
import { computeNetworkCoverage, type NetworkPostSetup } from '@/shared/terrain/compute-network-coverage';
import { CROSS_BEARING_CLASS, crossBearingQuality } from '@/shared/terrain/cross-bearing-quality';
import { computeCoverageStatistics } from '@/shared/terrain/coverage-statistics';
import { decodeClassRaster } from '@/shared/terrain/decode-class-raster';
import { encodeClassRaster } from '@/shared/terrain/encode-class-raster';
import { readGeoTiff } from '@/shared/terrain/formats/geotiff-reader';
import { computeHiddenHeightRaster } from '@/shared/terrain/hidden-height-raster';
import { locatePostCell } from '@/shared/terrain/locate-post-cell';
import { evaluateNetworkCoverage, type NetworkCoverage } from '@/shared/terrain/network-coverage';
import { countPostsPerCell } from '@/shared/terrain/posts-per-cell';
import { rasterizePolygon } from '@/shared/terrain/rasterize-polygon';
import type { TerrainRaster } from '@/shared/terrain/terrain-raster';
import { classifyVisibility, VISIBILITY_CLASS } from '@/shared/terrain/visibility-classes';
import { mismatches } from '@/tests/unit/terrain/coverage-fixtures';
import { flatPlain, PLAIN_CONDITIONS, PLAIN_POSTS, PLAIN_TARGET, plainHiddenRasters } from '@/tests/unit/terrain/flat-plain';

jest.setTimeout(60_000);

const STANDARD = { minSeenPct: 70, priorityMinPosts: 2 };

/** Invariants every result must keep, whatever the terrain. */
function expectConsistent(result: NetworkCoverage, siteMask: Uint8Array | null): void {
  const { postsPerCell: ppc, crossBearings: cross, statistics: stats, check } = result;
  let broken = 0;
  for (let i = 0; i < ppc.counts.length; i++) {
    const c = ppc.counts[i]!;
    const k = cross.classes[i]!;
    // good ⊆ weak ∪ good ⊆ seen by ≥ 2; single ⇔ 1; none ⇔ 0 (no data included).
    const expected =
      c === 0
        ? [CROSS_BEARING_CLASS.none]
        : c === 1
          ? [CROSS_BEARING_CLASS.single]
          : [CROSS_BEARING_CLASS.weak, CROSS_BEARING_CLASS.good];
    if (!(expected as number[]).includes(k)) broken++;
    if (ppc.noData[i] === 1 && c !== 0) broken++;
  }
  expect(broken).toBe(0);
  for (const area of [stats.site, ...stats.zones]) {
    expect(area.noData.cells + area.unseen.cells + area.seenBy1.cells).toBe(area.total.cells);
    expect(area.seenBy3.cells).toBeLessThanOrEqual(area.seenBy2.cells);
    expect(area.seenBy2.cells).toBeLessThanOrEqual(area.seenBy1.cells);
    expect(area.goodCrossBearing.cells).toBeLessThanOrEqual(area.seenBy2.cells);
    expect(area.seenBy1.area).toBeCloseTo(area.seenBy1.cells * stats.cellArea, 6);
    expect(area.noData.pct + area.unseen.pct + area.seenBy1.pct).toBeCloseTo(area.total.cells > 0 ? 100 : 0, 9);
  }
  const b = stats.blindSummary;
  expect(b.area).toBeCloseTo(stats.site.unseen.area, 6);
  const listed = stats.blindAreas.reduce((sum, a) => sum + a.area, 0);
  expect(listed + b.belowThreshold.area + b.notListed.area).toBeCloseTo(b.area, 6);
  for (let j = 1; j < stats.blindAreas.length; j++)
    expect(stats.blindAreas[j]!.area).toBeLessThanOrEqual(stats.blindAreas[j - 1]!.area);
  for (const blind of stats.blindAreas) {
    expect(blind.area).toBeGreaterThanOrEqual(b.minArea);
    const { minCol, maxCol, minRow, maxRow } = blind.bounds;
    expect(blind.centroid.col).toBeGreaterThanOrEqual(minCol);
    expect(blind.centroid.col).toBeLessThanOrEqual(maxCol);
    expect(blind.centroid.row).toBeGreaterThanOrEqual(minRow);
    expect(blind.centroid.row).toBeLessThanOrEqual(maxRow);
    // The patch's corner cells on its bounding box rows are unseen site cells.
    const W = ppc.width;
    let onTopRow = 0;
    for (let col = minCol; col <= maxCol; col++) {
      const i = minRow * W + col;
      if (ppc.counts[i] === 0 && ppc.noData[i] === 0 && (siteMask === null || siteMask[i] === 1)) onTopRow++;
    }
    expect(onTopRow).toBeGreaterThan(0);
  }
  const siteRule = check.rules[0]!;
  expect(siteRule.passed).toBe(stats.site.seenBy1.pct >= check.standard.minSeenPct);
  expect(check.passed).toBe(check.rules.every((r) => r.passed));
}

describe('evaluateNetworkCoverage on the flat plain', () => {
  const hidden = plainHiddenRasters();
  const posts = hidden.map((h, i) => ({ post: PLAIN_POSTS[i]!, hidden: h }));

  test('equals the functions it calls, one after the other', () => {
    const result = evaluateNetworkCoverage({ posts, targetHeight: PLAIN_TARGET, siteMask: null, standard: STANDARD });
    const coveragePosts = hidden.map((h) => ({
      col: h.post.col,
      row: h.post.row,
      classes: classifyVisibility(h, PLAIN_TARGET).classes,
    }));
    const counts = countPostsPerCell(hidden[0]!, coveragePosts);
    const cross = crossBearingQuality(counts, coveragePosts);
    expect(mismatches(result.postsPerCell.counts, counts.counts)).toBe(0);
    expect(mismatches(result.crossBearings.classes, cross.classes)).toBe(0);
    expect(result.statistics).toEqual(computeCoverageStatistics(counts, cross, null));
    expect(result.targetHeight).toBe(PLAIN_TARGET);
    expectConsistent(result, null);
  });

  test('does not mutate the hidden-height rasters', () => {
    const copies = hidden.map((h) => Float32Array.from(h.hidden));
    evaluateNetworkCoverage({ posts, targetHeight: 0, siteMask: null, standard: STANDARD });
    hidden.forEach((h, i) => expect(mismatches(h.hidden, copies[i]!)).toBe(0));
  });

  test('refuses a raster computed for another post, under another condition or on another grid', () => {
    const swapped = [{ ...posts[0]!, hidden: hidden[1]! }, posts[1]!];
    expect(() => evaluateNetworkCoverage({ posts: swapped, targetHeight: 0, siteMask: null, standard: STANDARD })).toThrow(
      expect.objectContaining({ code: 'invalid-post', field: 'posts.0.hidden' }),
    );
    const other = computeHiddenHeightRaster(flatPlain(), PLAIN_POSTS[1], { ...PLAIN_CONDITIONS, refractionCoefficient: 0.13 });
    expect(() =>
      evaluateNetworkCoverage({
        posts: [posts[0]!, { post: PLAIN_POSTS[1], hidden: other }],
        targetHeight: 0,
        siteMask: null,
        standard: STANDARD,
      }),
    ).toThrow(expect.objectContaining({ code: 'invalid-condition', field: 'posts.1.hidden' }));
    expect(() =>
      evaluateNetworkCoverage({
        posts: [posts[0]!, { ...posts[1]!, hidden: { ...hidden[1]!, xll: hidden[1]!.xll + 25 } }],
        targetHeight: 0,
        siteMask: null,
        standard: STANDARD,
      }),
    ).toThrow(expect.objectContaining({ code: 'grid-mismatch', field: 'posts.1.hidden' }));
    expect(() => evaluateNetworkCoverage({ posts: [], targetHeight: 0, siteMask: null, standard: STANDARD })).toThrow(
      expect.objectContaining({ code: 'invalid-post' }),
    );
    expect(() => evaluateNetworkCoverage({ posts, targetHeight: -1, siteMask: null, standard: STANDARD })).toThrow(
      expect.objectContaining({ code: 'invalid-option' }),
    );
  });

  test('computeNetworkCoverage: one case per condition × target, conditions outermost, same numbers', () => {
    const terrain = flatPlain();
    const setupPosts: NetworkPostSetup[] = PLAIN_POSTS.map((p) => ({ ...p }));
    const conditions = [PLAIN_CONDITIONS, { ...PLAIN_CONDITIONS, refractionCoefficient: 0.25 }];
    const heights = Float32Array.from(terrain.heights);
    const cases = computeNetworkCoverage(terrain, setupPosts, conditions, [0, PLAIN_TARGET], {
      siteMask: null,
      standard: STANDARD,
    });
    expect(mismatches(terrain.heights, heights)).toBe(0); // the terrain is not changed
    expect(cases.map((c) => [c.conditionIndex, c.targetHeight])).toEqual([
      [0, 0],
      [0, PLAIN_TARGET],
      [1, 0],
      [1, PLAIN_TARGET],
    ]);
    const direct = evaluateNetworkCoverage({ posts, targetHeight: PLAIN_TARGET, siteMask: null, standard: STANDARD });
    expect(mismatches(cases[1]!.coverage.postsPerCell.counts, direct.postsPerCell.counts)).toBe(0);
    // Stronger refraction (larger k) never sees less.
    // Source: effective radius R/(1 − k) grows with k (common practice, no source).
    expect(cases[3]!.coverage.statistics.site.seenBy1.cells).toBeGreaterThan(cases[1]!.coverage.statistics.site.seenBy1.cells);
    expect(() => computeNetworkCoverage(terrain, setupPosts, [], [0], { siteMask: null, standard: STANDARD })).toThrow(
      expect.objectContaining({ code: 'invalid-condition' }),
    );
    expect(() => computeNetworkCoverage(terrain, setupPosts, conditions, [], { siteMask: null, standard: STANDARD })).toThrow(
      expect.objectContaining({ code: 'invalid-option' }),
    );
  });
});

describe('network coverage on the demo terrain (Harrowmere Forest District)', () => {
  let terrain: TerrainRaster;
  const demo = DEMO_SITES.find((s) => s.site.name === 'Harrowmere Forest District')!;
  const utm = (lonLat: readonly [number, number]) => {
    const p = toUtm({ lonDeg: lonLat[0], latDeg: lonLat[1] }, 33);
    return [p.easting, p.northing] as [number, number];
  };

  beforeAll(async () => {
    const bytes = readFileSync(path.join(__dirname, '../../../assets/terrain/demo-forest-district.tif'));
    terrain = await readGeoTiff(bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength) as ArrayBuffer);
  });

  test('the towers, site and priority zone give consistent coverage for the ground and a 30 m smoke', () => {
    const posts: NetworkPostSetup[] = demo.posts.map((p) => {
      const [x, y] = utm([p.location.lonDeg, p.location.latDeg]);
      return {
        ...locatePostCell(terrain, x, y),
        eyeHeight: p.structureHeightM + p.eyeHeightM,
        sector: p.sector ? { from: (p.sector.fromDeg * Math.PI) / 180, to: (p.sector.toDeg * Math.PI) / 180 } : null,
        gridConvergence: utmGridConvergence(p.location, 33),
      };
    });
    const siteMask = rasterizePolygon(terrain, [demo.site.boundary!.map(utm)]);
    const zones = demo.site.priorityZones.map((z) => ({
      name: z.name,
      weight: z.weight,
      mask: rasterizePolygon(terrain, [z.ring.map(utm)]),
    }));
    const [ground, smoke] = computeNetworkCoverage(terrain, posts, [{ refractionCoefficient: 0.13 }], [0, 30], {
      siteMask,
      zones,
      standard: STANDARD,
    });

    for (const c of [ground!, smoke!]) expectConsistent(c.coverage, siteMask);

    // The site mask covers the boundary's area (shoelace on the UTM corners) within 1 %.
    // Source: shoelace formula (closed form).
    const ring = demo.site.boundary!.map(utm);
    let twice = 0;
    for (let i = 0; i < ring.length; i++) {
      const [xa, ya] = ring[i]!;
      const [xb, yb] = ring[(i + 1) % ring.length]!;
      twice += (xa - ring[0]![0]) * (yb - ring[0]![1]) - (xb - ring[0]![0]) * (ya - ring[0]![1]);
    }
    const siteArea = ground!.coverage.statistics.site.total.area;
    expect(Math.abs(siteArea / Math.abs(twice / 2) - 1)).toBeLessThan(0.01);

    // A smoke column is seen wherever its foot is: counts for 30 m ≥ counts for 0 m, cell by cell.
    // Source: definition of the hidden height (common practice, no source).
    const g = ground!.coverage.postsPerCell.counts;
    const s = smoke!.coverage.postsPerCell.counts;
    let lower = 0;
    for (let i = 0; i < g.length; i++) if (s[i]! < g[i]!) lower++;
    expect(lower).toBe(0);
    expect(smoke!.coverage.statistics.site.seenBy1.cells).toBeGreaterThan(ground!.coverage.statistics.site.seenBy1.cells);

    // The counts equal the sum of each tower's own classes (computed separately).
    const expected = new Uint8Array(g.length);
    for (const post of posts) {
      const classes = classifyVisibility(computeHiddenHeightRaster(terrain, post, { refractionCoefficient: 0.13 }), 30).classes;
      for (let i = 0; i < classes.length; i++) {
        if (classes[i] === VISIBILITY_CLASS.seen || classes[i] === VISIBILITY_CLASS.targetOnly) expected[i]!++;
      }
    }
    expect(mismatches(s, expected)).toBe(0);
    // Every tower sees its own cell.
    for (const post of posts) expect(s[post.row * terrain.width + post.col]).toBeGreaterThanOrEqual(1);

    // The verdict names the zone and round-trips through JSON; the layer round-trips through the encoding.
    const verdict = smoke!.coverage.check;
    expect(verdict.rules[1]!.zoneName).toBe('Old-growth stand');
    expect(JSON.parse(JSON.stringify(verdict))).toEqual(verdict);
    const layer = smoke!.coverage.postsPerCell.layer;
    expect(mismatches(decodeClassRaster(encodeClassRaster(terrain, layer)), layer)).toBe(0);
  });
});
