import { BASE64_ALPHABET, CLASS_RASTER_ENCODING, type EncodedClassRaster } from '@/shared/terrain/encoded-class-raster';
import { MAX_TERRAIN_CELLS } from '@/shared/terrain/formats/terrain-format-error';
import { TerrainInputError } from '@/shared/terrain/terrain-input-error';

/**
 * Unpacks a class raster made by `encodeClassRaster` (format
 * {@link CLASS_RASTER_ENCODING}, see {@link EncodedClassRaster}): base64 →
 * run bytes → one byte per cell, row-major, row 0 = north. Pure and
 * isomorphic (runs in the browser; no Node `Buffer`, no `atob`).
 *
 * Source: base64 (RFC 4648, section 4); unsigned LEB128 (DWARF 4, section
 * 7.6); run-length encoding — common practice, no source.
 *
 * @param encoded the packed raster (not modified)
 * @returns a new Uint8Array of `width × height` values
 * @throws TerrainInputError `invalid-encoding` for another format, a bad size,
 *   characters outside the base64 alphabet, misplaced padding, a zero or
 *   overlong run, or runs that do not add up to `width × height`
 * @example
 * const layer = decodeClassRaster(await response.json());
 * layer[row * width + col]; // the coverage-layer code of one cell
 */
export function decodeClassRaster(encoded: EncodedClassRaster): Uint8Array {
  if (encoded?.format !== CLASS_RASTER_ENCODING) {
    throw new TerrainInputError(
      'invalid-encoding',
      `Unknown raster encoding ${String(encoded?.format)}; expected ${CLASS_RASTER_ENCODING}.`,
      'format',
    );
  }
  const { width, height, data } = encoded;
  if (!Number.isInteger(width) || width < 1 || !Number.isInteger(height) || height < 1 || width * height > MAX_TERRAIN_CELLS) {
    throw new TerrainInputError('invalid-encoding', `Bad raster size ${width} × ${height}.`, 'width');
  }
  if (typeof data !== 'string') throw new TerrainInputError('invalid-encoding', 'The data must be a base64 string.', 'data');
  const bytes = fromBase64(data);
  const n = width * height;
  const values = new Uint8Array(n);
  let filled = 0;
  let k = 0;
  while (k < bytes.length) {
    const value = bytes[k++] as number;
    let run = 0;
    let scale = 1;
    for (;;) {
      if (k >= bytes.length) throw new TerrainInputError('invalid-encoding', 'The data ends inside a run length.', 'data');
      const b = bytes[k++] as number;
      run += (b & 0x7f) * scale;
      if (b < 0x80) break;
      scale *= 128;
      if (scale > 2 ** 35) throw new TerrainInputError('invalid-encoding', 'A run length is too long.', 'data');
    }
    if (run === 0) throw new TerrainInputError('invalid-encoding', 'A run of length 0.', 'data');
    if (filled + run > n) {
      throw new TerrainInputError('invalid-encoding', `The runs cover more than the ${width} × ${height} cells.`, 'data');
    }
    values.fill(value, filled, filled + run);
    filled += run;
  }
  if (filled !== n) {
    throw new TerrainInputError(
      'invalid-encoding',
      `The runs cover ${filled} cells; the ${width} × ${height} grid has ${n}.`,
      'data',
    );
  }
  return values;
}

const LOOKUP = (() => {
  const table = new Int16Array(128).fill(-1);
  for (let i = 0; i < 64; i++) table[BASE64_ALPHABET.charCodeAt(i)] = i;
  return table;
})();

function fromBase64(text: string): Uint8Array {
  if (text.length % 4 !== 0) {
    throw new TerrainInputError('invalid-encoding', 'Base64 text must come in groups of four characters.', 'data');
  }
  let padding = 0;
  if (text.endsWith('==')) padding = 2;
  else if (text.endsWith('=')) padding = 1;
  const bytes = new Uint8Array((text.length / 4) * 3 - padding);
  let o = 0;
  for (let i = 0; i < text.length; i += 4) {
    const last = i + 4 === text.length;
    let group = 0;
    for (let j = 0; j < 4; j++) {
      const code = text.charCodeAt(i + j);
      let sextet = code < 128 ? (LOOKUP[code] as number) : -1;
      if (sextet < 0) {
        if (code === 61 && last && j >= 4 - padding) sextet = 0;
        else throw new TerrainInputError('invalid-encoding', `Character ${i + j} is not base64.`, 'data');
      }
      group = (group << 6) | sextet;
    }
    bytes[o++] = group >>> 16;
    if (o < bytes.length) bytes[o++] = (group >>> 8) & 0xff;
    if (o < bytes.length) bytes[o++] = group & 0xff;
  }
  return bytes;
}
