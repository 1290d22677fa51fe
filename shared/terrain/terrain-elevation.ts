import { TerrainInputError } from '@/shared/terrain/terrain-input-error';
import type { TerrainRaster } from '@/shared/terrain/terrain-raster';

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
  const u = Math.min(W - 1, Math.max(0, (x - xll) / cellSize - 0.5));
  const v = Math.min(H - 1, Math.max(0, (yTop - y) / cellSize - 0.5));
  const c = Math.min(Math.floor(u), Math.max(0, W - 2));
  const r = Math.min(Math.floor(v), Math.max(0, H - 2));
  const fx = u - c;
  const fy = v - r;
  const c1 = Math.min(c + 1, W - 1);
  const r1 = Math.min(r + 1, H - 1);
  const marker = terrain.nodata;
  let z = 0;
  const nodes: readonly [number, number, number][] = [
    [c, r, (1 - fx) * (1 - fy)],
    [c1, r, fx * (1 - fy)],
    [c, r1, (1 - fx) * fy],
    [c1, r1, fx * fy],
  ];
  for (const [col, row, weight] of nodes) {
    if (weight === 0) continue;
    const value = terrain.heights[row * W + col] as number;
    if (Number.isNaN(value) || value === marker) return null;
    z += weight * value;
  }
  return z;
}
