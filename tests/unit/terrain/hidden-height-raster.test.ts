import { computeHiddenHeightRaster } from '@/shared/terrain/hidden-height-raster';
import { NEVER_BLOCKS, prepareSweepTerrain } from '@/shared/terrain/sweep-terrain';
import { generateSyntheticTerrain } from '@/shared/terrain/synthetic-terrain';
import { TerrainInputError } from '@/shared/terrain/terrain-input-error';
import type { TerrainRaster } from '@/shared/terrain/terrain-raster';
import { checkHiddenHeights } from '@/tests/support/line-of-sight-checker';
import { compareHiddenHeights } from '@/tests/unit/terrain/agreement';

jest.setTimeout(120_000);

function flatTerrain(width: number, height: number, cellSize: number, fill = 0): TerrainRaster {
  return {
    heights: new Float32Array(width * height).fill(fill),
    width,
    height,
    cellSize,
    xll: 400_000,
    yll: 6_000_000,
    nodata: null,
    crs: null,
  };
}

describe('computeHiddenHeightRaster on a flat sea', () => {
  // Source: geometric horizon on a sphere of effective radius R' = R/(1 − k) in the
  // planar-drop model drop = d²/(2R'): the tangent from an eye at height h touches
  // at d_h = √(2R'h), and beyond it a target is hidden up to (d − d_h)²/(2R')
  // (derived from the same d²/(2R') drop the engine applies; standard horizon formula).
  test.each([
    { eye: 10, k: 0.13, R: 6_371_008.8, cellSize: 100 },
    { eye: 50, k: 0, R: 6_371_008.8, cellSize: 200 },
    { eye: 25, k: 0.13, R: 6_378_137, cellSize: 150 },
  ])('matches the closed-form hidden height within 5 mm (eye $eye m, k $k)', ({ eye, k, R, cellSize }) => {
    const terrain = flatTerrain(301, 301, cellSize);
    const post = { col: 150, row: 150, eyeHeight: eye };
    const result = computeHiddenHeightRaster(terrain, post, { refractionCoefficient: k, earthRadius: R });
    const effective = R / (1 - k);
    const horizon = Math.sqrt(2 * effective * eye);
    let worst = 0;
    let beyond = 0;
    for (let row = 0; row < terrain.height; row++) {
      for (let col = 0; col < terrain.width; col++) {
        const d = Math.hypot(col - post.col, row - post.row) * cellSize;
        const expected = d > horizon ? (d - horizon) ** 2 / (2 * effective) : 0;
        if (d > horizon) beyond++;
        worst = Math.max(worst, Math.abs((result.hidden[row * terrain.width + col] as number) - expected));
      }
    }
    expect(beyond).toBeGreaterThan(1000); // the grid reaches well past the horizon
    expect(worst).toBeLessThan(0.005); // tolerance 5 mm
  });
});

describe('computeHiddenHeightRaster behind a straight wall', () => {
  // Source: similar triangles — the sight line from the eye over a crest of height Hw
  // at distance a reaches E + (Hw − E)·d/a at distance d (common practice, no source).
  // Curvature is made negligible with R = 1e15 m.
  test('matches similar triangles for sight lines crossing the wall', () => {
    const terrain = flatTerrain(120, 81, 10);
    const heights = new Float32Array(terrain.heights);
    const wallCol = 50;
    const wallHeight = 30;
    for (let row = 0; row < terrain.height; row++) heights[row * terrain.width + wallCol] = wallHeight;
    const walled = { ...terrain, heights };
    const post = { col: 20, row: 40, eyeHeight: 12 };
    const result = computeHiddenHeightRaster(walled, post, { earthRadius: 1e15 });
    let checked = 0;
    let worst = 0;
    for (let row = 0; row < terrain.height; row++) {
      for (let col = wallCol + 1; col < terrain.width; col++) {
        // The engine samples the terrain where a sight line crosses the grid lines
        // across its main direction; for lines steeper than 45° the wall crest lies
        // between those crossings, so only lines within 45° of east are checked.
        if (Math.abs(row - post.row) > Math.abs(col - post.col)) continue;
        const expected = Math.max(0, 12 + ((wallHeight - 12) * (col - post.col)) / (wallCol - post.col));
        worst = Math.max(worst, Math.abs((result.hidden[row * terrain.width + col] as number) - expected));
        checked++;
      }
    }
    expect(checked).toBeGreaterThan(3000);
    expect(worst).toBeLessThan(0.001); // tolerance 1 mm
  });
});

describe('computeHiddenHeightRaster against the brute-force line-of-sight checker', () => {
  // Source: tests/support/line-of-sight-checker.ts — bilinear terrain sampled every
  // 0.1 cell and at every grid-line crossing along each sight line, same
  // curvature-and-refraction drop. Thresholds: ≥ 99.5 % agreement on seen / not seen
  // for 0 m and 10 m targets, median hidden-height error ≤ 1 m over hidden cells
  // (project requirement).
  const cases = [
    {
      name: 'rolling district, post near the middle',
      seed: 3,
      size: 161,
      cellSize: 25,
      post: { col: 70, row: 88, eyeHeight: 10 },
    },
    {
      name: 'rugged, 50 m cells, post near a corner',
      seed: 8,
      size: 161,
      cellSize: 50,
      post: { col: 12, row: 140, eyeHeight: 20 },
      relief: 700,
    },
    { name: 'fine 10 m cells, low eye', seed: 21, size: 161, cellSize: 10, post: { col: 100, row: 30, eyeHeight: 4 } },
  ];
  test.each(cases)('$name', ({ seed, size, cellSize, post, relief }) => {
    const terrain = generateSyntheticTerrain({ width: size, height: size, cellSize, seed, relief });
    const engine = computeHiddenHeightRaster(terrain, post);
    const reference = checkHiddenHeights(terrain, post);
    const stats = compareHiddenHeights(engine.hidden, reference, terrain.width, post);
    expect(stats.cells).toBe(size * size - 1); // all but the post's own cell
    expect(stats.seenAgreement(0)).toBeGreaterThanOrEqual(0.995);
    expect(stats.seenAgreement(10)).toBeGreaterThanOrEqual(0.995);
    expect(stats.medianErrorHidden).toBeLessThanOrEqual(1);
  });

  test('a larger grid, every third cell checked', () => {
    const terrain = generateSyntheticTerrain({ width: 321, height: 321, cellSize: 25, seed: 44 });
    const post = { col: 200, row: 150, eyeHeight: 15 };
    const engine = computeHiddenHeightRaster(terrain, post, { refractionCoefficient: -0.1 });
    const reference = checkHiddenHeights(terrain, post, { refractionCoefficient: -0.1 }, { stride: 3 });
    const stats = compareHiddenHeights(engine.hidden, reference, terrain.width, post);
    expect(stats.cells).toBeGreaterThan(107 * 107 - 2);
    expect(stats.seenAgreement(0)).toBeGreaterThanOrEqual(0.995);
    expect(stats.seenAgreement(10)).toBeGreaterThanOrEqual(0.995);
    expect(stats.medianErrorHidden).toBeLessThanOrEqual(1);
  });
});

describe('prepareSweepTerrain', () => {
  // Nodata handling of the sweep layout: common practice, no source.
  const base = flatTerrain(13, 7, 25, 40); // 91 cells: 11 blocks of eight and a tail of three

  test('shares the heights when there is no nodata, even with ±∞ side by side', () => {
    const heights = Float32Array.from(base.heights);
    heights[16] = Infinity;
    heights[17] = -Infinity; // their sum is NaN, yet neither is nodata
    const terrain = { ...base, heights };
    const sweep = prepareSweepTerrain(terrain);
    expect(sweep.hasNodata).toBe(false);
    expect(sweep.heights).toBe(heights);
  });

  test.each([0, 5, 8, 47, 87, 88, 90])('finds a NaN at cell %i and replaces only it', (at) => {
    const heights = Float32Array.from(base.heights);
    heights[at] = NaN;
    const terrain = { ...base, heights };
    const sweep = prepareSweepTerrain(terrain);
    expect(sweep.hasNodata).toBe(true);
    expect(sweep.heights).not.toBe(heights);
    expect(Number.isNaN(heights[at])).toBe(true); // the input is not modified
    for (let i = 0; i < heights.length; i++) expect(sweep.heights[i]).toBe(i === at ? NEVER_BLOCKS : 40);
  });

  test('replaces the nodata marker and NaN alike', () => {
    const heights = Float32Array.from(base.heights);
    heights[3] = -9999;
    heights[60] = NaN;
    const sweep = prepareSweepTerrain({ ...base, heights, nodata: -9999 });
    expect(sweep.hasNodata).toBe(true);
    expect([sweep.heights[3], sweep.heights[60], sweep.heights[4]]).toEqual([NEVER_BLOCKS, NEVER_BLOCKS, 40]);
  });
});

describe('computeHiddenHeightRaster options and edge cases', () => {
  const terrain = generateSyntheticTerrain({ width: 90, height: 70, seed: 5 });
  const post = { col: 30, row: 40, eyeHeight: 15 };

  test('does not mutate the terrain', () => {
    const before = Float32Array.from(terrain.heights);
    computeHiddenHeightRaster(terrain, post);
    expect(terrain.heights).toEqual(before);
  });

  test('the post cell is 0 and the result keeps the grid', () => {
    const result = computeHiddenHeightRaster(terrain, post);
    expect(result.hidden[post.row * terrain.width + post.col]).toBe(0);
    expect([result.width, result.height, result.cellSize, result.xll, result.yll]).toEqual([
      terrain.width,
      terrain.height,
      terrain.cellSize,
      terrain.xll,
      terrain.yll,
    ]);
    expect(result.eyeElevation).toBeCloseTo((terrain.heights[post.row * terrain.width + post.col] as number) + 15, 4);
  });

  test('transposing terrain and post transposes the result exactly', () => {
    // Regression guard for the two sweep orders (column by column for north–south octants,
    // grid row by grid row for east–west ones), which must do the same arithmetic cell for
    // cell, so the transposed result is bitwise the same: common practice, no source.
    const { width: W, height: H } = terrain;
    const heightsT = new Float32Array(W * H);
    for (let r = 0; r < H; r++) for (let c = 0; c < W; c++) heightsT[c * H + r] = terrain.heights[r * W + c] as number;
    const transposed = { ...terrain, heights: heightsT, width: H, height: W };
    // Unlimited, and with a range limit that cuts the octants short (the row-by-row sweep keeps its own bounds).
    for (const conditions of [{}, { maxDistance: 700 }]) {
      const a = computeHiddenHeightRaster(terrain, post, conditions);
      const b = computeHiddenHeightRaster(transposed, { col: post.row, row: post.col, eyeHeight: post.eyeHeight }, conditions);
      let worst = 0;
      let compared = 0;
      let nanMismatches = 0;
      for (let r = 0; r < H; r++) {
        for (let c = 0; c < W; c++) {
          const x = a.hidden[r * W + c] as number;
          const y = b.hidden[c * H + r] as number;
          if (Number.isNaN(x) !== Number.isNaN(y)) nanMismatches++;
          if (Number.isNaN(x) || Number.isNaN(y)) continue;
          worst = Math.max(worst, Math.abs(x - y));
          compared++;
        }
      }
      expect(nanMismatches).toBe(0);
      expect(compared).toBeGreaterThan(2000);
      expect(worst).toBe(0); // metres
    }
  });

  test('maxDistance leaves NaN beyond the range and the same values inside', () => {
    const full = computeHiddenHeightRaster(terrain, post);
    const limited = computeHiddenHeightRaster(terrain, post, { maxDistance: 500 });
    let inside = 0;
    for (let r = 0; r < terrain.height; r++) {
      for (let c = 0; c < terrain.width; c++) {
        const i = r * terrain.width + c;
        const d = Math.hypot(c - post.col, r - post.row) * terrain.cellSize;
        if (d > 500) expect(limited.hidden[i]).toBeNaN();
        else {
          inside++;
          expect(limited.hidden[i]).toBe(full.hidden[i]);
        }
      }
    }
    expect(inside).toBeGreaterThan(1000);
  });

  test('nodata cells get NaN and do not block', () => {
    // A high nodata-marked block in front of the post must not hide what is behind it.
    const heights = new Float32Array(terrain.width * terrain.height).fill(100);
    for (let r = 35; r < 45; r++) for (let c = 40; c < 45; c++) heights[r * terrain.width + c] = -9999;
    const flat = { ...terrain, heights, nodata: -9999 };
    const result = computeHiddenHeightRaster(flat, post, { earthRadius: 1e15 });
    expect(result.hidden[40 * terrain.width + 42]).toBeNaN();
    expect(result.hidden[40 * terrain.width + 60]).toBe(0);
    const withNaN = new Float32Array(heights);
    withNaN[10] = NaN;
    expect(computeHiddenHeightRaster({ ...flat, heights: withNaN }, post).hidden[10]).toBeNaN();
  });

  test('a prepared sweep terrain gives the same result', () => {
    const sweep = prepareSweepTerrain(terrain);
    expect(computeHiddenHeightRaster(terrain, post, {}, sweep).hidden).toEqual(computeHiddenHeightRaster(terrain, post).hidden);
    expect(() => computeHiddenHeightRaster({ ...terrain }, post, {}, sweep)).toThrow(TerrainInputError);
  });

  test.each([
    [{ col: -1, row: 0, eyeHeight: 10 }, {}, 'post-outside-raster'],
    [{ col: 0, row: 70, eyeHeight: 10 }, {}, 'post-outside-raster'],
    [{ col: 1.5, row: 0, eyeHeight: 10 }, {}, 'invalid-post'],
    [{ col: 1, row: 1, eyeHeight: -2 }, {}, 'invalid-post'],
    [{ col: 1, row: 1, eyeHeight: 2 }, { refractionCoefficient: 1 }, 'invalid-condition'],
    [{ col: 1, row: 1, eyeHeight: 2 }, { earthRadius: 0 }, 'invalid-condition'],
    [{ col: 1, row: 1, eyeHeight: 2 }, { maxDistance: -5 }, 'invalid-condition'],
  ])('rejects %j %j with %s', (badPost, conditions, code) => {
    expect(() => computeHiddenHeightRaster(terrain, badPost, conditions)).toThrow(
      expect.objectContaining({ name: 'TerrainInputError', code }),
    );
  });

  test('rejects a post on nodata', () => {
    const heights = Float32Array.from(terrain.heights);
    heights[post.row * terrain.width + post.col] = NaN;
    expect(() => computeHiddenHeightRaster({ ...terrain, heights }, post)).toThrow(
      expect.objectContaining({ code: 'post-on-nodata' }),
    );
  });
});
