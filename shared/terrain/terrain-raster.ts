import type { GridSpec, TerrainCrs } from '@/shared/terrain/grid-spec';
import { TerrainInputError } from '@/shared/terrain/terrain-input-error';

/**
 * A digital elevation model: ground heights in metres above the vertical
 * datum, one per cell (see {@link GridSpec} for orientation).
 * A cell is nodata when its value is NaN or equals `nodata`.
 */
export interface TerrainRaster extends GridSpec {
  /** Ground heights, metres, `width * height` values, row 0 = north. */
  readonly heights: Float32Array;
  /** Marker value for cells without data, or null when only NaN marks them. */
  readonly nodata: number | null;
}

/** Fields accepted by {@link createTerrainRaster}. */
export interface TerrainRasterInit {
  readonly heights: Float32Array;
  readonly width: number;
  readonly height: number;
  readonly cellSize: number;
  readonly xll?: number;
  readonly yll?: number;
  readonly nodata?: number | null;
  readonly crs?: TerrainCrs | null;
}

/**
 * Checks the fields of a terrain raster and returns them as a
 * {@link TerrainRaster}. The heights array is used as is (not copied, never
 * modified).
 *
 * Defaults: `xll = 0`, `yll = 0`, `nodata = null`, `crs = null`.
 *
 * Source: grid layout of the ESRI ASCII raster format (ncols, nrows,
 * xllcorner, yllcorner, cellsize, NODATA_value), rows stored north to south.
 *
 * @throws TerrainInputError `invalid-raster` when a size is not a positive
 *   integer, the cell size is not a positive finite number, or the array
 *   length is not `width * height`.
 * @example
 * const terrain = createTerrainRaster({
 *   heights: new Float32Array([100, 101, 102, 103]),
 *   width: 2, height: 2, cellSize: 25, xll: 500000, yll: 6000000,
 * });
 * terrain.heights[0]; // 100 m, the north-west cell
 */
export function createTerrainRaster(init: TerrainRasterInit): TerrainRaster {
  const { heights, width, height, cellSize } = init;
  const xll = init.xll ?? 0;
  const yll = init.yll ?? 0;
  if (!Number.isInteger(width) || width < 1 || !Number.isInteger(height) || height < 1) {
    throw new TerrainInputError('invalid-raster', `Raster size must be positive integers, got ${width} × ${height}.`);
  }
  if (!(cellSize > 0) || !Number.isFinite(cellSize)) {
    throw new TerrainInputError('invalid-raster', `Cell size must be a positive number of metres, got ${cellSize}.`);
  }
  if (!Number.isFinite(xll) || !Number.isFinite(yll)) {
    throw new TerrainInputError('invalid-raster', `Raster origin must be finite, got (${xll}, ${yll}).`);
  }
  if (!(heights instanceof Float32Array) || heights.length !== width * height) {
    throw new TerrainInputError(
      'invalid-raster',
      `Heights must be a Float32Array of ${width} × ${height} = ${width * height} values.`,
    );
  }
  return {
    heights,
    width,
    height,
    cellSize,
    xll,
    yll,
    nodata: init.nodata ?? null,
    crs: init.crs ?? null,
  };
}
