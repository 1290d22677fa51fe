import { checkLayer } from '@/shared/terrain/check-layer';
import { BASE64_ALPHABET, CLASS_RASTER_ENCODING, type EncodedClassRaster } from '@/shared/terrain/encoded-class-raster';
import type { GridSpec } from '@/shared/terrain/grid-spec';

/**
 * Packs a Uint8 class raster for the map client: run-length bytes (value,
 * LEB128 run length) written as base64 — see {@link EncodedClassRaster} for
 * the exact format; `decodeClassRaster` reverses it. Class layers are mostly
 * long runs of one code, so a 2000 × 2000 coverage layer of a few megabytes
 * usually packs into tens to hundreds of kilobytes before compression of the
 * HTTP response. Pure and isomorphic: no Node `Buffer`, no `btoa`.
 *
 * Source: run-length encoding (common practice, no source); unsigned LEB128
 * (DWARF Debugging Information Format, version 4, section 7.6); base64
 * (RFC 4648, section 4).
 *
 * @param grid the raster's geometry (size; cell size and origin in metres; CRS)
 * @param values one byte per cell, row-major, row 0 = north (not modified)
 * @returns the encoded raster (plain data, JSON-safe)
 * @throws TerrainInputError `invalid-raster`, `invalid-layer` (field `values`)
 * @example
 * const packed = encodeClassRaster(counts, counts.layer);
 * JSON.stringify(packed); // { format: 'kenning-rle8/1', width: 600, height: 600, …, data: 'AYDU…' }
 */
export function encodeClassRaster(grid: GridSpec, values: Uint8Array): EncodedClassRaster {
  checkLayer(grid, values, 'Uint8Array', 'values');
  const n = values.length;
  // One pass, into room for the worst case: a run of length L takes 1 + ⌈log₁₂₈(L + 1)⌉ ≤ 2L
  // bytes, so all runs together take at most 2n (the bytes written are the same as before,
  // when a first pass measured them).
  const room = new Uint8Array(Math.max(2 * n, 2));
  let k = 0;
  for (let i = 0; i < n;) {
    const v = values[i] as number;
    let j = i + 1;
    while (j < n && values[j] === v) j++;
    room[k++] = v;
    let run = j - i;
    while (run >= 0x80) {
      room[k++] = (run & 0x7f) | 0x80;
      run = Math.floor(run / 128);
    }
    room[k++] = run;
    i = j;
  }
  const bytes = room.subarray(0, k);
  return {
    format: CLASS_RASTER_ENCODING,
    width: grid.width,
    height: grid.height,
    cellSize: grid.cellSize,
    xll: grid.xll,
    yll: grid.yll,
    epsg: grid.crs?.epsg ?? null,
    data: toBase64(bytes),
  };
}

function toBase64(bytes: Uint8Array): string {
  const codes = new Uint8Array(Math.ceil(bytes.length / 3) * 4);
  const alphabet = new Uint8Array(64);
  for (let i = 0; i < 64; i++) alphabet[i] = BASE64_ALPHABET.charCodeAt(i);
  let o = 0;
  let i = 0;
  for (; i + 2 < bytes.length; i += 3) {
    const triple = ((bytes[i] as number) << 16) | ((bytes[i + 1] as number) << 8) | (bytes[i + 2] as number);
    codes[o++] = alphabet[triple >>> 18] as number;
    codes[o++] = alphabet[(triple >>> 12) & 63] as number;
    codes[o++] = alphabet[(triple >>> 6) & 63] as number;
    codes[o++] = alphabet[triple & 63] as number;
  }
  const rest = bytes.length - i;
  if (rest > 0) {
    const b0 = bytes[i] as number;
    const b1 = rest === 2 ? (bytes[i + 1] as number) : 0;
    codes[o++] = alphabet[b0 >>> 2] as number;
    codes[o++] = alphabet[((b0 & 3) << 4) | (b1 >>> 4)] as number;
    codes[o++] = rest === 2 ? (alphabet[(b1 & 15) << 2] as number) : 61; // '='
    codes[o++] = 61;
  }
  let text = '';
  const CHUNK = 0x8000;
  for (let c = 0; c < codes.length; c += CHUNK) {
    text += String.fromCharCode.apply(null, codes.subarray(c, c + CHUNK) as unknown as number[]);
  }
  return text;
}
