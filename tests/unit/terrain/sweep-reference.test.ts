import {
  completeHiddenHeightRaster,
  computeHiddenHeightHalf,
  computeHiddenHeightRaster,
  type LookoutPost,
  type SightConditions,
} from '@/shared/terrain/hidden-height-raster';
import { prepareSweepTerrain } from '@/shared/terrain/sweep-terrain';
import { generateSyntheticTerrain } from '@/shared/terrain/synthetic-terrain';
import type { TerrainRaster } from '@/shared/terrain/terrain-raster';
import { computeHiddenHeightRasterBefore } from '@/tests/support/previous-hidden-height-raster';

// The faster sweep must give the same hidden heights as the engine before the speed work, bit for bit
// (issue 18: "keep results bitwise identical"). Source: tests/support/previous-hidden-height-raster.ts,
// the engine of main at c421299 kept verbatim; its own agreement with the brute-force line-of-sight
// checker is tested in hidden-height-raster.test.ts. Regression guard: common practice, no source.

/** Cells whose values differ as bit patterns (NaN equals NaN, +0 differs from −0), and the first of them. */
function bitDifferences(a: Float32Array, b: Float32Array): { count: number; first: string | null } {
  const wa = new Uint32Array(a.buffer, a.byteOffset, a.length);
  const wb = new Uint32Array(b.buffer, b.byteOffset, b.length);
  let count = 0;
  let first: string | null = null;
  for (let i = 0; i < a.length; i++) {
    const same = wa[i] === wb[i] || (Number.isNaN(a[i]) && Number.isNaN(b[i]));
    if (!same) {
      count++;
      first ??= `cell ${i}: ${a[i]} vs ${b[i]}`;
    }
  }
  return { count, first };
}

function expectSameBits(terrain: TerrainRaster, post: LookoutPost, conditions: SightConditions): void {
  const now = computeHiddenHeightRaster(terrain, post, conditions);
  const before = computeHiddenHeightRasterBefore(terrain, post, conditions);
  expect(now.hidden.length).toBe(terrain.width * terrain.height);
  expect(bitDifferences(now.hidden, before.hidden)).toEqual({ count: 0, first: null });
  expect(now.eyeElevation).toBe(before.eyeElevation);
  // The comparison is not vacuous: the raster holds hidden and seen cells.
  let hiddenCells = 0;
  let seenCells = 0;
  for (const v of now.hidden) {
    if (v > 0) hiddenCells++;
    else if (v === 0) seenCells++;
  }
  expect(hiddenCells).toBeGreaterThan(0);
  expect(seenCells).toBeGreaterThan(1);
}

describe('computeHiddenHeightRaster is bitwise the engine before the speed work', () => {
  const rolling = generateSyntheticTerrain({ width: 257, height: 193, seed: 11 });
  const rugged = generateSyntheticTerrain({ width: 180, height: 240, cellSize: 50, seed: 8, relief: 900 });
  const fine = generateSyntheticTerrain({ width: 300, height: 120, cellSize: 10, seed: 21 });

  test.each([
    { name: 'rolling, post inside, k 0.13', terrain: rolling, post: { col: 101, row: 77, eyeHeight: 15 }, conditions: {} },
    {
      name: 'rolling, k 0, GRS 80 radius',
      terrain: rolling,
      post: { col: 200, row: 30, eyeHeight: 25 },
      conditions: { refractionCoefficient: 0, earthRadius: 6_378_137 },
    },
    { name: 'rugged, post on a corner', terrain: rugged, post: { col: 0, row: 239, eyeHeight: 10 }, conditions: {} },
    {
      name: 'rugged, post on an edge, k −0.2',
      terrain: rugged,
      post: { col: 179, row: 100, eyeHeight: 30 },
      conditions: { refractionCoefficient: -0.2 },
    },
    { name: 'fine cells, low eye, wide grid', terrain: fine, post: { col: 40, row: 60, eyeHeight: 2 }, conditions: {} },
    {
      name: 'range limit cutting the octants short',
      terrain: rolling,
      post: { col: 120, row: 90, eyeHeight: 15 },
      conditions: { maxDistance: 1_800 },
    },
    {
      name: 'range limit past one edge only',
      terrain: fine,
      post: { col: 250, row: 10, eyeHeight: 8 },
      conditions: { maxDistance: 1_500, refractionCoefficient: 0.25 },
    },
  ])('$name', ({ terrain, post, conditions }) => {
    expectSameBits(terrain, post, conditions);
  });

  test('with nodata holes (marker and NaN), prepared once for several posts', () => {
    const heights = Float32Array.from(rolling.heights);
    for (let r = 40; r < 60; r++) for (let c = 150; c < 170; c++) heights[r * rolling.width + c] = -9999;
    for (let i = 7; i < heights.length; i += 997) heights[i] = NaN;
    const holed: TerrainRaster = { ...rolling, heights, nodata: -9999 };
    const sweep = prepareSweepTerrain(holed);
    for (const post of [
      { col: 101, row: 77, eyeHeight: 15 },
      { col: 5, row: 180, eyeHeight: 40 },
    ]) {
      const now = computeHiddenHeightRaster(holed, post, {}, sweep);
      const before = computeHiddenHeightRasterBefore(holed, post, {}, sweep);
      expect(bitDifferences(now.hidden, before.hidden)).toEqual({ count: 0, first: null });
      expect(now.hidden[50 * rolling.width + 160]).toBeNaN();
    }
  });

  test('the bit comparison sees a change of one unit in the last place', () => {
    // Guard for the helper itself: a test that cannot fail proves nothing.
    const a = computeHiddenHeightRaster(rolling, { col: 10, row: 10, eyeHeight: 15 }).hidden;
    const b = Float32Array.from(a);
    const i = b.findIndex((v) => v > 1);
    const words = new Uint32Array(b.buffer);
    words[i] = (words[i] as number) + 1;
    expect(bitDifferences(a, b).count).toBe(1);
    const z = Float32Array.from(a);
    z[a.indexOf(0)] = -0;
    expect(bitDifferences(a, z).count).toBe(1);
  });
});

describe('range limit and nodata mask', () => {
  // The mask keeps a run of columns per row; the old engine tested dc² + dr² > range² cell by cell.
  // Source: tests/support/previous-hidden-height-raster.ts (as above); common practice, no source.
  const terrain = generateSyntheticTerrain({ width: 97, height: 61, seed: 5 });

  test.each([0.5, 1, 7, 7.5, 30.000001, 45, 200])('range of %f cells around posts on edges and inside', (rangeInCells) => {
    for (const post of [
      { col: 0, row: 0, eyeHeight: 10 },
      { col: 48, row: 30, eyeHeight: 10 },
      { col: 96, row: 17, eyeHeight: 10 },
    ]) {
      const conditions = { maxDistance: rangeInCells * terrain.cellSize };
      const now = computeHiddenHeightRaster(terrain, post, conditions);
      const before = computeHiddenHeightRasterBefore(terrain, post, conditions);
      expect(bitDifferences(now.hidden, before.hidden)).toEqual({ count: 0, first: null });
    }
  });
});

describe('two halves of one post (for two threads) are bitwise the whole sweep', () => {
  // The command line sweeps the north half on one thread and the south half on another into one shared
  // array. Source: the whole-post sweep above, itself held to the previous engine bit for bit.
  const terrain = generateSyntheticTerrain({ width: 211, height: 157, seed: 31 });
  const heights = Float32Array.from(terrain.heights);
  for (let r = 100; r < 110; r++) for (let c = 20; c < 45; c++) heights[r * terrain.width + c] = NaN;
  const holed: TerrainRaster = { ...terrain, heights, nodata: null };

  test.each([
    { name: 'post inside', terrain, post: { col: 90, row: 70, eyeHeight: 15 }, conditions: {} },
    { name: 'post on the north edge', terrain, post: { col: 30, row: 0, eyeHeight: 5 }, conditions: {} },
    { name: 'post on the south-east corner', terrain, post: { col: 210, row: 156, eyeHeight: 20 }, conditions: {} },
    {
      name: 'range limit, k 0',
      terrain,
      post: { col: 150, row: 40, eyeHeight: 12 },
      conditions: { maxDistance: 2_000, refractionCoefficient: 0 },
    },
    { name: 'nodata holes', terrain: holed, post: { col: 60, row: 120, eyeHeight: 25 }, conditions: {} },
  ])('$name, either half first', ({ terrain: grid, post, conditions }) => {
    const whole = computeHiddenHeightRaster(grid, post, conditions);
    for (const order of [
      ['north', 'south'],
      ['south', 'north'],
    ] as const) {
      const out = new Float32Array(grid.width * grid.height).fill(123);
      for (const half of order) computeHiddenHeightHalf(grid, post, conditions, half, out);
      const done = completeHiddenHeightRaster(grid, post, conditions, out);
      expect(done.hidden).toBe(out);
      expect(bitDifferences(done.hidden, whole.hidden)).toEqual({ count: 0, first: null });
      expect(done.eyeElevation).toBe(whole.eyeElevation);
      expect(done.maxDistance).toBe(whole.maxDistance);
    }
  });

  test('a half covers its side of the post only', () => {
    const post = { col: 90, row: 70, eyeHeight: 15 };
    const out = new Float32Array(terrain.width * terrain.height).fill(-1);
    computeHiddenHeightHalf(terrain, post, {}, 'north', out);
    const untouched = (r: number) => out.subarray(r * terrain.width, (r + 1) * terrain.width).every((v) => v === -1);
    expect(untouched(post.row - 1)).toBe(false);
    expect(untouched(post.row + 1)).toBe(true);
    expect(untouched(terrain.height - 1)).toBe(true);
  });

  test('refuses a result array of the wrong size', () => {
    expect(() => computeHiddenHeightHalf(terrain, { col: 1, row: 1, eyeHeight: 1 }, {}, 'south', new Float32Array(10))).toThrow(
      /width × height/,
    );
  });
});
