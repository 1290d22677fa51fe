import { TerrainInputError } from '@/shared/terrain/terrain-input-error';
import type { GridSpec } from '@/shared/terrain/grid-spec';

/**
 * Checks that `grid` is a usable raster geometry (positive integer size,
 * positive finite cell size, finite origin) and that `values` is a typed
 * array of the given kind holding one value per cell of it. Shared by the
 * coverage modules, which take plain typed-array layers (masks, class and
 * count rasters) laid out like every Kenning raster: row-major, row 0 = north
 * (see {@link GridSpec}).
 *
 * Source: none needed (input checking).
 *
 * @param grid the raster geometry the layer must fit
 * @param values the layer
 * @param kind `Uint8Array` or `Float32Array`
 * @param field dot-joined name of the input, for the error (`siteMask`, `zones.2.mask`)
 * @throws TerrainInputError `invalid-raster` for a bad grid, `invalid-layer` for
 *   a layer of another type or length
 * @example
 * checkLayer(grid, siteMask, 'Uint8Array', 'siteMask'); // returns nothing, or throws
 */
export function checkLayer(grid: GridSpec, values: unknown, kind: 'Uint8Array' | 'Float32Array', field: string): void {
  const { width, height, cellSize, xll, yll } = grid;
  if (!Number.isInteger(width) || width < 1 || !Number.isInteger(height) || height < 1) {
    throw new TerrainInputError('invalid-raster', `Raster size must be positive integers, got ${width} × ${height}.`, field);
  }
  if (!(cellSize > 0) || !Number.isFinite(cellSize) || !Number.isFinite(xll) || !Number.isFinite(yll)) {
    throw new TerrainInputError('invalid-raster', `Raster cell size must be positive and its origin finite.`, field);
  }
  const type = kind === 'Uint8Array' ? Uint8Array : Float32Array;
  if (!(values instanceof type)) {
    throw new TerrainInputError('invalid-layer', `${field} must be a ${kind} with one value per cell.`, field);
  }
  if (values.length !== width * height) {
    throw new TerrainInputError(
      'invalid-layer',
      `${field} has ${values.length} values; the ${width} × ${height} grid needs ${width * height}.`,
      field,
    );
  }
}
