import { decodeClassRaster } from '@/shared/terrain/decode-class-raster';
import { encodeClassRaster } from '@/shared/terrain/encode-class-raster';
import { CLASS_RASTER_ENCODING, type EncodedClassRaster } from '@/shared/terrain/encoded-class-raster';
import { gridOf, mismatches, seededRandom } from '@/tests/unit/terrain/coverage-fixtures';

/** The run bytes behind an encoding, read with Node's own base64 decoder (the reference). */
const runBytes = (encoded: EncodedClassRaster) => Array.from(Buffer.from(encoded.data, 'base64'));

describe('encodeClassRaster / decodeClassRaster', () => {
  test('the documented byte layout: value, then LEB128 run length, runs across row ends', () => {
    // 3 × 2 raster, row-major: 7 7 7 | 7 0 2 → runs (7, 4), (0, 1), (2, 1).
    const encoded = encodeClassRaster(gridOf(3, 2), Uint8Array.from([7, 7, 7, 7, 0, 2]));
    expect(runBytes(encoded)).toEqual([7, 4, 0, 1, 2, 1]);
    expect(encoded.format).toBe(CLASS_RASTER_ENCODING);
    expect(encoded.data).toBe(Buffer.from([7, 4, 0, 1, 2, 1]).toString('base64'));
  });

  test('long runs use unsigned LEB128 (the DWARF example 624 485 → E5 8E 26)', () => {
    // Source: DWARF Debugging Information Format v4, section 7.6 / its common worked
    // example, 624485 = 0x98765 → bytes 0xE5 0x8E 0x26 (from memory).
    const width = 624_485;
    const encoded = encodeClassRaster(gridOf(width, 1, 1), new Uint8Array(width).fill(3));
    expect(runBytes(encoded)).toEqual([3, 0xe5, 0x8e, 0x26]);
    expect(runBytes(encodeClassRaster(gridOf(128, 1, 1), new Uint8Array(128)))).toEqual([0, 0x80, 0x01]);
    expect(runBytes(encodeClassRaster(gridOf(127, 1, 1), new Uint8Array(127)))).toEqual([0, 0x7f]);
  });

  test('base64 follows RFC 4648: its test vectors through the decoder', () => {
    // Source: RFC 4648, section 10 test vectors: "f" → "Zg==", "fo" → "Zm8=", "foo" → "Zm9v", "foobar" → "Zm9vYmFy".
    // A raster whose run bytes are the ASCII of "fo" (value 0x66 = 'f', run 0x6f = 111 cells) encodes to "Zm8=".
    const encoded = encodeClassRaster(gridOf(111, 1, 1), new Uint8Array(111).fill(0x66));
    expect(encoded.data).toBe('Zm8=');
    // "foobar" as runs: ('f', 111), ('o', 98), ('a', 114).
    const values = Uint8Array.from([...new Array(111).fill(0x66), ...new Array(98).fill(0x6f), ...new Array(114).fill(0x61)]);
    const six = encodeClassRaster(gridOf(values.length, 1, 1), values);
    expect(six.data).toBe('Zm9vYmFy');
    expect(mismatches(decodeClassRaster(six), values)).toBe(0);
  });

  test('round trip on random rasters of every size class, against Node’s base64', () => {
    for (let seed = 1; seed <= 12; seed++) {
      const random = seededRandom(seed);
      const width = 1 + Math.floor(random() * 300);
      const height = 1 + Math.floor(random() * 200);
      const values = new Uint8Array(width * height);
      let v = 0;
      for (let i = 0; i < values.length; i++) {
        if (random() < (seed % 3 === 0 ? 0.5 : 0.02)) v = Math.floor(random() * (seed % 2 === 0 ? 5 : 256));
        values[i] = v;
      }
      const encoded = encodeClassRaster(gridOf(width, height), values);
      const decoded = decodeClassRaster(encoded);
      expect(mismatches(decoded, values)).toBe(0);
      // Our base64 equals Node's on the same bytes.
      expect(Buffer.from(runBytes(encoded)).toString('base64')).toBe(encoded.data);
    }
  });

  test('the worst case, every run one cell long, takes exactly two bytes a cell', () => {
    // Source: the byte layout above (value, then LEB128 length 1 = one byte); the encoder writes into room for
    // this worst case, so the test guards its bound (a typed array drops writes past its end without a word).
    const values = Uint8Array.from({ length: 4_097 }, (_, i) => i % 2);
    const encoded = encodeClassRaster(gridOf(4_097, 1), values);
    expect(runBytes(encoded)).toHaveLength(2 * 4_097);
    expect(mismatches(decodeClassRaster(encoded), values)).toBe(0);
  });

  test('keeps the grid for the map and is much smaller than the raw layer on a typical coverage layer', () => {
    const grid = { width: 400, height: 300, cellSize: 25, xll: 512_000, yll: 5_731_000, crs: { epsg: 32633, wkt: null } };
    const values = new Uint8Array(400 * 300);
    for (let row = 0; row < 300; row++) {
      for (let col = 0; col < 400; col++) values[row * 400 + col] = Math.hypot(col - 150, row - 150) < 100 ? 2 : 1;
    }
    const encoded = encodeClassRaster(grid, values);
    expect(encoded).toMatchObject({ width: 400, height: 300, cellSize: 25, xll: 512_000, yll: 5_731_000, epsg: 32633 });
    expect(encoded.data.length).toBeLessThan(values.length / 20);
    expect(JSON.parse(JSON.stringify(encoded))).toEqual(encoded);
  });

  test('neither function mutates its input', () => {
    const values = Uint8Array.from([1, 1, 2, 0]);
    const encoded = encodeClassRaster(gridOf(2, 2), values);
    expect(Array.from(values)).toEqual([1, 1, 2, 0]);
    const copy = { ...encoded };
    decodeClassRaster(encoded);
    expect(encoded).toEqual(copy);
  });

  test('rejects what it cannot decode', () => {
    const good = encodeClassRaster(gridOf(3, 2), Uint8Array.from([7, 7, 7, 7, 0, 2]));
    const bad = (patch: Partial<EncodedClassRaster>) => () => decodeClassRaster({ ...good, ...patch } as EncodedClassRaster);
    const invalid = expect.objectContaining({ code: 'invalid-encoding' });
    expect(bad({ format: 'other/1' as typeof CLASS_RASTER_ENCODING })).toThrow(invalid);
    expect(bad({ width: 0 })).toThrow(invalid);
    expect(bad({ height: 2.5 })).toThrow(invalid);
    expect(bad({ width: 4 })).toThrow(invalid); // runs cover 6 cells, the grid has 8
    expect(bad({ width: 2 })).toThrow(invalid); // runs cover more than 4
    expect(bad({ data: good.data.slice(1) })).toThrow(invalid); // not in groups of four
    expect(bad({ data: '!' + good.data.slice(1) })).toThrow(invalid);
    expect(bad({ data: Buffer.from([7, 0]).toString('base64') })).toThrow(invalid); // run of length 0
    expect(bad({ data: Buffer.from([7, 0x84]).toString('base64') })).toThrow(invalid); // ends inside a length
    expect(bad({ data: 'B=A=' })).toThrow(invalid); // padding in the middle
    expect(() => encodeClassRaster(gridOf(3, 2), new Uint8Array(5))).toThrow(expect.objectContaining({ code: 'invalid-layer' }));
  });
});
