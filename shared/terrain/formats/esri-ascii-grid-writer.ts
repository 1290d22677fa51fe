import { wktForEpsg } from '@/shared/terrain/formats/wkt-for-epsg';
import { TerrainFormatError } from '@/shared/terrain/formats/terrain-format-error';
import type { GridSpec } from '@/shared/terrain/grid-spec';

/** Settings of {@link writeEsriAsciiGrid}. */
export interface EsriAsciiWriteOptions {
  /** Value written for NaN cells, also written as `NODATA_value`; default −9999. */
  readonly nodata?: number;
  /** Decimals kept (values are rounded, trailing zeros dropped); default 3 (millimetres). */
  readonly decimals?: number;
}

/**
 * Writes a raster as an ESRI ASCII grid, plus the text of its `.prj` sidecar.
 *
 * The header carries `ncols`, `nrows`, `xllcorner`, `yllcorner`, `cellsize`
 * and `NODATA_value`; rows follow north to south, one line per row. NaN
 * cells are written as `nodata`. The `.prj` text is the grid's WKT when it
 * has one, otherwise WKT1 made from its EPSG code for WGS 84 / UTM zones, else
 * null (the caller should warn that the CRS is not recorded).
 *
 * Source: ESRI ASCII raster format description (ArcGIS documentation).
 *
 * @param grid geometry and CRS of the raster (metres)
 * @param values one value per cell, row 0 = north (not modified)
 * @param options nodata marker (default −9999), decimals (default 3)
 * @returns `asc` (the file's text) and `prj` (sidecar text or null)
 * @throws TerrainFormatError `corrupt` when `values` does not fit the grid
 * @example
 * const { asc } = writeEsriAsciiGrid(
 *   { width: 2, height: 1, cellSize: 25, xll: 500000, yll: 6000000, crs: null },
 *   new Float32Array([0, 12.5]),
 * );
 * // asc ends with "0 12.5\n"
 */
export function writeEsriAsciiGrid(
  grid: GridSpec,
  values: Float32Array,
  options: EsriAsciiWriteOptions = {},
): { asc: string; prj: string | null } {
  const nodata = options.nodata ?? -9999;
  const decimals = options.decimals ?? 3;
  const { width, height } = grid;
  if (values.length !== width * height) {
    throw new TerrainFormatError(
      'corrupt',
      `Expected ${width * height} values for a ${width} × ${height} grid, got ${values.length}.`,
    );
  }
  if (!Number.isInteger(decimals) || decimals < 0 || decimals > 9) {
    throw new TerrainFormatError('unsupported', `Decimals must be an integer 0…9, got ${decimals}.`);
  }
  const scale = 10 ** decimals;
  const nodataText = String(nodata);
  const parts: string[] = [
    `ncols ${width}\nnrows ${height}\nxllcorner ${grid.xll}\nyllcorner ${grid.yll}\n` +
      `cellsize ${grid.cellSize}\nNODATA_value ${nodataText}\n`,
  ];
  const row: string[] = new Array<string>(width);
  for (let r = 0; r < height; r++) {
    const base = r * width;
    for (let c = 0; c < width; c++) {
      const v = values[base + c] as number;
      row[c] = v !== v ? nodataText : String(Math.round(v * scale) / scale);
    }
    parts.push(row.join(' ') + '\n');
  }
  const prj = grid.crs?.wkt ?? (grid.crs?.epsg != null ? wktForEpsg(grid.crs.epsg) : null);
  return { asc: parts.join(''), prj };
}
