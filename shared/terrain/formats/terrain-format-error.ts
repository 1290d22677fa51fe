/**
 * Error thrown by the terrain file adapters (ESRI ASCII grid, GeoTIFF) when a
 * file cannot be turned into a terrain raster, or a raster into a file.
 *
 * Codes:
 * - `wrong-type` — not a file of the expected kind (e.g. a PNG given as GeoTIFF)
 * - `corrupt` — the file is of the right kind but malformed
 * - `truncated` — the file ends before all its data
 * - `geographic-crs` — coordinates are in degrees; reproject to UTM first
 * - `oversize` — more cells than {@link MAX_TERRAIN_CELLS}
 * - `unsupported` — valid but outside what Kenning reads (rotated grids, non-square cells, …)
 *
 * @example
 * try { readEsriAsciiGrid(text); }
 * catch (error) { if (error instanceof TerrainFormatError) console.error(error.code, error.message); }
 */
export class TerrainFormatError extends Error {
  /** Stable machine-readable reason. */
  readonly code: TerrainFormatErrorCode;

  constructor(code: TerrainFormatErrorCode, message: string, options?: { cause?: unknown }) {
    super(message, options);
    this.name = 'TerrainFormatError';
    this.code = code;
  }
}

/** Reasons a terrain file can be rejected. */
export type TerrainFormatErrorCode = 'wrong-type' | 'corrupt' | 'truncated' | 'geographic-crs' | 'oversize' | 'unsupported';

/**
 * Largest terrain the adapters accept: 100 million cells (e.g. 10 000 × 10 000,
 * 400 MB of Float32 heights). 4000 × 4000 (16 million) is well inside.
 */
export const MAX_TERRAIN_CELLS = 100_000_000;

/** The advice given with every `geographic-crs` error. */
export const REPROJECT_ADVICE =
  'Kenning needs a projected CRS in metres. Reproject the terrain to UTM first, e.g. ' +
  '`gdalwarp -t_srs EPSG:326xx in.tif out.tif` (xx = UTM zone; 327xx south of the equator).';
