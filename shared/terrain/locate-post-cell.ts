import { TerrainInputError } from '@/shared/terrain/terrain-input-error';
import type { GridSpec } from '@/shared/terrain/grid-spec';

/**
 * Finds the cell that contains the point (x, y):
 * `col = floor((x − xll) / cellSize)`, `row = floor((yTop − y) / cellSize)`
 * with `yTop = yll + height · cellSize` (row 0 at the top). A point on the
 * east or south edge of the grid belongs to the last column or row.
 *
 * Source: ESRI ASCII grid geometry (xllcorner, yllcorner, cellsize) — common
 * practice, no source.
 *
 * @param grid raster geometry (metres)
 * @param x easting, metres
 * @param y northing, metres
 * @returns the cell's column (0 = west) and row (0 = north)
 * @throws TerrainInputError `post-outside-raster` when the point is outside the grid
 * @example
 * locatePostCell({ width: 10, height: 10, cellSize: 25, xll: 0, yll: 0, crs: null }, 30, 240);
 * // → { col: 1, row: 0 }
 */
export function locatePostCell(grid: GridSpec, x: number, y: number): { col: number; row: number } {
  const xEast = grid.xll + grid.width * grid.cellSize;
  const yTop = grid.yll + grid.height * grid.cellSize;
  if (!(x >= grid.xll && x <= xEast && y >= grid.yll && y <= yTop)) {
    throw new TerrainInputError(
      'post-outside-raster',
      `Point (${x}, ${y}) is outside the terrain, which spans x ${grid.xll} … ${xEast} and y ${grid.yll} … ${yTop}.`,
    );
  }
  const col = Math.min(grid.width - 1, Math.floor((x - grid.xll) / grid.cellSize));
  const row = Math.min(grid.height - 1, Math.floor((yTop - y) / grid.cellSize));
  return { col, row };
}
