import { fromArrayBuffer } from 'geotiff';
import { MAX_TERRAIN_CELLS, REPROJECT_ADVICE, TerrainFormatError } from '@/shared/terrain/formats/terrain-format-error';
import type { TerrainRaster } from '@/shared/terrain/terrain-raster';

/**
 * Decodes a GeoTIFF (classic or BigTIFF; any compression and sample type the
 * `geotiff` package decodes) into a terrain raster: band 1 of the first image,
 * converted to Float32; cell size and origin from ModelPixelScale /
 * ModelTiepoint (north-up grids only; PixelIsPoint grids are shifted half a
 * cell so the origin is the outer corner, as GDAL does); nodata from the
 * GDAL_NODATA tag; CRS from the GeoKeys (ProjectedCSTypeGeoKey → EPSG code,
 * or null for a user-defined projected CRS).
 *
 * Source: OGC GeoTIFF 1.1 standard (GTModelTypeGeoKey 1 = projected,
 * 2 = geographic; GTRasterTypeGeoKey 1 = PixelIsArea, 2 = PixelIsPoint;
 * ProjectedCSTypeGeoKey 3072); TIFF Revision 6.0 strip/tile fields;
 * GDAL GTiff driver documentation (GDAL_NODATA).
 *
 * @param bytes the whole file
 * @param options `maxCells`: refuse larger grids before decoding them
 *   (default {@link MAX_TERRAIN_CELLS}); `allocate`: makes the heights array
 *   (default `new Float32Array(n)`; e.g. one over a SharedArrayBuffer that
 *   worker threads read without a copy); `file`: when `bytes` is only the
 *   start of the file (its header and tables), the file's length and a way to
 *   read a part of it — plain Float32 pixels are then read straight into the
 *   heights array (no copy of the whole file); any other file is read whole
 *   through `file.read` and decoded as usual
 * @returns a promise of a new terrain raster (heights in the file's units, metres expected)
 * @throws TerrainFormatError (as a rejected promise) `wrong-type` (not a TIFF),
 *   `truncated`, `corrupt`, `geographic-crs` (degrees — reproject to UTM),
 *   `oversize` (more than `maxCells` cells), `unsupported`
 *   (no georeferencing, rotated or non-square or south-up grids)
 * @example
 * const terrain = await readGeoTiff(await fs.promises.readFile('dem.tif').then((b) => b.buffer));
 */
export async function readGeoTiff(bytes: ArrayBuffer, options: GeoTiffReadOptions = {}): Promise<TerrainRaster> {
  const { file, ...wholeFileOptions } = options;
  if (file === undefined || bytes.byteLength >= file.byteLength) return readTiff(bytes, wholeFileOptions, null);
  try {
    return await readTiff(bytes, wholeFileOptions, file);
  } catch (error) {
    // Tables beyond the start (seen as truncated or corrupt) or pixels that need decoding: read it whole,
    // which also reports a real fault. What the tables alone decide (size, CRS, grid) stands.
    const fromTables = error instanceof TerrainFormatError && error.code !== 'truncated' && error.code !== 'corrupt';
    if (fromTables || !(error instanceof NeedsWholeFile || error instanceof TerrainFormatError)) throw error;
  }
  const whole = new Uint8Array(file.byteLength);
  file.read(whole, 0);
  return readTiff(whole.buffer, wholeFileOptions, null);
}

/** Settings of {@link readGeoTiff}. */
export interface GeoTiffReadOptions {
  /** Refuse larger grids before decoding them; default and at most {@link MAX_TERRAIN_CELLS}. */
  readonly maxCells?: number;
  /** Makes the heights array; default `new Float32Array(length)`. */
  readonly allocate?: (length: number) => Float32Array;
  /** The whole file, when `bytes` is only its start. */
  readonly file?: GeoTiffFile;
}

/** Random access to a GeoTIFF file: its length and a read of `target.length` bytes at `position`. */
export interface GeoTiffFile {
  readonly byteLength: number;
  read(target: Uint8Array, position: number): void;
}

/** Thrown inside when only the file's start was given and it is not enough; readGeoTiff then reads the file whole. */
class NeedsWholeFile extends Error {}

async function readTiff(
  bytes: ArrayBuffer,
  options: Omit<GeoTiffReadOptions, 'file'>,
  file: GeoTiffFile | null,
): Promise<TerrainRaster> {
  const fileLength = file ? file.byteLength : bytes.byteLength;
  const allocate = options.allocate ?? ((length: number) => new Float32Array(length));
  const maxCells = Math.min(options.maxCells ?? MAX_TERRAIN_CELLS, MAX_TERRAIN_CELLS);
  if (bytes.byteLength < 8) {
    throw new TerrainFormatError(bytes.byteLength === 0 ? 'truncated' : 'wrong-type', 'The file is too short to be a TIFF.');
  }
  const head = new Uint8Array(bytes, 0, 4);
  const little = head[0] === 0x49 && head[1] === 0x49;
  const big = head[0] === 0x4d && head[1] === 0x4d;
  const magic = little ? (head[2] as number) | ((head[3] as number) << 8) : ((head[2] as number) << 8) | (head[3] as number);
  if (!(little || big) || (magic !== 42 && magic !== 43)) {
    throw new TerrainFormatError('wrong-type', 'Not a TIFF file (it does not start with the TIFF byte-order mark II*/MM*).');
  }

  let image;
  try {
    const tiff = await fromArrayBuffer(bytes);
    image = await tiff.getImage(0);
  } catch (cause) {
    throw new TerrainFormatError(
      isOutOfRange(cause) ? 'truncated' : 'corrupt',
      `The TIFF structure cannot be read: ${message(cause)}`,
      { cause },
    );
  }
  const width = image.getWidth();
  const height = image.getHeight();
  if (!(width >= 1 && height >= 1)) throw new TerrainFormatError('corrupt', `Bad image size ${width} × ${height}.`);
  if (width * height > maxCells) {
    throw new TerrainFormatError(
      'oversize',
      `The GeoTIFF has ${width} × ${height} = ${width * height} cells; Kenning reads at most ${maxCells}. ` +
        'Clip or resample it first (e.g. gdal_translate -srcwin / -tr).',
    );
  }

  const directory = image.getFileDirectory() as Record<string, unknown>;
  const offsets = (directory.StripOffsets ?? directory.TileOffsets) as ArrayLike<number> | undefined;
  const counts = (directory.StripByteCounts ?? directory.TileByteCounts) as ArrayLike<number> | undefined;
  if (!offsets || !counts || offsets.length !== counts.length) {
    throw new TerrainFormatError('corrupt', 'The TIFF has no valid strip or tile table.');
  }
  for (let i = 0; i < offsets.length; i++) {
    if ((offsets[i] as number) + (counts[i] as number) > fileLength) {
      throw new TerrainFormatError(
        'truncated',
        `The file ends at byte ${fileLength} but image data runs to byte ${(offsets[i] as number) + (counts[i] as number)}.`,
      );
    }
  }

  const geoKeys = (image.getGeoKeys() ?? {}) as Record<string, unknown>;
  const modelType = geoKeys.GTModelTypeGeoKey as number | undefined;
  const projected = geoKeys.ProjectedCSTypeGeoKey as number | undefined;
  const geographic = geoKeys.GeographicTypeGeoKey as number | undefined;
  if (modelType === 2 || (modelType === undefined && geographic !== undefined && projected === undefined)) {
    throw new TerrainFormatError(
      'geographic-crs',
      `The GeoTIFF is in a geographic CRS${geographic ? ` (EPSG:${geographic})` : ''}, in degrees. ${REPROJECT_ADVICE}`,
    );
  }
  if (modelType === 3) {
    throw new TerrainFormatError('unsupported', `A geocentric CRS is not a terrain grid. ${REPROJECT_ADVICE}`);
  }

  if (directory.ModelTransformation) {
    const t = directory.ModelTransformation as ArrayLike<number>;
    if (Math.abs(t[1] as number) > 1e-12 || Math.abs(t[4] as number) > 1e-12) {
      throw new TerrainFormatError('unsupported', 'Rotated grids are not supported; warp the terrain to a north-up grid first.');
    }
  }
  let origin: number[];
  let resolution: number[];
  try {
    origin = image.getOrigin();
    resolution = image.getResolution();
  } catch (cause) {
    throw new TerrainFormatError('unsupported', 'The TIFF has no georeferencing (no tie point and pixel scale).', { cause });
  }
  const xRes = resolution[0] as number;
  const yRes = resolution[1] as number;
  if (!(xRes > 0) || !(yRes < 0)) {
    throw new TerrainFormatError('unsupported', `Only north-up grids are supported (pixel size ${xRes}, ${yRes}).`);
  }
  if (Math.abs(xRes + yRes) > 1e-9 * xRes) {
    throw new TerrainFormatError('unsupported', `Cells must be square; this grid has ${xRes} × ${-yRes}.`);
  }
  const cellSize = xRes;
  let left = origin[0] as number;
  let top = origin[1] as number;
  if (geoKeys.GTRasterTypeGeoKey === 2) {
    left -= cellSize / 2;
    top += cellSize / 2;
  }
  const yll = top - height * cellSize;
  if (modelType === undefined && projected === undefined && cellSize < 0.01 && Math.abs(left) <= 360 && Math.abs(top) <= 90) {
    throw new TerrainFormatError(
      'geographic-crs',
      `Pixel size ${cellSize} and origin (${left}, ${top}) look like degrees. ${REPROJECT_ADVICE}`,
    );
  }

  let heights = readPlainFloat32(file ?? bytes, directory, little, width * height, offsets, counts, allocate);
  if (heights === null) {
    if (file) throw new NeedsWholeFile('The pixels need the general decoder.');
    let band: ArrayLike<number>;
    try {
      const rasters = await image.readRasters({ samples: [0] });
      band = (rasters as unknown as ArrayLike<number>[])[0] as ArrayLike<number>;
    } catch (cause) {
      throw new TerrainFormatError(
        isOutOfRange(cause) ? 'truncated' : 'corrupt',
        `Image data cannot be decoded: ${message(cause)}`,
        { cause },
      );
    }
    if (!band || band.length !== width * height) {
      throw new TerrainFormatError('corrupt', 'Decoded image data does not match the image size.');
    }
    if (band instanceof Float32Array && options.allocate === undefined) {
      heights = band;
    } else {
      heights = allocate(band.length);
      heights.set(band);
    }
  }
  const nodataValue = image.getGDALNoData();
  const nodata = nodataValue === null || Number.isNaN(nodataValue) ? null : nodataValue;
  const epsg = projected !== undefined && projected !== 32767 ? projected : null;
  return {
    heights,
    width,
    height,
    cellSize,
    xll: left,
    yll,
    nodata,
    crs: modelType === undefined && projected === undefined ? null : { epsg, wkt: null },
  };
}

function message(cause: unknown): string {
  return cause instanceof Error ? cause.message : String(cause);
}

function isOutOfRange(cause: unknown): boolean {
  return cause instanceof RangeError || /out of bounds|outside the bounds|offset is outside|beyond/i.test(message(cause));
}

/**
 * Fast path for the commonest terrain file — what Kenning and GDAL write by
 * default: one band of uncompressed little-endian Float32 in strips. The strip
 * bytes are copied straight into the result; anything else returns null and
 * goes through the `geotiff` package's general decoder.
 */
function readPlainFloat32(
  bytes: ArrayBuffer | GeoTiffFile,
  directory: Record<string, unknown>,
  little: boolean,
  cells: number,
  offsets: ArrayLike<number>,
  counts: ArrayLike<number>,
  allocate: (length: number) => Float32Array,
): Float32Array | null {
  const first = (value: unknown): unknown =>
    Array.isArray(value) || ArrayBuffer.isView(value) ? (value as unknown as ArrayLike<unknown>)[0] : value;
  const littleHost = new Uint8Array(new Uint16Array([1]).buffer)[0] === 1;
  if (
    !little ||
    !littleHost ||
    directory.TileOffsets !== undefined ||
    (first(directory.Compression) ?? 1) !== 1 ||
    first(directory.BitsPerSample) !== 32 ||
    first(directory.SampleFormat) !== 3 ||
    (first(directory.SamplesPerPixel) ?? 1) !== 1
  ) {
    return null;
  }
  let total = 0;
  for (let i = 0; i < counts.length; i++) total += counts[i] as number;
  if (total !== cells * 4) return null;
  const heights = allocate(cells);
  if (heights.length !== cells) throw new RangeError(`allocate(${cells}) returned ${heights.length} values.`);
  const target = new Uint8Array(heights.buffer, heights.byteOffset, heights.byteLength);
  let at = 0;
  for (let i = 0; i < offsets.length; i++) {
    const count = counts[i] as number;
    if ('read' in bytes) bytes.read(target.subarray(at, at + count), offsets[i] as number);
    else target.set(new Uint8Array(bytes, offsets[i] as number, count), at);
    at += count;
  }
  return heights;
}
