import { classAt, postSeesFix } from '@/shared/fixes/post-sees-fix';
import { visibilitySentence } from '@/shared/fixes/visibility-sentence';
import { MEAN_EARTH_RADIUS_M } from '@/shared/physics/constants';
import { createTerrainRaster, type TerrainRaster } from '@/shared/terrain/terrain-raster';
import { VISIBILITY_CLASS } from '@/shared/terrain/visibility-classes';

/** Three identical rows of `cells` cells (invented test terrain); the line runs along the middle row. */
function strip(cellSize: number, heightAt: (col: number) => number, cells: number): TerrainRaster {
  const heights = new Float32Array(3 * cells);
  for (let r = 0; r < 3; r++) for (let c = 0; c < cells; c++) heights[r * cells + c] = heightAt(c);
  return createTerrainRaster({ heights, width: cells, height: 3, cellSize, xll: 0, yll: 0 });
}
const centre = (cellSize: number, col: number) => (col + 0.5) * cellSize;

describe('postSeesFix: can a post see the place a fix puts a smoke?', () => {
  it('on flat ground beyond the horizon, the smoke must rise the hidden height of the curved earth', () => {
    // Source: geometric horizon d = √(2Rh) and hidden height (D − d)²/(2R) with no refraction (k = 0),
    // e.g. N. Bowditch, The American Practical Navigator, NGA Pub. 9 (2019), ch. 22, distance of the horizon (from memory).
    const cell = 500;
    const terrain = strip(cell, () => 0, 80);
    const eye = 10;
    const D = 30_000;
    const expected = (D - Math.sqrt(2 * MEAN_EARTH_RADIUS_M * eye)) ** 2 / (2 * MEAN_EARTH_RADIUS_M);
    const got = postSeesFix({
      terrain,
      post: { x: centre(cell, 0), y: 750, eyeHeightM: eye },
      at: { x: centre(cell, 0) + D, y: 750 },
      refractionCoefficient: 0,
      runClass: null,
    });
    expect(got.basis).toBe('profile');
    expect(got.seesGround).toBe(false);
    expect(got.minSmokeHeightM!).toBeCloseTo(expected, 1); // ≈ 27.5 m
  });

  it('behind a ridge on a flat earth, the smoke must reach the sight line over the ridge (similar triangles)', () => {
    // Common practice, no source: the line from the eye over the ridge's near crest, h + (H − h)·D/d₁, above the ground at D.
    const cell = 100;
    const H = 60;
    const terrain = strip(cell, (c) => (c >= 20 && c <= 24 ? H : 0), 60);
    const eye = 20;
    const x0 = centre(cell, 0);
    const d1 = centre(cell, 20) - x0; // the bilinear surface reaches the crest at the first ridge cell's centre
    const D = centre(cell, 50) - x0;
    const got = postSeesFix({
      terrain,
      post: { x: x0, y: 150, eyeHeightM: eye },
      at: { x: x0 + D, y: 150 },
      refractionCoefficient: 0,
      earthRadiusM: 1e15, // no curvature
      runClass: null,
    });
    expect(got.seesGround).toBe(false);
    expect(got.minSmokeHeightM!).toBeCloseTo(eye + ((H - eye) * D) / d1, 3);
    // In front of the ridge the ground is seen: nothing needs to rise.
    const near = postSeesFix({
      terrain,
      post: { x: x0, y: 150, eyeHeightM: eye },
      at: { x: centre(cell, 10), y: 150 },
      refractionCoefficient: 0,
      earthRadiusM: 1e15,
      runClass: null,
    });
    expect(near).toEqual({ seesGround: true, minSmokeHeightM: 0, basis: 'profile' });
  });

  it('takes the ground’s visibility from a coverage run where it decided the cell, the height still from the profile', () => {
    // Common practice, no source: a stored per-post class says seen / only the target / blind; the run stores no heights.
    const cell = 100;
    const terrain = strip(cell, (c) => (c >= 20 && c <= 24 ? 60 : 0), 60);
    const base = {
      terrain,
      post: { x: 50, y: 150, eyeHeightM: 20 },
      at: { x: centre(cell, 50), y: 150 },
      refractionCoefficient: 0,
      earthRadiusM: 1e15,
    };
    const profileOnly = postSeesFix({ ...base, runClass: null });
    const blind = postSeesFix({ ...base, runClass: VISIBILITY_CLASS.blind });
    expect(blind.basis).toBe('coverage-run');
    expect(blind.seesGround).toBe(false);
    expect(blind.minSmokeHeightM).toBeCloseTo(profileOnly.minSmokeHeightM!, 9);
    expect(postSeesFix({ ...base, runClass: VISIBILITY_CLASS.seen })).toEqual({
      seesGround: true,
      minSmokeHeightM: 0,
      basis: 'coverage-run',
    });
    // Beyond the case's detection range the run did not decide the view: the profile answers.
    expect(postSeesFix({ ...base, runClass: VISIBILITY_CLASS.outOfRange }).basis).toBe('profile');
  });

  it('says nothing without terrain, or for a point off the terrain', () => {
    // Common practice, no source: without a ground model there is no line of sight to compute.
    const noTerrain = postSeesFix({
      terrain: null,
      post: { x: 0, y: 0, eyeHeightM: 20 },
      at: { x: 1000, y: 0 },
      refractionCoefficient: 0.13,
      runClass: null,
    });
    expect(noTerrain).toEqual({ seesGround: null, minSmokeHeightM: null, basis: 'no-terrain' });
    const off = postSeesFix({
      terrain: strip(100, () => 0, 10),
      post: { x: 50, y: 150, eyeHeightM: 20 },
      at: { x: 50_000, y: 150 },
      refractionCoefficient: 0.13,
      runClass: null,
    });
    expect(off.basis).toBe('no-terrain');
  });

  it('reads a class layer at a grid point (row 0 north), null outside it', () => {
    // Common practice, no source: row-major raster, row 0 at the top (north).
    const grid = { width: 3, height: 2, cellSize: 10, xll: 0, yll: 0, crs: null };
    const classes = Uint8Array.from([1, 2, 3, 4, 0, 1]);
    expect(classAt(grid, classes, 25, 15)).toBe(3);
    expect(classAt(grid, classes, 5, 5)).toBe(4);
    expect(classAt(grid, classes, 45, 5)).toBeNull();
  });
});

describe('visibilitySentence', () => {
  it('says what a post cannot see and how high a smoke must rise, rounded up', () => {
    // Common practice, no source: a height a smoke must reach is rounded up, never down.
    expect(
      visibilitySentence({ postName: 'Sedge Ridge Tower', seesGround: false, minSmokeHeightM: 39.2, basis: 'profile' }),
    ).toBe(
      'Sedge Ridge Tower cannot see the ground there; a smoke would have to rise at least 40 m to show above the terrain in between.',
    );
    expect(
      visibilitySentence({ postName: 'Crane Knoll Tower', seesGround: true, minSmokeHeightM: 0, basis: 'coverage-run' }),
    ).toBe('Crane Knoll Tower sees the ground there (from the latest coverage run).');
  });
});
