import { TerrainFormatError } from '@/shared/terrain/formats/terrain-format-error';
import type { GridSpec } from '@/shared/terrain/grid-spec';

/** Settings of {@link writeGeoTiff}. */
export interface GeoTiffWriteOptions {
  /** Nodata value recorded in the GDAL_NODATA tag (NaN cells stay NaN); default NaN; null = no tag. */
  readonly nodata?: number | null;
}

// TIFF field types
const SHORT = 3;
const LONG = 4;
const ASCII = 2;
const DOUBLE = 12;

interface Entry {
  tag: number;
  type: number;
  values: number[] | string;
}

/**
 * Encodes a raster as a single-band, uncompressed, little-endian Float32
 * GeoTIFF (classic TIFF, stripped), georeferenced like the grid: pixel
 * scale = cell size, tie point at the north-west corner, raster type
 * PixelIsArea, and — when the grid's CRS has an EPSG code — a projected CRS
 * key with that code (GTModelType 1, ProjectedCSTypeGeoKey). NaN cells are
 * written as NaN and the GDAL_NODATA tag says "nan" unless another nodata is
 * given. (The `geotiff` package's own writer only writes 8-bit samples, hence
 * this encoder.)
 *
 * Source: TIFF Revision 6.0 (Adobe, 1992) baseline fields and SampleFormat;
 * OGC GeoTIFF 1.1 standard (ModelPixelScale, ModelTiepoint, GeoKeyDirectory,
 * GTModelTypeGeoKey 1024, GTRasterTypeGeoKey 1025, ProjectedCSTypeGeoKey 3072);
 * GDAL GTiff driver documentation for the GDAL_NODATA tag (42113).
 *
 * @param grid geometry and CRS of the raster (metres)
 * @param values one value per cell, row 0 = north (not modified)
 * @param options nodata tag (default NaN)
 * @returns the file's bytes
 * @throws TerrainFormatError `corrupt` when `values` does not fit the grid,
 *   `oversize` beyond the 4 GiB classic-TIFF limit
 * @example
 * const bytes = writeGeoTiff(hidden, hidden.hidden); // Float32 GeoTIFF of hidden heights
 */
export function writeGeoTiff(grid: GridSpec, values: Float32Array, options: GeoTiffWriteOptions = {}): ArrayBuffer {
  const { head, data } = geoTiffParts(grid, values, options);
  const buffer = new ArrayBuffer(head.byteLength + data.byteLength);
  const bytes = new Uint8Array(buffer);
  bytes.set(head);
  bytes.set(data, head.byteLength);
  return buffer;
}

/**
 * The file {@link writeGeoTiff} makes, as two parts to be written one after
 * the other: the header (TIFF header, directory and georeferencing, padded to
 * where the pixels start) and the pixels. On a little-endian machine the
 * pixels are a view on `values` itself, so a large raster is written to disk
 * without being copied (the command line does this).
 *
 * @param grid geometry and CRS of the raster (metres)
 * @param values one value per cell, row 0 = north (not modified)
 * @param options nodata tag (default NaN)
 * @returns `head` (a new array) and `data` (a view on `values`, or a
 *   little-endian copy on a big-endian machine)
 * @throws TerrainFormatError as `writeGeoTiff`
 * @example
 * const { head, data } = geoTiffParts(hidden, hidden.hidden);
 * fs.writeSync(fd, head);
 * fs.writeSync(fd, data);
 */
export function geoTiffParts(
  grid: GridSpec,
  values: Float32Array,
  options: GeoTiffWriteOptions = {},
): { head: Uint8Array; data: Uint8Array } {
  const { width, height, cellSize } = grid;
  if (values.length !== width * height) {
    throw new TerrainFormatError(
      'corrupt',
      `Expected ${width * height} values for a ${width} × ${height} grid, got ${values.length}.`,
    );
  }
  const dataBytes = width * height * 4;
  if (dataBytes > 0xffffffff - 1_000_000) {
    throw new TerrainFormatError('oversize', 'A classic TIFF holds at most 4 GiB; this raster is larger.');
  }
  const rowsPerStrip = Math.max(1, Math.min(height, Math.floor(262_144 / (width * 4))));
  const strips = Math.ceil(height / rowsPerStrip);
  const stripBytes: number[] = [];
  for (let s = 0; s < strips; s++) {
    stripBytes.push(Math.min(rowsPerStrip, height - s * rowsPerStrip) * width * 4);
  }
  const epsg = grid.crs?.epsg ?? null;
  const geoKeys: number[] = [1024, 0, 1, 1, 1025, 0, 1, 1];
  if (epsg !== null) geoKeys.push(3072, 0, 1, epsg);
  const nodata = options.nodata === undefined ? NaN : options.nodata;

  const entries: Entry[] = [
    { tag: 256, type: LONG, values: [width] },
    { tag: 257, type: LONG, values: [height] },
    { tag: 258, type: SHORT, values: [32] },
    { tag: 259, type: SHORT, values: [1] },
    { tag: 262, type: SHORT, values: [1] },
    { tag: 273, type: LONG, values: new Array<number>(strips).fill(0) },
    { tag: 277, type: SHORT, values: [1] },
    { tag: 278, type: LONG, values: [rowsPerStrip] },
    { tag: 279, type: LONG, values: stripBytes },
    { tag: 284, type: SHORT, values: [1] },
    { tag: 339, type: SHORT, values: [3] },
    { tag: 33550, type: DOUBLE, values: [cellSize, cellSize, 0] },
    { tag: 33922, type: DOUBLE, values: [0, 0, 0, grid.xll, grid.yll + height * cellSize, 0] },
    { tag: 34735, type: SHORT, values: [1, 1, 0, geoKeys.length / 4, ...geoKeys] },
  ];
  if (nodata !== null) {
    entries.push({ tag: 42113, type: ASCII, values: (Number.isNaN(nodata) ? 'nan' : String(nodata)) + '\0' });
  }

  // Layout: header (8) | IFD | out-of-line values | pixel data (4-byte aligned)
  const typeSize = (type: number): number => (type === DOUBLE ? 8 : type === LONG ? 4 : type === SHORT ? 2 : 1);
  const count = (e: Entry): number => e.values.length;
  const ifdSize = 2 + entries.length * 12 + 4;
  let extra = 8 + ifdSize;
  const extraOffsets = new Map<Entry, number>();
  for (const e of entries) {
    const bytes = count(e) * typeSize(e.type);
    if (bytes > 4) {
      extra += extra % 2;
      if (e.type === DOUBLE) extra += (8 - (extra % 8)) % 8;
      extraOffsets.set(e, extra);
      extra += bytes;
    }
  }
  const dataStart = extra + ((8 - (extra % 8)) % 8);
  const stripOffsets = entries.find((e) => e.tag === 273) as Entry;
  let offset = dataStart;
  stripOffsets.values = stripBytes.map((b) => {
    const o = offset;
    offset += b;
    return o;
  });

  const buffer = new ArrayBuffer(dataStart);
  const view = new DataView(buffer);
  view.setUint8(0, 0x49);
  view.setUint8(1, 0x49);
  view.setUint16(2, 42, true);
  view.setUint32(4, 8, true);
  let p = 8;
  view.setUint16(p, entries.length, true);
  p += 2;
  const put = (at: number, type: number, v: number): void => {
    if (type === SHORT) view.setUint16(at, v, true);
    else if (type === LONG) view.setUint32(at, v, true);
    else if (type === DOUBLE) view.setFloat64(at, v, true);
    else view.setUint8(at, v);
  };
  for (const e of entries) {
    view.setUint16(p, e.tag, true);
    view.setUint16(p + 2, e.type, true);
    view.setUint32(p + 4, count(e), true);
    const size = typeSize(e.type);
    const target = extraOffsets.get(e) ?? p + 8;
    if (extraOffsets.has(e)) view.setUint32(p + 8, target, true);
    for (let i = 0; i < count(e); i++) {
      const v = typeof e.values === 'string' ? e.values.charCodeAt(i) : (e.values[i] as number);
      put(target + i * size, e.type, v);
    }
    p += 12;
  }
  view.setUint32(p, 0, true); // no next IFD

  const head = new Uint8Array(buffer);
  const littleEndianHost = new Uint8Array(new Float32Array([1]).buffer)[3] === 0x3f;
  if (littleEndianHost) return { head, data: new Uint8Array(values.buffer, values.byteOffset, dataBytes) };
  const data = new DataView(new ArrayBuffer(dataBytes));
  for (let i = 0; i < values.length; i++) data.setFloat32(i * 4, values[i] as number, true);
  return { head, data: new Uint8Array(data.buffer) };
}
