import { TerrainInputError } from '@/shared/terrain/terrain-input-error';
import type { TerrainRaster } from '@/shared/terrain/terrain-raster';
import { bilinearSample } from '@/shared/terrain/bilinear-sample';

/**
 * Ground elevation at a point of the terrain, by bilinear interpolation of the
 * four cell-centre heights around it — the same surface the viewshed engine
 * and the terrain profile see between cell centres.
 *
 * The point's grid position is `u = (x − xll)/cellSize − ½` (columns) and
 * `v = (yTop − y)/cellSize − ½` (rows, 0 = north), so integer (u, v) are cell
 * centres. In the outer half cell along the grid's edge (between the last
 * centre and the edge) the position is clamped to the last centre line, i.e.
 * the surface is extended flat outwards.
 *
 * Source: bilinear interpolation on a regular grid (common practice, no
 * source); cell-centre convention of the ESRI ASCII grid (xllcorner,
 * cellsize).
 *
 * @param terrain ground heights, metres (not modified)
 * @param x easting in the terrain's CRS, metres
 * @param y northing in the terrain's CRS, metres
 * @returns elevation, metres, or null when a cell the point depends on is
 *   nodata (NaN or the nodata marker)
 * @throws TerrainInputError `point-outside-raster` when (x, y) is outside the grid
 * @example
 * // 2 × 1 grid of 25 m cells at 100 m and 110 m: halfway between the centres
 * elevationAt(terrain, terrain.xll + 25, terrain.yll + 12.5); // 105
 */
export function elevationAt(terrain: TerrainRaster, x: number, y: number): number | null {
  const { width: W, height: H, cellSize, xll, yll } = terrain;
  const yTop = yll + H * cellSize;
  if (!(x >= xll && x <= xll + W * cellSize && y >= yll && y <= yTop)) {
    throw new TerrainInputError(
      'point-outside-raster',
      `Point (${x.toFixed(1)}, ${y.toFixed(1)}) is outside the terrain, which spans x ${xll} … ${xll + W * cellSize} and y ${yll} … ${yTop}.`,
    );
  }
  const u = (x - xll) / cellSize - 0.5;
  const v = (yTop - y) / cellSize - 0.5;
  const z = bilinearSample(terrain.heights, W, H, terrain.nodata, u, v);
  return Number.isNaN(z) ? null : z;
}
