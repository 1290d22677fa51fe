import { curvatureDrop } from '@/shared/terrain/curvature-drop';
import { locatePostCell } from '@/shared/terrain/locate-post-cell';
import { computeMultiConditionViewsheds } from '@/shared/terrain/multi-condition-viewshed';
import { computeHiddenHeightRaster } from '@/shared/terrain/hidden-height-raster';
import { generateSyntheticTerrain } from '@/shared/terrain/synthetic-terrain';
import { targetVisibilityMask } from '@/shared/terrain/target-visibility-mask';
import { createTerrainRaster } from '@/shared/terrain/terrain-raster';
import { classifyVisibility, VISIBILITY_CLASS } from '@/shared/terrain/visibility-classes';
import { oneRowHidden } from '@/tests/unit/terrain/one-row-raster';

describe('curvatureDrop', () => {
  test('matches the surveyors’ rule of 0.0675·K² metres (K in km, k ≈ 0.14)', () => {
    // Source: combined curvature-and-refraction rule of thumb of levelling,
    // c ≈ 0.0675 K² m with K in km (from memory), i.e. (1 − 0.14)/(2 · 6370 km).
    for (const km of [1, 5, 20]) {
      expect(curvatureDrop(km * 1000, 0.14, 6_370_000)).toBeCloseTo(0.0675 * km * km, 2);
      expect(Math.abs(curvatureDrop(km * 1000, 0.14, 6_370_000) / (0.0675 * km * km) - 1)).toBeLessThan(0.002);
    }
  });
  test('without refraction equals the sphere’s sagitta d²/(2R) to 0.1 %', () => {
    // Source: drop of a sphere below its tangent plane, R − √(R² − d²) ≈ d²/(2R) (closed form).
    const R = 6_371_008.8;
    const d = 30_000;
    expect(Math.abs(curvatureDrop(d, 0, R) / (R - Math.sqrt(R * R - d * d)) - 1)).toBeLessThan(0.001);
  });
});

describe('classifyVisibility and targetVisibilityMask', () => {
  // common practice, no source: seen when hidden ≤ 1 mm, target-only when hidden ≤ target.
  const raster = oneRowHidden([0, 0.0005, 0.5, 30, 30.5, NaN]);
  test('sorts cells into seen, target-only, blind and none', () => {
    const classes = classifyVisibility(raster, 30);
    expect(Array.from(classes.classes)).toEqual([
      VISIBILITY_CLASS.seen,
      VISIBILITY_CLASS.seen,
      VISIBILITY_CLASS.targetOnly,
      VISIBILITY_CLASS.targetOnly,
      VISIBILITY_CLASS.blind,
      VISIBILITY_CLASS.none,
    ]);
    expect(classes.targetHeight).toBe(30);
  });
  test('mask is 1 where the target is seen, NaN where uncomputed', () => {
    const mask = Array.from(targetVisibilityMask(raster, 30));
    expect(mask.slice(0, 5)).toEqual([1, 1, 1, 1, 0]);
    expect(mask[5]).toBeNaN();
    expect(Array.from(targetVisibilityMask(raster)).slice(0, 3)).toEqual([1, 1, 0]);
  });
  test('does not mutate its input and rejects negative targets', () => {
    const before = Float32Array.from(raster.hidden);
    classifyVisibility(raster, 10);
    targetVisibilityMask(raster, 10);
    expect(raster.hidden).toEqual(before);
    expect(() => classifyVisibility(raster, -1)).toThrow(expect.objectContaining({ code: 'invalid-option' }));
    expect(() => targetVisibilityMask(raster, NaN)).toThrow(expect.objectContaining({ code: 'invalid-option' }));
  });
});

describe('locatePostCell', () => {
  // Source: ESRI ASCII grid geometry — column floor((x − xllcorner)/cellsize), row 0 at the top.
  const grid = { width: 10, height: 8, cellSize: 25, xll: 500_000, yll: 6_000_000, crs: null };
  test('finds the containing cell', () => {
    expect(locatePostCell(grid, 500_000 + 2.5 * 25, 6_000_000 + 8 * 25 - 0.1)).toEqual({ col: 2, row: 0 });
    expect(locatePostCell(grid, 500_000 + 9.99 * 25, 6_000_000 + 0.01)).toEqual({ col: 9, row: 7 });
    expect(locatePostCell(grid, 500_250, 6_000_000)).toEqual({ col: 9, row: 7 }); // south-east corner
  });
  test('rejects points outside', () => {
    expect(() => locatePostCell(grid, 499_999, 6_000_100)).toThrow(expect.objectContaining({ code: 'post-outside-raster' }));
    expect(() => locatePostCell(grid, 500_100, 6_000_201)).toThrow(expect.objectContaining({ code: 'post-outside-raster' }));
  });
});

describe('createTerrainRaster', () => {
  test('checks sizes', () => {
    expect(createTerrainRaster({ heights: new Float32Array(6), width: 3, height: 2, cellSize: 10 }).xll).toBe(0);
    expect(() => createTerrainRaster({ heights: new Float32Array(5), width: 3, height: 2, cellSize: 10 })).toThrow(
      expect.objectContaining({ code: 'invalid-raster' }),
    );
    expect(() => createTerrainRaster({ heights: new Float32Array(6), width: 3, height: 2, cellSize: 0 })).toThrow(
      expect.objectContaining({ code: 'invalid-raster' }),
    );
  });
});

describe('computeMultiConditionViewsheds', () => {
  const terrain = generateSyntheticTerrain({ width: 120, height: 120, cellSize: 50, seed: 9 });
  const post = { col: 60, row: 60, eyeHeight: 12 };
  test('equals one computation per condition, in order', () => {
    const conditions = [{ refractionCoefficient: 0.13 }, { refractionCoefficient: -0.2 }, { maxDistance: 1500 }];
    const results = computeMultiConditionViewsheds(terrain, post, conditions, 40);
    expect(results).toHaveLength(3);
    results.forEach((result, i) => {
      expect(result.conditions).toBe(conditions[i]);
      expect(result.hidden.hidden).toEqual(computeHiddenHeightRaster(terrain, post, conditions[i]).hidden);
      expect(result.classes.targetHeight).toBe(40);
    });
  });
  test('stronger refraction never hides more', () => {
    // Source: a larger k gives a larger effective radius R/(1 − k), so every drop is smaller
    // (common practice, no source). Compared on the seen counts with a 1 cm allowance.
    const [strong, weak] = computeMultiConditionViewsheds(terrain, post, [
      { refractionCoefficient: 0.25 },
      { refractionCoefficient: -0.25 },
    ]);
    let worse = 0;
    for (let i = 0; i < strong!.hidden.hidden.length; i++) {
      if ((strong!.hidden.hidden[i] as number) > (weak!.hidden.hidden[i] as number) + 0.01) worse++;
    }
    expect(worse).toBe(0);
  });
  test('needs at least one condition', () => {
    expect(() => computeMultiConditionViewsheds(terrain, post, [])).toThrow(
      expect.objectContaining({ code: 'invalid-condition' }),
    );
  });
});
