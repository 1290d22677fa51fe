/**
 * Helpers for the network-coverage tests: a seeded random generator and
 * class rasters built from simple rules.
 */
import type { GridSpec as RasterGrid } from '@/shared/terrain/grid-spec';
import { seededRandom as seededStream } from '@/shared/trainer/seeded-random';

/** Deterministic pseudo-random numbers in [0, 1) (mulberry32, public domain): the core's seeded stream. */
export function seededRandom(seed: number): () => number {
  return seededStream(seed).next;
}

/** A grid without a CRS. */
export function gridOf(width: number, height: number, cellSize = 25, xll = 0, yll = 0): RasterGrid {
  return { width, height, cellSize, xll, yll, crs: null };
}

/** A class raster from a rule per cell (col, row) → VISIBILITY_CLASS code. */
export function classesFrom(grid: RasterGrid, rule: (col: number, row: number) => number): Uint8Array {
  const classes = new Uint8Array(grid.width * grid.height);
  for (let row = 0; row < grid.height; row++) {
    for (let col = 0; col < grid.width; col++) classes[row * grid.width + col] = rule(col, row);
  }
  return classes;
}

/** Number of positions where two arrays of the same length differ (NaN equals NaN); fast on big rasters. */
export function mismatches(a: ArrayLike<number>, b: ArrayLike<number>): number {
  if (a.length !== b.length) return Math.max(a.length, b.length);
  let n = 0;
  for (let i = 0; i < a.length; i++) {
    const x = a[i] as number;
    const y = b[i] as number;
    if (x !== y && !(x !== x && y !== y)) n++;
  }
  return n;
}
