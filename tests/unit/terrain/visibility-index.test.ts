import { computeHiddenHeightRaster } from '@/shared/terrain/hidden-height-raster';
import { generateSyntheticTerrain } from '@/shared/terrain/synthetic-terrain';
import { TerrainInputError } from '@/shared/terrain/terrain-input-error';
import type { TerrainRaster } from '@/shared/terrain/terrain-raster';
import { computeVisibilityIndex, VISIBILITY_INDEX_RAYS, visibilityIndexStride } from '@/shared/terrain/visibility-index';

jest.setTimeout(120_000);

function flat(width: number, height: number, cellSize: number): TerrainRaster {
  return {
    heights: new Float32Array(width * height),
    width,
    height,
    cellSize,
    xll: 500_000,
    yll: 6_000_000,
    nodata: null,
    crs: null,
  };
}

describe('computeVisibilityIndex stops a ray only where nothing further can be seen', () => {
  test('a far mountain above a near wall is still counted, as a plain ray walk counts it', () => {
    // Source: the visibility index's own definition (a sample is seen when its elevation slope is at
    // least the largest before it on the ray); the reference walks every sample of every ray with no
    // early stop, so any stop that drops a seen sample makes the figures differ.
    const W = 301;
    const cellSize = 10;
    const terrain = flat(W, W, cellSize);
    for (let row = 0; row < W; row++) {
      for (let col = 0; col < W; col++) {
        const d = Math.hypot(col - 150, row - 150);
        let z = 0;
        if (d > 40 && d < 43) z = 30; // a wall all round at 400 m
        if (Math.hypot(col - 260, row - 150) < 25) z = 400 - 12 * Math.hypot(col - 260, row - 150); // a mountain east
        if (Math.hypot(col - 150, row - 40) < 5) z = 2000; // the grid's highest ground, north
        terrain.heights[row * W + col] = z;
      }
    }
    const options = { heightM: 10, radiusM: 1400, rays: 32, earthRadius: 6_371_008.8, refractionCoefficient: 0.13 };
    const index = computeVisibilityIndex(terrain, { ...options, indexRows: [150, 151] });
    const got = index.seenM2[150 * index.width + 150] as number;
    // Reference: the same sampling, written plainly, every sample of every ray.
    const steps = Math.floor(options.radiusM / cellSize);
    const at = (x: number, y: number) => {
      const c = Math.floor(x);
      const r = Math.floor(y);
      const fx = x - c;
      const fy = y - r;
      const z = (cc: number, rr: number) => terrain.heights[rr * W + cc] as number;
      const top = z(c, r) + fx * (z(c + 1, r) - z(c, r));
      return top + fy * (z(c, r + 1) + fx * (z(c + 1, r + 1) - z(c, r + 1)) - top);
    };
    const eye = options.heightM;
    let expected = cellSize * cellSize;
    for (let r = 0; r < options.rays; r++) {
      const theta = (2 * Math.PI * r) / options.rays;
      let horizon = -Infinity;
      for (let s = 1; s <= steps; s++) {
        const x = 150 + s * Math.sin(theta);
        const y = 150 - s * Math.cos(theta);
        if (x < 0 || y < 0 || x > W - 2 || y > W - 2) break;
        const drop = ((1 - options.refractionCoefficient) * (s * cellSize) ** 2) / (2 * options.earthRadius);
        const slope = (at(x, y) - drop - eye) * (1 / s);
        if (slope >= horizon) {
          horizon = slope;
          expected += ((2 * Math.PI) / options.rays) * s * cellSize * cellSize;
        }
      }
    }
    // The mountain's face must be in it: more than the ground inside the wall alone.
    expect(expected).toBeGreaterThan(Math.PI * 420 ** 2 * 1.05);
    expect(Math.abs(got - expected) / expected).toBeLessThan(1e-6); // stored as Float32
  });
});

describe('computeVisibilityIndex against closed forms', () => {
  test('a flat plain without curvature: the whole disc of the radius is seen', () => {
    // Source: area of a disc, π r² (common practice, no source); R = 1e15 m makes the drop negligible.
    const terrain = flat(201, 201, 10);
    const index = computeVisibilityIndex(terrain, { heightM: 5, radiusM: 800, earthRadius: 1e15, indexRows: [100, 101] });
    const seen = index.seenM2[100 * index.width + 100] as number;
    // 80 samples a ray, each for (2π/rays)·s·Δ² m², plus the tower's own cell: π·Δ²·80·81 + Δ².
    expect(Math.abs(seen - (Math.PI * 100 * 80 * 81 + 100)) / seen).toBeLessThan(1e-6); // stored as Float32
    expect(Math.abs(seen - Math.PI * 800 ** 2) / (Math.PI * 800 ** 2)).toBeLessThan(0.02);
  });

  test('a flat sea: the seen ground ends at the horizon distance √(2R′h)', () => {
    // Source: geometric horizon on a sphere of effective radius R′ = R/(1 − k), d = √(2R′h)
    // (standard horizon formula; the same planar drop d²/(2R′) the engine uses).
    const terrain = flat(401, 401, 100);
    const heightM = 20;
    const k = 0.13;
    const R = 6_371_008.8;
    const horizonM = Math.sqrt((2 * R * heightM) / (1 - k)); // ≈ 17.1 km, inside the 19 km radius
    const index = computeVisibilityIndex(terrain, { heightM, radiusM: 19_000, indexRows: [200, 201] });
    const seen = index.seenM2[200 * index.width + 200] as number;
    const expected = Math.PI * horizonM ** 2;
    // Tolerance 1.5 %: samples every 100 m, so the edge falls anywhere in the last annulus (Δ/d ≈ 0.6 %).
    expect(Math.abs(seen - expected) / expected).toBeLessThan(0.015);
  });

  test('counts only ground inside the site mask', () => {
    // Source: half of a disc is π r²/2 (common practice, no source).
    const terrain = flat(201, 201, 10);
    const mask = new Uint8Array(201 * 201);
    for (let row = 0; row < 201; row++) for (let col = 101; col < 201; col++) mask[row * 201 + col] = 1;
    const options = { heightM: 5, radiusM: 800, earthRadius: 1e15, indexRows: [100, 101] as const };
    const whole = computeVisibilityIndex(terrain, options).seenM2[100 * 201 + 100] as number;
    const half = computeVisibilityIndex(terrain, { ...options, mask }).seenM2[100 * 201 + 100] as number;
    expect(half / whole).toBeGreaterThan(0.47);
    expect(half / whole).toBeLessThan(0.51);
  });
});

describe('computeVisibilityIndex against exact viewsheds on sample cells', () => {
  // Reference: the engine's own hidden-height raster (held to the exact line-of-sight checker in
  // hidden-height-raster.test.ts), counting cells with hidden ≤ 1 mm within the radius.
  // Measured here on 16 cells of seeded hill country (400², 25 m, tower 10 m, radius 3 km),
  // |relative error| median / max: 16 rays 2.3 % / 11.5 %, 32 rays 2.0 % / 3.3 %,
  // 64 rays 0.9 % / 2.9 %, 128 rays 0.9 % / 2.2 %.
  const terrain = generateSyntheticTerrain({ width: 400, height: 400, seed: 7 });
  const heightM = 10;
  const radiusM = 3000;
  const samples = Array.from({ length: 16 }, (_, q) => ({ col: 60 + ((q * 97) % 280), row: 60 + ((q * 53) % 280) }));

  const exactM2 = samples.map(({ col, row }) => {
    const exact = computeHiddenHeightRaster(terrain, { col, row, eyeHeight: heightM }, { maxDistance: radiusM });
    let seenCells = 0;
    for (const v of exact.hidden) if (v <= 0.001) seenCells++;
    return seenCells * terrain.cellSize ** 2;
  });
  const errorsFor = (rays: number) =>
    samples.map(({ col, row }, q) => {
      const one = { indexRows: [row, row + 1], indexCols: [col, col + 1] } as const;
      const index = computeVisibilityIndex(terrain, { heightM, radiusM, rays, ...one });
      const estimate = index.seenM2[row * index.width + col] as number;
      return Math.abs(estimate - (exactM2[q] as number)) / (exactM2[q] as number);
    });

  test(`${VISIBILITY_INDEX_RAYS} rays: median error ≤ 2 %, worst ≤ 5 %`, () => {
    const errors = errorsFor(VISIBILITY_INDEX_RAYS).sort((a, b) => a - b);
    expect(errors[Math.floor(errors.length / 2)]).toBeLessThanOrEqual(0.02);
    expect(errors[errors.length - 1]).toBeLessThanOrEqual(0.05);
  });

  test('more rays do not make it worse than 16 rays', () => {
    const worst = (errors: number[]) => Math.max(...errors);
    expect(worst(errorsFor(VISIBILITY_INDEX_RAYS))).toBeLessThan(worst(errorsFor(16)));
  });
});

describe('computeVisibilityIndex grid and input', () => {
  test('the index grid is every n-th cell, top-left corner kept', () => {
    const terrain = generateSyntheticTerrain({ width: 101, height: 75, seed: 3 });
    const index = computeVisibilityIndex(terrain, { heightM: 10, radiusM: 500, strideCells: 10, rays: 8 });
    expect([index.width, index.height, index.cellSize]).toEqual([11, 8, 250]);
    expect(index.yll + index.height * index.cellSize).toBeCloseTo(terrain.yll + terrain.height * terrain.cellSize, 6);
    expect(index.seenM2.every((v) => v > 0)).toBe(true);
  });

  test('rows outside indexRows stay NaN and computed rows equal a whole run', () => {
    const terrain = generateSyntheticTerrain({ width: 80, height: 80, seed: 5 });
    const whole = computeVisibilityIndex(terrain, { heightM: 10, radiusM: 600, strideCells: 4, rays: 16 });
    const part = computeVisibilityIndex(terrain, { heightM: 10, radiusM: 600, strideCells: 4, rays: 16, indexRows: [5, 9] });
    for (let i = 0; i < whole.seenM2.length; i++) {
      const row = Math.floor(i / whole.width);
      if (row >= 5 && row < 9) expect(part.seenM2[i]).toBe(whole.seenM2[i]);
      else expect(part.seenM2[i]).toBeNaN();
    }
  });

  test('does not mutate the terrain', () => {
    const terrain = generateSyntheticTerrain({ width: 40, height: 40, seed: 9 });
    const copy = Float32Array.from(terrain.heights);
    computeVisibilityIndex(terrain, { heightM: 10, radiusM: 300, rays: 8 });
    expect(terrain.heights).toEqual(copy);
  });

  test.each([
    [{ heightM: -1, radiusM: 100 }, /Tower height/],
    [{ heightM: 1, radiusM: 0 }, /Radius/],
    [{ heightM: 1, radiusM: 100, rays: 2 }, /Rays/],
    [{ heightM: 1, radiusM: 100, strideCells: 0 }, /Stride/],
    [{ heightM: 1, radiusM: 100, indexRows: [3, 2] as const }, /Index rows/],
  ])('refuses %o', (options, message) => {
    const terrain = flat(10, 10, 10);
    expect(() => computeVisibilityIndex(terrain, options)).toThrow(TerrainInputError);
    expect(() => computeVisibilityIndex(terrain, options)).toThrow(message);
  });

  test('the stride keeps the work within the budget', () => {
    const grid = { width: 2000, height: 2000, cellSize: 25, xll: 0, yll: 0, crs: null };
    const stride = visibilityIndexStride(grid, 8000, 64);
    const work = (s: number) => Math.ceil(2000 / s) ** 2 * 64 * 320;
    expect(work(stride)).toBeLessThanOrEqual(1.2e9);
    expect(work(stride - 1)).toBeGreaterThan(1.2e9);
  });
});
