import { epsgFromWkt } from '@/shared/terrain/formats/epsg-from-wkt';
import { MAX_TERRAIN_CELLS, REPROJECT_ADVICE, TerrainFormatError } from '@/shared/terrain/formats/terrain-format-error';
import { createTerrainRaster, type TerrainRaster } from '@/shared/terrain/terrain-raster';

const HEADER_KEYS = new Set([
  'ncols',
  'nrows',
  'xllcorner',
  'yllcorner',
  'xllcenter',
  'yllcenter',
  'cellsize',
  'dx',
  'dy',
  'nodata_value',
]);

/**
 * Parses an ESRI ASCII grid (`.asc`) into a terrain raster.
 *
 * Format: a header of `key value` lines — `ncols`, `nrows`,
 * `xllcorner`|`xllcenter`, `yllcorner`|`yllcenter`, `cellsize` (or equal `dx`
 * and `dy`), optional `NODATA_value` — then `nrows` rows of `ncols` numbers,
 * the first row being the northernmost. Keys are case-insensitive; values may
 * be separated by any whitespace; `nan` reads as NaN. `xllcenter` /
 * `yllcenter` are converted to corners (minus half a cell).
 *
 * CRS: pass the text of the sidecar `.prj` file if there is one; its EPSG
 * code is read when present. A geographic CRS (degrees) is rejected, and so is
 * a grid without `.prj` whose cell size and origin look like degrees
 * (cell size < 0.01 and origin within ±180°, ±90°).
 *
 * Source: ESRI ASCII raster format description (ArcGIS documentation, "Esri
 * ASCII raster format"); GDAL AAIGrid driver documentation for `dx`/`dy`.
 *
 * @param text the whole `.asc` file
 * @param prjText the `.prj` file's text, or null/undefined when absent
 * @param options `maxCells`: refuse larger grids before reading their values
 *   (default {@link MAX_TERRAIN_CELLS})
 * @returns a new terrain raster, heights in the file's units (metres expected)
 * @throws TerrainFormatError `wrong-type`, `corrupt`, `truncated`,
 *   `geographic-crs`, `oversize` (more than `maxCells` cells),
 *   `unsupported` (dx ≠ dy)
 * @example
 * const terrain = readEsriAsciiGrid(
 *   'ncols 2\nnrows 1\nxllcorner 500000\nyllcorner 6000000\ncellsize 25\n101.5 102\n',
 * );
 * terrain.heights; // Float32Array [101.5, 102]
 */
export function readEsriAsciiGrid(text: string, prjText?: string | null, options: { maxCells?: number } = {}): TerrainRaster {
  const maxCells = Math.min(options.maxCells ?? MAX_TERRAIN_CELLS, MAX_TERRAIN_CELLS);
  if (text.length === 0) throw new TerrainFormatError('truncated', 'The ASCII grid is empty.');
  if (/^(II\*\0|MM\0\*|\x89PNG|PK)/.test(text) || text.slice(0, 512).includes('\0')) {
    throw new TerrainFormatError(
      'wrong-type',
      'This is a binary file, not an ESRI ASCII grid (a GeoTIFF needs the .tif reader).',
    );
  }
  const header = new Map<string, number>();
  let pos = 0;
  const n = text.length;
  // Header: alternate key and value tokens while the next token is a known key.
  for (;;) {
    pos = skipSpace(text, pos);
    const start = pos;
    while (pos < n && !isSpace(text.charCodeAt(pos))) pos++;
    const token = text.slice(start, pos);
    const key = token.toLowerCase();
    if (!HEADER_KEYS.has(key)) {
      if (header.size === 0) {
        throw new TerrainFormatError(
          'wrong-type',
          `Not an ESRI ASCII grid: it should start with "ncols <n>", found "${token.slice(0, 40)}".`,
        );
      }
      pos = start;
      break;
    }
    pos = skipSpace(text, pos);
    const vStart = pos;
    while (pos < n && !isSpace(text.charCodeAt(pos))) pos++;
    const value = Number(text.slice(vStart, pos));
    if (vStart === pos || Number.isNaN(value)) {
      if (vStart === pos) throw new TerrainFormatError('truncated', `The header ends after "${token}".`);
      if (key !== 'nodata_value') {
        throw new TerrainFormatError('corrupt', `Header value of "${token}" is not a number: "${text.slice(vStart, pos)}".`);
      }
    }
    if (header.has(key)) throw new TerrainFormatError('corrupt', `Header key "${token}" appears twice.`);
    header.set(key, value);
  }

  const width = header.get('ncols');
  const height = header.get('nrows');
  if (width === undefined || height === undefined) {
    throw new TerrainFormatError('corrupt', 'The header needs both ncols and nrows.');
  }
  if (!Number.isInteger(width) || !Number.isInteger(height) || width < 1 || height < 1) {
    throw new TerrainFormatError('corrupt', `ncols and nrows must be positive integers, got ${width} × ${height}.`);
  }
  if (width * height > maxCells) {
    throw new TerrainFormatError(
      'oversize',
      `The grid has ${width} × ${height} = ${width * height} cells; Kenning reads at most ${maxCells}. ` +
        'Clip or resample it first (e.g. gdal_translate -srcwin / -tr).',
    );
  }
  let cellSize = header.get('cellsize');
  const dx = header.get('dx');
  const dy = header.get('dy');
  if (cellSize === undefined && dx !== undefined && dy !== undefined) {
    if (Math.abs(dx - dy) > 1e-9 * Math.abs(dx)) {
      throw new TerrainFormatError('unsupported', `Cells must be square; this grid has dx ${dx} and dy ${dy}.`);
    }
    cellSize = dx;
  }
  if (cellSize === undefined || !(cellSize > 0) || !Number.isFinite(cellSize)) {
    throw new TerrainFormatError('corrupt', `The header needs a positive cellsize, got ${cellSize}.`);
  }
  const xCorner = header.get('xllcorner');
  const yCorner = header.get('yllcorner');
  const xCenter = header.get('xllcenter');
  const yCenter = header.get('yllcenter');
  const xll = xCorner ?? (xCenter === undefined ? undefined : xCenter - cellSize / 2);
  const yll = yCorner ?? (yCenter === undefined ? undefined : yCenter - cellSize / 2);
  if (xll === undefined || yll === undefined || !Number.isFinite(xll) || !Number.isFinite(yll)) {
    throw new TerrainFormatError('corrupt', 'The header needs xllcorner (or xllcenter) and yllcorner (or yllcenter).');
  }
  const nodataRaw = header.get('nodata_value');
  const nodata = nodataRaw === undefined || Number.isNaN(nodataRaw) ? null : nodataRaw;

  const prj = prjText?.trim() ? prjText.trim() : null;
  if (prj !== null && /^GEOG(CS|CRS)\b/i.test(prj)) {
    throw new TerrainFormatError('geographic-crs', `The .prj describes a geographic CRS in degrees. ${REPROJECT_ADVICE}`);
  }
  if (prj === null && cellSize < 0.01 && Math.abs(xll) <= 360 && Math.abs(yll) <= 90) {
    throw new TerrainFormatError(
      'geographic-crs',
      `Cell size ${cellSize} and origin (${xll}, ${yll}) look like degrees. ${REPROJECT_ADVICE}`,
    );
  }

  const count = width * height;
  const heights = new Float32Array(count);
  let filled = 0;
  while (filled < count) {
    pos = skipSpace(text, pos);
    if (pos >= n) break;
    const parsed = parseNumberAt(text, pos);
    if (parsed.end === pos || (parsed.end < n && !isSpace(text.charCodeAt(parsed.end)))) {
      const row = Math.floor(filled / width);
      const col = filled % width;
      let end = pos;
      while (end < n && !isSpace(text.charCodeAt(end))) end++;
      throw new TerrainFormatError(
        'corrupt',
        `Value at row ${row}, column ${col} is not a number: "${text.slice(pos, Math.min(end, pos + 40))}".`,
      );
    }
    heights[filled++] = parsed.value;
    pos = parsed.end;
  }
  if (filled < count) {
    throw new TerrainFormatError(
      'truncated',
      `The grid stops after ${filled} of ${count} values (row ${Math.floor(filled / width)} of ${height}).`,
    );
  }
  if (skipSpace(text, pos) < n) {
    throw new TerrainFormatError('corrupt', `The grid has more than ncols × nrows = ${count} values.`);
  }
  // Every check createTerrainRaster makes has passed above (with the format's own errors).
  const crs = prj === null ? null : { epsg: epsgFromWkt(prj), wkt: prj };
  return createTerrainRaster({ heights, width, height, cellSize, xll, yll, nodata, crs });
}

function isSpace(c: number): boolean {
  return c === 32 || c === 10 || c === 13 || c === 9 || c === 12 || c === 11;
}

function skipSpace(text: string, from: number): number {
  let p = from;
  const n = text.length;
  while (p < n && isSpace(text.charCodeAt(p))) p++;
  return p;
}

/** Parses a decimal number (with optional sign, fraction, exponent, or nan/inf) starting at `start`. */
function parseNumberAt(text: string, start: number): { value: number; end: number } {
  const n = text.length;
  let p = start;
  let negative = false;
  let c = text.charCodeAt(p);
  if (c === 45 || c === 43) {
    negative = c === 45;
    p++;
    c = text.charCodeAt(p);
  }
  let mantissa = 0;
  let digits = 0;
  while (c >= 48 && c <= 57) {
    mantissa = mantissa * 10 + (c - 48);
    digits++;
    p++;
    c = text.charCodeAt(p);
  }
  let scale = 0;
  if (c === 46) {
    p++;
    c = text.charCodeAt(p);
    while (c >= 48 && c <= 57) {
      mantissa = mantissa * 10 + (c - 48);
      digits++;
      scale--;
      p++;
      c = text.charCodeAt(p);
    }
  }
  if (digits === 0) {
    // nan, inf, infinity (any case)
    let end = p;
    while (end < n && !isSpace(text.charCodeAt(end))) end++;
    const word = text.slice(p, end).toLowerCase();
    if (word === 'nan') return { value: NaN, end };
    if (word === 'inf' || word === 'infinity') return { value: negative ? -Infinity : Infinity, end };
    return { value: NaN, end: start };
  }
  if (c === 101 || c === 69 || digits > 15) {
    // Exponent or too many digits for exact integer accumulation: let the engine parse it.
    let end = p;
    while (end < n && !isSpace(text.charCodeAt(end))) end++;
    const value = Number(text.slice(start, end));
    return Number.isNaN(value) ? { value, end: start } : { value, end };
  }
  const value = scale === 0 ? mantissa : mantissa / (POW10[-scale] as number);
  return { value: negative ? -value : value, end: p };
}

const POW10 = [1, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11, 1e12, 1e13, 1e14, 1e15, 1e16];
