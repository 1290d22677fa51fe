import { hiddenHeight } from '@/shared/sightline';
import { computeHiddenHeightRaster } from '@/shared/terrain/hidden-height-raster';
import { generateSyntheticTerrain } from '@/shared/terrain/synthetic-terrain';
import { TerrainInputError } from '@/shared/terrain/terrain-input-error';
import { terrainProfile } from '@/shared/terrain/terrain-profile';
import type { TerrainRaster } from '@/shared/terrain/terrain-raster';
import { checkHiddenHeights } from '@/tests/support/line-of-sight-checker';
import { compareHiddenHeights } from '@/tests/unit/terrain/agreement';

jest.setTimeout(120_000);

const centre = (terrain: TerrainRaster, col: number, row: number) => ({
  x: terrain.xll + (col + 0.5) * terrain.cellSize,
  y: terrain.yll + (terrain.height - row - 0.5) * terrain.cellSize,
});

/** Hidden heights from the profile for every `stride`-th cell, NaN elsewhere (same layout as the rasters). */
function profileHiddenHeights(
  terrain: TerrainRaster,
  post: { col: number; row: number; eyeHeight: number },
  k: number,
  stride: number,
): Float32Array {
  const out = new Float32Array(terrain.width * terrain.height).fill(NaN);
  const eye = centre(terrain, post.col, post.row);
  for (let row = 0; row < terrain.height; row += stride) {
    for (let col = 0; col < terrain.width; col += stride) {
      if (row === post.row && col === post.col) continue;
      const profile = terrainProfile(terrain, {
        observer: { ...eye, eyeHeight: post.eyeHeight },
        target: { ...centre(terrain, col, row), height: 0 },
        conditions: [{ refractionCoefficient: k }],
      });
      out[row * terrain.width + col] = profile.conditions[0]!.hiddenHeight;
    }
  }
  return out;
}

describe('terrainProfile against the brute-force line-of-sight checker', () => {
  // Source: tests/support/line-of-sight-checker.ts — the same bilinear surface sampled
  // every 0.05 cell and at every grid-line crossing. The profile finds the exact maximum
  // on that surface, so it is never below the sampled checker and above it by no more
  // than what the sampling misses (tolerance 1 cm on 25–50 m cells, measured ≤ 4 mm).
  test.each([
    { seed: 3, size: 121, cellSize: 25, post: { col: 60, row: 50, eyeHeight: 12 }, k: 0.13 },
    { seed: 8, size: 101, cellSize: 50, post: { col: 10, row: 90, eyeHeight: 25 }, k: -0.1 },
    { seed: 21, size: 101, cellSize: 10, post: { col: 70, row: 20, eyeHeight: 3 }, k: 0.25 },
  ])('seed $seed, post ($post.col, $post.row), k $k', ({ seed, size, cellSize, post, k }) => {
    const terrain = generateSyntheticTerrain({ width: size, height: size, cellSize, seed });
    const stride = 2;
    const profile = profileHiddenHeights(terrain, post, k, stride);
    const checker = checkHiddenHeights(terrain, post, { refractionCoefficient: k }, { step: 0.05, stride });
    let compared = 0;
    let hiddenCells = 0;
    for (let i = 0; i < profile.length; i++) {
      const p = profile[i] as number;
      const c = checker[i] as number;
      if (Number.isNaN(p) || Number.isNaN(c)) continue;
      compared++;
      if (c > 0.001) hiddenCells++;
      expect(p).toBeGreaterThanOrEqual(c - 1e-3); // Float32 storage of the checker
      expect(p - c).toBeLessThanOrEqual(0.01);
    }
    expect(compared).toBeGreaterThan(((size + 1) / 2) ** 2 - 2);
    expect(hiddenCells).toBeGreaterThan(compared / 10); // the terrain does hide ground
  });
});

describe('terrainProfile against computeHiddenHeightRaster at the same cells', () => {
  // Source: the engine's own stated accuracy against the brute-force checker
  // (shared/terrain/hidden-height-raster.ts, tests/unit/terrain/hidden-height-raster.test.ts):
  // ≥ 99.5 % agreement on seen / not seen for 0 m and 10 m targets and a median error
  // ≤ 1 m over hidden cells. The engine samples only real points of each sight line,
  // so it never exceeds the exact value: engine ≤ profile + 1 mm on every cell.
  test.each([
    { seed: 3, size: 161, post: { col: 80, row: 70, eyeHeight: 12 }, k: 0.13 },
    { seed: 44, size: 161, post: { col: 30, row: 120, eyeHeight: 20 }, k: -0.1 },
  ])('seed $seed, k $k', ({ seed, size, post, k }) => {
    const terrain = generateSyntheticTerrain({ width: size, height: size, seed });
    const profile = profileHiddenHeights(terrain, post, k, 3);
    const engine = computeHiddenHeightRaster(terrain, post, { refractionCoefficient: k }).hidden;
    const sampled = engine.map((v, i) => (Number.isNaN(profile[i] as number) ? NaN : v));
    const stats = compareHiddenHeights(sampled, profile, terrain.width, post);
    expect(stats.cells).toBeGreaterThan(54 * 54 - 2);
    expect(stats.seenAgreement(0)).toBeGreaterThanOrEqual(0.995);
    expect(stats.seenAgreement(10)).toBeGreaterThanOrEqual(0.995);
    expect(stats.medianErrorHidden).toBeLessThanOrEqual(1);
    for (let i = 0; i < profile.length; i++) {
      if (Number.isNaN(profile[i] as number)) continue;
      expect(engine[i] as number).toBeLessThanOrEqual((profile[i] as number) + 1e-3);
    }
  });
});

describe('terrainProfile on a flat sea', () => {
  // Source: the closed-form hidden height of shared/sightline (hiddenHeight: exact on the
  // sphere of effective radius R/(1 − k), measured from the tangent point), itself checked
  // against the levelling correction (1 − k)·d²/(2R). The profile uses the planar drop, which
  // differs from the sphere by (d/R')² relatively: well under a millimetre at these ranges.
  const width = 1401;
  const sea: TerrainRaster = {
    heights: new Float32Array(width * 3),
    width,
    height: 3,
    cellSize: 25,
    xll: 500_000,
    yll: 6_000_000,
    nodata: null,
    crs: { epsg: 32633, wkt: null },
  };
  test.each([
    { eye: 10, distance: 30_000, k: 0.13 },
    { eye: 20, distance: 34_000, k: 0 },
    { eye: 5, distance: 20_000, k: 0.25 },
    { eye: 30, distance: 34_000, k: -0.1 },
    { eye: 2, distance: 3_000, k: 0.13 }, // inside the horizon: nothing hidden
  ])('eye $eye m, target at $distance m, k $k: within 1 mm', ({ eye, distance, k }) => {
    const observer = centre(sea, 0, 1);
    const profile = terrainProfile(sea, {
      observer: { ...observer, eyeHeight: eye },
      target: { x: observer.x + distance, y: observer.y, height: 2 },
      conditions: [{ refractionCoefficient: k, earthRadius: 6_371_008.8 }],
    });
    const expected = hiddenHeight(eye, distance, { k, earthRadiusM: 6_371_008.8 }).value as number;
    const result = profile.conditions[0]!;
    expect(Math.abs(result.hiddenHeight - expected)).toBeLessThan(0.001);
    expect(result.groundSeen).toBe(expected === 0);
    expect(result.targetTopSeen).toBe(expected <= 2);
    if (expected > 0) {
      // The horizon is the tangent point, √(2R'h) from the eye (planar-drop model).
      const tangent = Math.sqrt((2 * 6_371_008.8 * eye) / (1 - k));
      expect(Math.abs(result.horizon!.distance - tangent)).toBeLessThan(1);
    } else {
      expect(result.horizon).toBeNull();
    }
  });
});

describe('terrainProfile geometry', () => {
  // A wall across flat ground, curvature switched off (R = 1e15 m): similar triangles
  // (common practice, no source).
  const width = 100;
  const height = 5;
  const heights = new Float32Array(width * height);
  for (let r = 0; r < height; r++) for (let c = 40; c <= 41; c++) heights[r * width + c] = 30;
  const walled: TerrainRaster = { heights, width, height, cellSize: 10, xll: 0, yll: 0, nodata: null, crs: null };
  const flatConditions = [{ refractionCoefficient: 0, earthRadius: 1e15 }];

  test('hidden height, horizon and first obstruction behind a wall', () => {
    const observer = { ...centre(walled, 10, 2), eyeHeight: 10 };
    const target = { ...centre(walled, 90, 2), height: 40 };
    const profile = terrainProfile(walled, { observer, target, conditions: flatConditions });
    const result = profile.conditions[0]!;
    // Crest at 300 … 310 m from the eye (cells 40–41), 30 m high; eye at 10 m.
    // The near crest edge (300 m) is seen steepest and sets the horizon: 10 + 20·800/300 at 800 m.
    expect(result.hiddenHeight).toBeCloseTo(10 + (20 * 800) / 300, 6);
    expect(result.horizon!.distance).toBeCloseTo(300, 6);
    expect(result.horizon!.ground).toBeCloseTo(30, 6);
    // Sight line to the top (40 m at 800 m) rises 30/800 per metre; the wall's face rises
    // 30 m over 10 m from 290 m: 30·(d − 290)/10 = 10 + 30·d/800 → d = 299.5…
    const d = (10 + 30 * 29) / (3 - 30 / 800);
    expect(result.firstObstruction!.distance).toBeCloseTo(d, 6);
    expect(result.groundSeen).toBe(false);
    expect(result.targetTopSeen).toBe(false);
  });

  test('a target tall enough to show over the wall', () => {
    const profile = terrainProfile(walled, {
      observer: { ...centre(walled, 10, 2), eyeHeight: 10 },
      target: { ...centre(walled, 90, 2), height: 70 },
      conditions: flatConditions,
    });
    expect(profile.conditions[0]!.targetTopSeen).toBe(true);
    expect(profile.conditions[0]!.firstObstruction).toBeNull();
  });

  test('samples every half cell, the last at the target, curvature drop applied per condition', () => {
    const profile = terrainProfile(walled, {
      observer: { ...centre(walled, 10, 2), eyeHeight: 10 },
      target: { ...centre(walled, 90, 2), height: 0 },
      conditions: [{ refractionCoefficient: 0.13 }, { refractionCoefficient: -0.5, earthRadius: 6_000_000 }],
    });
    expect(profile.distance).toBeCloseTo(800, 9);
    expect(profile.spacing).toBe(5);
    expect(profile.sampleDistances.length).toBe(161);
    expect(profile.sampleDistances[160]).toBeCloseTo(800, 9);
    expect(profile.sampleGround[60]).toBeCloseTo(30, 9); // 300 m: the wall
    // (1 − k)·d²/(2R) at 800 m: 0.87·640 000/12 742 017.6 and 1.5·640 000/12 000 000.
    expect(profile.sampleGround[160]! - profile.conditions[0]!.loweredGround[160]!).toBeCloseTo(
      (0.87 * 640_000) / 12_742_017.6,
      9,
    );
    expect(profile.sampleGround[160]! - profile.conditions[1]!.loweredGround[160]!).toBeCloseTo((1.5 * 640_000) / 12_000_000, 9);
  });

  test('long lines keep to the sample limit', () => {
    const terrain = generateSyntheticTerrain({ width: 400, height: 20, cellSize: 25, seed: 1 });
    const profile = terrainProfile(terrain, {
      observer: { ...centre(terrain, 0, 10), eyeHeight: 5 },
      target: { ...centre(terrain, 399, 10), height: 0 },
      conditions: [{ refractionCoefficient: 0.13 }],
      maxSamples: 101,
    });
    expect(profile.sampleDistances.length).toBe(101);
    expect(profile.spacing).toBeCloseTo(99.75, 9);
  });

  test('nodata does not block, and is NaN in the samples', () => {
    const holed = new Float32Array(heights);
    for (let r = 0; r < height; r++) for (let c = 40; c <= 41; c++) holed[r * width + c] = NaN;
    const profile = terrainProfile(
      { ...walled, heights: holed },
      {
        observer: { ...centre(walled, 10, 2), eyeHeight: 10 },
        target: { ...centre(walled, 90, 2), height: 0 },
        conditions: flatConditions,
      },
    );
    expect(profile.conditions[0]!.groundSeen).toBe(true);
    expect(Number.isNaN(profile.sampleGround[60]!)).toBe(true);
  });

  test('does not modify the terrain', () => {
    const copy = new Float32Array(heights);
    terrainProfile(walled, {
      observer: { ...centre(walled, 10, 2), eyeHeight: 10 },
      target: { ...centre(walled, 90, 2), height: 0 },
      conditions: flatConditions,
    });
    expect(walled.heights).toEqual(copy);
  });

  test('refuses points outside the grid, on nodata, or the same point twice', () => {
    const observer = { ...centre(walled, 10, 2), eyeHeight: 10 };
    const run =
      (target: { x: number; y: number; height: number }, terrain: TerrainRaster = walled) =>
      () =>
        terrainProfile(terrain, { observer, target, conditions: flatConditions });
    expect(run({ x: -5, y: 20, height: 0 })).toThrow(expect.objectContaining({ code: 'point-outside-raster' }));
    expect(run({ x: observer.x, y: observer.y, height: 0 })).toThrow(expect.objectContaining({ code: 'invalid-option' }));
    const holed = new Float32Array(heights).fill(NaN, 0, 50);
    expect(run({ ...centre(walled, 20, 0), height: 0 }, { ...walled, heights: holed })).toThrow(TerrainInputError);
    expect(run({ ...centre(walled, 20, 0), height: 0 }, { ...walled, heights: holed })).toThrow(
      expect.objectContaining({ code: 'point-on-nodata' }),
    );
  });
});
