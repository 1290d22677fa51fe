/**
 * A flat plain on a small test sphere, where every post's seen area is an
 * exact circle: the engine's model lowers the ground by d²/(2R′)
 * (R′ = R/(1 − k)), so a target of height T is seen from an eye at height h
 * out to the geographic range D = √(2R′h) + √(2R′T).
 *
 * Source: geographic range of an object, D = √(2R′h) + √(2R′T) — the distance
 * at which the line from the eye grazing the horizon meets the target's top
 * (e.g. Bowditch, The American Practical Navigator, "distance of the horizon"
 * and "geographic range", from memory); exact for the parabolic drop model.
 *
 * With R = 100 km, k = 0, h = 5 m and T = 20 m: D = 1000 m + 2000 m = 3000 m,
 * 120 cells of 25 m.
 */
import { computeHiddenHeightRaster, type HiddenHeightRaster, type SightConditions } from '@/shared/terrain/hidden-height-raster';
import { createTerrainRaster, type TerrainRaster } from '@/shared/terrain/terrain-raster';

export const PLAIN_CONDITIONS: SightConditions = { refractionCoefficient: 0, earthRadius: 100_000 };
export const PLAIN_EYE = 5; // metres
export const PLAIN_TARGET = 20; // metres
export const PLAIN_RANGE = Math.sqrt(2 * 100_000 * PLAIN_EYE) + Math.sqrt(2 * 100_000 * PLAIN_TARGET); // 3000 m
export const PLAIN_CELL = 25; // metres

/** Three posts in a row, 4000 m apart: A–B and B–C circles overlap, A and C do not. */
export const PLAIN_POSTS = [
  { col: 130, row: 130, eyeHeight: PLAIN_EYE },
  { col: 290, row: 130, eyeHeight: PLAIN_EYE },
  { col: 450, row: 130, eyeHeight: PLAIN_EYE },
] as const;

/** A 580 × 260 flat plain at 100 m, 25 m cells (optionally with nodata cells). */
export function flatPlain(nodata: (col: number, row: number) => boolean = () => false): TerrainRaster {
  const width = 580;
  const height = 260;
  const heights = new Float32Array(width * height).fill(100);
  for (let row = 0; row < height; row++) {
    for (let col = 0; col < width; col++) if (nodata(col, row)) heights[row * width + col] = NaN;
  }
  return createTerrainRaster({ heights, width, height, cellSize: PLAIN_CELL, xll: 600_000, yll: 5_800_000 });
}

/** Hidden-height rasters of the three plain posts. */
export function plainHiddenRasters(terrain: TerrainRaster = flatPlain(), conditions = PLAIN_CONDITIONS): HiddenHeightRaster[] {
  return PLAIN_POSTS.map((post) => computeHiddenHeightRaster(terrain, post, conditions));
}

/**
 * Area of the lens where two circles of radius r with centres d apart overlap.
 * Source: circle–circle intersection area, A = 2r²·acos(d/2r) − (d/2)·√(4r² − d²)
 * (plane geometry, e.g. Weisstein, MathWorld "Circle-Circle Intersection", from memory).
 */
export function lensArea(r: number, d: number): number {
  if (d >= 2 * r) return 0;
  return 2 * r * r * Math.acos(d / (2 * r)) - (d / 2) * Math.sqrt(4 * r * r - d * d);
}
