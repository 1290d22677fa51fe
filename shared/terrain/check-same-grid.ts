import { TerrainInputError } from '@/shared/terrain/terrain-input-error';
import type { GridSpec } from '@/shared/terrain/grid-spec';

/**
 * Checks that two rasters share one grid: the same size, cell size and
 * origin (to a millimetre, so a grid read back from a file still matches).
 * The CRS is not compared: rasters derived from one terrain carry the same
 * object, and a missing CRS must not make a mismatch.
 *
 * Source: none needed (input checking).
 *
 * @param a the reference grid
 * @param b the grid that must match it
 * @param field dot-joined name of `b`, for the error
 * @throws TerrainInputError `grid-mismatch`
 * @example
 * checkSameGrid(before, after, 'after'); // returns nothing, or throws
 */
export function checkSameGrid(a: GridSpec, b: GridSpec, field: string): void {
  const tolerance = 0.001; // metres; common practice, no source
  if (
    a.width !== b.width ||
    a.height !== b.height ||
    Math.abs(a.cellSize - b.cellSize) > 1e-9 * a.cellSize ||
    !(Math.abs(a.xll - b.xll) <= tolerance) ||
    !(Math.abs(a.yll - b.yll) <= tolerance)
  ) {
    throw new TerrainInputError(
      'grid-mismatch',
      `${field} is on another grid (${b.width} × ${b.height} cells of ${b.cellSize} m at ${b.xll}, ${b.yll}; ` +
        `expected ${a.width} × ${a.height} of ${a.cellSize} m at ${a.xll}, ${a.yll}).`,
      field,
    );
  }
}
