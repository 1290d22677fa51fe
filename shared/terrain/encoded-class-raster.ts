import type { GridSpec } from '@/shared/terrain/grid-spec';

/** Name and version of the transport encoding of {@link EncodedClassRaster}. */
export const CLASS_RASTER_ENCODING = 'kenning-rle8/1';

/**
 * A Uint8 class raster (coverage layer, cross-bearing classes, change codes,
 * visibility classes) packed for the map client. Grid fields as in
 * `GridSpec` (row 0 = north; cell size and origin in metres of the CRS
 * with EPSG code `epsg`).
 *
 * `data` format ({@link CLASS_RASTER_ENCODING}): the cells in row-major order
 * (row 0 = north, west to east) as runs of equal values; each run is one
 * byte with the value followed by the run length (≥ 1) as an unsigned LEB128
 * number (7 bits per byte, least significant group first, high bit set on
 * every byte but the last). Runs may cross row ends; their lengths add up to
 * `width × height`. The bytes are then written as base64 (RFC 4648 §4,
 * standard alphabet, `=` padding).
 */
export interface EncodedClassRaster extends Omit<GridSpec, 'crs'> {
  readonly format: typeof CLASS_RASTER_ENCODING;
  /** EPSG code of the grid's CRS, or null when unknown. */
  readonly epsg: number | null;
  /** Run-length bytes as base64. */
  readonly data: string;
}

/** RFC 4648 §4 base64 alphabet. */
export const BASE64_ALPHABET = 'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789+/';
