import { TerrainInputError } from '@/shared/terrain/terrain-input-error';
import type { TerrainRaster } from '@/shared/terrain/terrain-raster';

/** A coarser copy of a terrain grid, e.g. for a 3D mesh. Same orientation as the input (row 0 = north). */
export interface DecimatedTerrain {
  /** Columns (west → east) and rows (north → south) of the coarse grid. */
  readonly width: number;
  readonly height: number;
  /** Input cells per coarse cell along each axis (1 = a copy). */
  readonly factor: number;
  /** Side of a coarse cell, metres (`factor × cellSize`). */
  readonly cellSize: number;
  /** Lower-left corner of the coarse grid, metres; its north-west corner is the input's. */
  readonly xll: number;
  readonly yll: number;
  /** Mean ground of each block's cells with data, metres; NaN where a block has none. Row 0 = north. */
  readonly heights: Float32Array;
}

/**
 * Shrinks a terrain grid so that its longer edge has at most `maxEdge` cells:
 * the smallest whole number of cells per coarse cell, `factor =
 * ceil(max(width, height) / maxEdge)`, and each coarse cell the mean of the
 * `factor × factor` block of input cells that have data (nodata — NaN or the
 * grid's `nodata` value — is left out; a block without data is NaN). When
 * the size is not a multiple of the factor, the last column and row of
 * blocks hold fewer cells and the coarse grid reaches past the input's east
 * and south edges by less than one coarse cell; its north-west corner is the
 * input's, so `yll = north − height × cellSize`.
 *
 * Equals GDAL's average resampling (`gdal_translate -r average -outsize`) when
 * the size is a multiple of the factor.
 *
 * Source: box-filter downsampling (common practice, no source); GDAL
 * `gdal_translate -r average` for the reference.
 *
 * @param terrain the grid (heights in metres; not modified)
 * @param maxEdge longest edge of the result, cells (whole number ≥ 2)
 * @returns a new coarse grid
 * @throws TerrainInputError `invalid-option` when maxEdge is not a whole number ≥ 2
 * @example
 * const mesh = decimateTerrain(terrain, 256); // 600 × 600 cells of 25 m → 200 × 200 cells of 75 m
 */
export function decimateTerrain(terrain: TerrainRaster, maxEdge: number): DecimatedTerrain {
  if (!Number.isInteger(maxEdge) || maxEdge < 2) {
    throw new TerrainInputError('invalid-option', `The longest edge must be a whole number of at least 2 cells, got ${maxEdge}.`);
  }
  const { width: W, height: H, heights, nodata, cellSize } = terrain;
  const factor = Math.max(1, Math.ceil(Math.max(W, H) / maxEdge));
  const width = Math.ceil(W / factor);
  const height = Math.ceil(H / factor);
  const out = new Float32Array(width * height);
  const sum = new Float64Array(width);
  const count = new Uint32Array(width);
  for (let py = 0; py < height; py++) {
    sum.fill(0);
    count.fill(0);
    const rowEnd = Math.min(H, (py + 1) * factor);
    for (let r = py * factor; r < rowEnd; r++) {
      const base = r * W;
      for (let px = 0, c0 = 0; px < width; px++, c0 += factor) {
        const c1 = Math.min(W, c0 + factor);
        let s = 0;
        let n = 0;
        for (let c = c0; c < c1; c++) {
          const v = heights[base + c] as number;
          if (v !== v || v === nodata) continue;
          s += v;
          n++;
        }
        sum[px] = (sum[px] as number) + s;
        count[px] = (count[px] as number) + n;
      }
    }
    for (let px = 0; px < width; px++) {
      const n = count[px] as number;
      out[py * width + px] = n === 0 ? Number.NaN : (sum[px] as number) / n;
    }
  }
  const coarse = cellSize * factor;
  const north = terrain.yll + H * cellSize;
  return { width, height, factor, cellSize: coarse, xll: terrain.xll, yll: north - height * coarse, heights: out };
}
