import type { CoveragePost } from '@/shared/terrain/coverage-post';
import { COVERAGE_LAYER, countPostsPerCell } from '@/shared/terrain/posts-per-cell';
import { classifyVisibility, VISIBILITY_CLASS } from '@/shared/terrain/visibility-classes';
import { classesFrom, gridOf, mismatches, seededRandom } from '@/tests/unit/terrain/coverage-fixtures';
import {
  flatPlain,
  lensArea,
  PLAIN_CELL,
  PLAIN_CONDITIONS,
  PLAIN_POSTS,
  PLAIN_RANGE,
  PLAIN_TARGET,
  plainHiddenRasters,
} from '@/tests/unit/terrain/flat-plain';

const DEG = Math.PI / 180;
const sum = (a: Uint8Array, pick: (v: number) => boolean) => a.reduce((n, v) => n + (pick(v) ? 1 : 0), 0);

/**
 * Reference sector test with bearings: inside when the grid bearing from the
 * post's cell centre to the cell's centre, measured clockwise from the sector's
 * start, is within its width (own cell always inside).
 * Source: definition of a bearing sector, true → grid by subtracting the convergence
 * (common practice, no source).
 */
function inSectorByBearing(dx: number, dy: number, fromTrue: number, toTrue: number, convergence: number): boolean {
  if (dx === 0 && dy === 0) return true;
  const TAU = 2 * Math.PI;
  let width = (((toTrue - fromTrue) % TAU) + TAU) % TAU;
  if (width === 0) width = TAU;
  const bearing = Math.atan2(dx, dy);
  const offset = (((bearing - (fromTrue - convergence)) % TAU) + TAU) % TAU;
  return offset <= width + 1e-9 || offset >= TAU - 1e-9;
}

describe('countPostsPerCell on a flat plain (exact circles)', () => {
  const hidden = plainHiddenRasters();
  const grid = hidden[0]!;
  const posts: CoveragePost[] = hidden.map((h) => ({
    col: h.post.col,
    row: h.post.row,
    classes: classifyVisibility(h, PLAIN_TARGET).classes,
  }));
  const result = countPostsPerCell(grid, posts);
  const cellArea = PLAIN_CELL * PLAIN_CELL;

  test('each cell’s count matches the number of circles of radius D = √(2R′h) + √(2R′T) around it', () => {
    // Source: geographic range (see flat-plain.ts). Cells whose centre lies within
    // half a cell of a circle are left out: the grid cannot place the edge closer.
    let compared = 0;
    let agree = 0;
    for (let row = 0; row < grid.height; row++) {
      for (let col = 0; col < grid.width; col++) {
        const distances = PLAIN_POSTS.map((p) => Math.hypot(col - p.col, row - p.row) * PLAIN_CELL);
        if (distances.some((d) => Math.abs(d - PLAIN_RANGE) < PLAIN_CELL / 2)) continue;
        compared++;
        const expected = distances.filter((d) => d <= PLAIN_RANGE).length;
        if (result.counts[row * grid.width + col] === expected) agree++;
      }
    }
    expect(compared).toBeGreaterThan(0.9 * grid.width * grid.height);
    expect(agree / compared).toBeGreaterThanOrEqual(0.9999); // measured: all 148 480 agree
  });

  test('areas seen by ≥ 1, ≥ 2 and ≥ 3 posts equal the circle and lens areas within 0.5 %', () => {
    // Source: circle area πD² and circle–circle lens area (see flat-plain.ts). Counting
    // cell centres in a circle of 120 cells comes within a few tenths of a percent of πD²
    // (Gauss circle problem); measured: −0.02 % (≥ 1) and −0.09 % (≥ 2).
    const lens = lensArea(PLAIN_RANGE, 4000);
    const union = 3 * Math.PI * PLAIN_RANGE ** 2 - 2 * lens; // no point lies in all three circles
    const by1 = sum(result.counts, (v) => v >= 1) * cellArea;
    const by2 = sum(result.counts, (v) => v >= 2) * cellArea;
    expect(Math.abs(by1 / union - 1)).toBeLessThan(0.005);
    expect(Math.abs(by2 / (2 * lens) - 1)).toBeLessThan(0.005);
    expect(sum(result.counts, (v) => v >= 3)).toBe(0);
  });

  test('the layer follows the 0 / 1 / 2 / 3+ convention and nothing is no-data', () => {
    const expected = result.counts.map((c) =>
      c === 0 ? COVERAGE_LAYER.unseen : c === 1 ? COVERAGE_LAYER.onePost : COVERAGE_LAYER.twoPosts,
    );
    expect(mismatches(result.layer, expected)).toBe(0);
    expect(sum(result.layer, (v) => v === COVERAGE_LAYER.twoPosts)).toBeGreaterThan(1000);
    expect(sum(result.noData, (v) => v === 1)).toBe(0);
    expect(result.postCount).toBe(3);
    expect([result.width, result.height, result.cellSize, result.xll, result.yll]).toEqual([
      grid.width,
      grid.height,
      grid.cellSize,
      grid.xll,
      grid.yll,
    ]);
  });

  test('a sector keeps only the cells whose bearing lies in it', () => {
    // The middle post watches north-east to south (45° → 180° true); the others all round.
    const sector = { from: 45 * DEG, to: 180 * DEG };
    const withSector = countPostsPerCell(
      grid,
      posts.map((p, i) => (i === 1 ? { ...p, sector } : p)),
    );
    const middle = countPostsPerCell(grid, [{ ...posts[1]!, sector }]);
    const b = PLAIN_POSTS[1];
    let inside = 0;
    const expectedMiddle = new Uint8Array(middle.counts.length);
    const expectedAll = new Uint8Array(middle.counts.length);
    for (let row = 0; row < grid.height; row++) {
      for (let col = 0; col < grid.width; col++) {
        const i = row * grid.width + col;
        const seen = posts[1]!.classes[i] === VISIBILITY_CLASS.seen || posts[1]!.classes[i] === VISIBILITY_CLASS.targetOnly;
        const expected = seen && inSectorByBearing(col - b.col, b.row - row, sector.from, sector.to, 0) ? 1 : 0;
        expectedMiddle[i] = expected;
        inside += expected;
        expectedAll[i] = result.counts[i]! - (seen ? 1 : 0) + expected;
      }
    }
    expect(mismatches(middle.counts, expectedMiddle)).toBe(0);
    expect(mismatches(withSector.counts, expectedAll)).toBe(0);
    // 135° of the circle: 3/8 of it.
    expect(inside * cellArea).toBeGreaterThan(0.99 * (3 / 8) * Math.PI * PLAIN_RANGE ** 2);
    expect(inside * cellArea).toBeLessThan(1.01 * (3 / 8) * Math.PI * PLAIN_RANGE ** 2);
  });

  test('boundary rays at 45° and 90° are inside the sector', () => {
    const b = PLAIN_POSTS[1];
    const middle = countPostsPerCell(grid, [{ ...posts[1]!, sector: { from: 45 * DEG, to: 90 * DEG } }]);
    const at = (dx: number, dy: number) => middle.counts[(b.row - dy) * grid.width + b.col + dx];
    expect(at(10, 10)).toBe(1); // on the 45° ray
    expect(at(10, 0)).toBe(1); // on the 90° ray
    expect(at(0, 0)).toBe(1); // the post's own cell
    expect(at(10, 11)).toBe(0); // just west of 45°
    expect(at(10, -1)).toBe(0); // just south of 90°
  });

  test('true-bearing sectors are turned into grid bearings by the grid convergence', () => {
    // Source: β_grid = β_true − γ (grid convergence, common practice, no source).
    // A 0°→90° true sector with γ = +10° (grid north 10° east of true north) covers grid −10°…80°.
    const b = PLAIN_POSTS[1];
    const turned = countPostsPerCell(grid, [{ ...posts[1]!, sector: { from: 0, to: 90 * DEG }, gridConvergence: 10 * DEG }]);
    const at = (bearingDeg: number, cells: number) => {
      const dx = Math.round(cells * Math.sin(bearingDeg * DEG));
      const dy = Math.round(cells * Math.cos(bearingDeg * DEG));
      return turned.counts[(b.row - dy) * grid.width + b.col + dx];
    };
    expect(at(-5, 80)).toBe(1);
    expect(at(75, 80)).toBe(1);
    expect(at(85, 80)).toBe(0);
    expect(at(-15, 80)).toBe(0);
    for (let t = 0; t < 2000; t++) {
      const random = seededRandom(t + 1);
      const col = Math.floor(random() * grid.width);
      const row = Math.floor(random() * grid.height);
      const i = row * grid.width + col;
      const seen = posts[1]!.classes[i] === VISIBILITY_CLASS.seen || posts[1]!.classes[i] === VISIBILITY_CLASS.targetOnly;
      expect(turned.counts[i]).toBe(seen && inSectorByBearing(col - b.col, b.row - row, 0, 90 * DEG, 10 * DEG) ? 1 : 0);
    }
  });

  test('a wide sector (more than 180°, across north) and a 0 → 2π sector', () => {
    const b = PLAIN_POSTS[1];
    const sector = { from: 200 * DEG, to: 100 * DEG }; // 260° through north
    const wide = countPostsPerCell(grid, [{ ...posts[1]!, sector }]);
    const random = seededRandom(99);
    for (let t = 0; t < 3000; t++) {
      const col = Math.floor(random() * grid.width);
      const row = Math.floor(random() * grid.height);
      const i = row * grid.width + col;
      const seen = posts[1]!.classes[i] !== VISIBILITY_CLASS.blind;
      expect(wide.counts[i]).toBe(seen && inSectorByBearing(col - b.col, b.row - row, sector.from, sector.to, 0) ? 1 : 0);
    }
    const full = countPostsPerCell(grid, [{ ...posts[1]!, sector: { from: 0, to: 2 * Math.PI } }]);
    expect(mismatches(full.counts, countPostsPerCell(grid, [posts[1]!]).counts)).toBe(0);
  });

  test('all-round posts on random classes agree cell by cell with the counting rules', () => {
    // The rules as this module documents them, applied one cell at a time: seen and target only count,
    // blind is in view, no data counts as no data only within the range limit, out of range is
    // nothing. Guards the branch-free loop for all-round posts. Common practice, no source.
    const random = seededRandom(29);
    const grid = gridOf(83, 57);
    const posts: CoveragePost[] = [0, 1, 2, 3].map((p) => ({
      col: Math.floor(random() * 83),
      row: Math.floor(random() * 57),
      classes: Uint8Array.from({ length: 83 * 57 }, () => (random() < 0.05 ? 0 : Math.floor(random() * 5))),
      ...(p % 2 === 0 ? { maxDistance: (20 + 10 * p) * 25 } : {}),
    }));
    const result = countPostsPerCell(grid, posts);
    const counts = new Uint8Array(83 * 57);
    const noData = new Uint8Array(83 * 57);
    const reach = new Uint8Array(83 * 57);
    for (const post of posts) {
      const range = post.maxDistance === undefined ? Infinity : post.maxDistance / 25;
      for (let i = 0; i < counts.length; i++) {
        const c = post.classes[i] as number;
        const dx = (i % 83) - post.col;
        const dy = Math.floor(i / 83) - post.row;
        if (c === VISIBILITY_CLASS.seen || c === VISIBILITY_CLASS.targetOnly) counts[i]!++;
        if (c >= VISIBILITY_CLASS.seen && c <= VISIBILITY_CLASS.blind) reach[i] = 1;
        if (c === VISIBILITY_CLASS.none && dx * dx + dy * dy <= range * range) noData[i] = 1;
      }
    }
    expect(
      mismatches(
        result.counts,
        counts.map((c, i) => (noData[i] === 1 ? 0 : c)),
      ),
    ).toBe(0);
    expect(mismatches(result.noData, noData)).toBe(0);
    expect(mismatches(result.reach ?? new Uint8Array(0), reach)).toBe(0);
    expect(sum(result.counts, (v) => v >= 2)).toBeGreaterThan(100); // several posts overlap
    expect(sum(result.noData, (v) => v === 1)).toBeGreaterThan(10);
  });

  test('does not mutate its inputs', () => {
    const copies = posts.map((p) => Uint8Array.from(p.classes));
    const sector = { from: 1, to: 2 };
    countPostsPerCell(grid, [...posts, { ...posts[0]!, sector }]);
    posts.forEach((p, i) => expect(mismatches(p.classes, copies[i]!)).toBe(0));
    expect(sector).toEqual({ from: 1, to: 2 });
  });
});

describe('countPostsPerCell: no data and range limits', () => {
  test('nodata terrain is no-data; beyond a range limit is only unseen', () => {
    // A nodata block east of the middle post (inside every range), none elsewhere.
    const terrain = flatPlain((col, row) => col >= 300 && col < 310 && row >= 100 && row < 110);
    const limited = { ...PLAIN_CONDITIONS, maxDistance: 2000 };
    const hidden = plainHiddenRasters(terrain, limited);
    const posts: CoveragePost[] = hidden.map((h) => ({
      col: h.post.col,
      row: h.post.row,
      classes: classifyVisibility(h, PLAIN_TARGET).classes,
      maxDistance: h.maxDistance,
    }));
    const result = countPostsPerCell(hidden[0]!, posts);
    const W = terrain.width;
    const expectedNoData = new Uint8Array(W * terrain.height);
    for (let row = 100; row < 110; row++) expectedNoData.fill(1, row * W + 300, row * W + 310);
    expect(mismatches(result.noData, expectedNoData)).toBe(0);
    for (let i = 0; i < expectedNoData.length; i++) {
      if (expectedNoData[i] === 1 && (result.counts[i] !== 0 || result.layer[i] !== COVERAGE_LAYER.noData)) {
        throw new Error(`no-data cell ${i} has count ${result.counts[i]} and layer ${result.layer[i]}`);
      }
    }
    // The far corner is beyond every 2 km range: unseen, with data.
    expect(result.layer[0]).toBe(COVERAGE_LAYER.unseen);
    // Without telling the range limit, cells beyond it would look like missing data.
    const naive = countPostsPerCell(
      hidden[0]!,
      posts.map((p) => ({ ...p, maxDistance: undefined })),
    );
    expect(naive.noData[0]).toBe(1);
  });

  test('counts saturate at 255 and the layer puts 3 and more together', () => {
    const grid = gridOf(3, 2);
    const all = classesFrom(grid, () => VISIBILITY_CLASS.seen);
    const posts = Array.from({ length: 300 }, () => ({ col: 1, row: 1, classes: all }));
    const result = countPostsPerCell(grid, posts);
    expect(Array.from(result.counts)).toEqual([255, 255, 255, 255, 255, 255]);
    expect(Array.from(result.layer)).toEqual(new Array(6).fill(COVERAGE_LAYER.threeOrMorePosts));
    const mixed = countPostsPerCell(grid, [
      { col: 0, row: 0, classes: Uint8Array.from([1, 2, 3, 0, 1, 1]) },
      { col: 2, row: 1, classes: Uint8Array.from([1, 3, 3, 1, 1, 2]) },
      { col: 2, row: 1, classes: Uint8Array.from([2, 3, 3, 1, 3, 1]) },
    ]);
    expect(Array.from(mixed.counts)).toEqual([3, 1, 0, 0, 2, 3]);
    expect(Array.from(mixed.layer)).toEqual([4, 2, 1, 0, 3, 4]);
    expect(Array.from(mixed.noData)).toEqual([0, 0, 0, 1, 0, 0]);
  });

  test('rejects bad posts with the field', () => {
    const grid = gridOf(4, 4);
    const classes = new Uint8Array(16);
    expect(() => countPostsPerCell(grid, [])).toThrow(expect.objectContaining({ code: 'invalid-post', field: 'posts' }));
    expect(() => countPostsPerCell(grid, [{ col: 4, row: 0, classes }])).toThrow(
      expect.objectContaining({ code: 'post-outside-raster', field: 'posts.0' }),
    );
    expect(() => countPostsPerCell(grid, [{ col: 1.5, row: 0, classes }])).toThrow(
      expect.objectContaining({ code: 'invalid-post' }),
    );
    expect(() =>
      countPostsPerCell(grid, [
        { col: 0, row: 0, classes },
        { col: 0, row: 0, classes: new Uint8Array(15) },
      ]),
    ).toThrow(expect.objectContaining({ code: 'invalid-layer', field: 'posts.1.classes' }));
    expect(() => countPostsPerCell(grid, [{ col: 0, row: 0, classes: new Float32Array(16) as unknown as Uint8Array }])).toThrow(
      expect.objectContaining({ code: 'invalid-layer' }),
    );
    expect(() => countPostsPerCell(grid, [{ col: 0, row: 0, classes, sector: { from: 1, to: 1 } }])).toThrow(
      expect.objectContaining({ code: 'invalid-sector', field: 'posts.0.sector' }),
    );
    expect(() => countPostsPerCell(grid, [{ col: 0, row: 0, classes, sector: { from: NaN, to: 1 } }])).toThrow(
      expect.objectContaining({ code: 'invalid-sector' }),
    );
    expect(() => countPostsPerCell(grid, [{ col: 0, row: 0, classes, gridConvergence: 2 }])).toThrow(
      expect.objectContaining({ code: 'invalid-sector', field: 'posts.0.gridConvergence' }),
    );
    expect(() => countPostsPerCell(grid, [{ col: 0, row: 0, classes, maxDistance: 0 }])).toThrow(
      expect.objectContaining({ code: 'invalid-post', field: 'posts.0.maxDistance' }),
    );
  });
});
