// geotiff's CommonJS build requires quick-lru, which ships only as an ES module that
// Jest's CommonJS runtime cannot load; it is used for remote sources only, so a Map stands in.
jest.mock('quick-lru', () => ({ __esModule: true, default: class QuickLRU extends Map {} }));

import { readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { type GeoTiffFile, readGeoTiff } from '@/shared/terrain/formats/geotiff-reader';
import { geoTiffParts, writeGeoTiff } from '@/shared/terrain/formats/geotiff-writer';
import { generateSyntheticTerrain } from '@/shared/terrain/synthetic-terrain';
import { describeWithGdal, gdal, temporaryFolder } from '@/tests/unit/terrain/gdal-tools';

jest.setTimeout(60_000);

/** The first `startBytes` of a file and random access to the rest, as the command line reads a GeoTIFF. */
function startAndFile(whole: ArrayBuffer, startBytes: number): [ArrayBuffer, GeoTiffFile & { bytesRead: number }] {
  const file = {
    byteLength: whole.byteLength,
    bytesRead: 0,
    read(target: Uint8Array, position: number) {
      this.bytesRead += target.byteLength;
      target.set(new Uint8Array(whole, position, target.byteLength));
    },
  };
  return [whole.slice(0, startBytes), file];
}

function bufferOf(file: string): ArrayBuffer {
  const bytes = readFileSync(file);
  return bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength) as ArrayBuffer;
}

describe('writeGeoTiff and readGeoTiff', () => {
  const terrain = generateSyntheticTerrain({ width: 70, height: 50, seed: 12 });

  test('round-trip bit for bit with grid and EPSG code', async () => {
    const values = Float32Array.from(terrain.heights);
    values[3] = NaN;
    const back = await readGeoTiff(writeGeoTiff(terrain, values));
    expect([back.width, back.height, back.cellSize, back.xll, back.yll]).toEqual([70, 50, 25, terrain.xll, terrain.yll]);
    expect(back.crs?.epsg).toBe(32633);
    expect(back.nodata).toBeNull(); // NaN marks nodata
    expect(back.heights[3]).toBeNaN();
    for (let i = 0; i < values.length; i++) if (i !== 3) expect(back.heights[i]).toBe(values[i]);
  });

  test('writes a numeric nodata tag when asked, and does not mutate its input', async () => {
    const values = Float32Array.from(terrain.heights);
    const back = await readGeoTiff(writeGeoTiff(terrain, values, { nodata: -9999 }));
    expect(back.nodata).toBe(-9999);
    expect(values).toEqual(terrain.heights);
  });

  test('the two parts the command line writes are the file, the pixels a view on the values (no copy)', () => {
    // Source: writeGeoTiff above (round-trips and GDAL reads it); common practice, no source.
    const values = Float32Array.from(terrain.heights);
    const { head, data } = geoTiffParts(terrain, values);
    expect(data.buffer).toBe(values.buffer);
    const joined = Buffer.concat([head, data]);
    expect(Buffer.compare(joined, Buffer.from(writeGeoTiff(terrain, values)))).toBe(0);
    expect(head.byteLength % 8).toBe(0); // pixels start 8-byte aligned
  });

  test('reads the heights into an array the caller makes (shared memory for threads)', async () => {
    const file = writeGeoTiff(terrain, terrain.heights);
    let made = 0;
    const allocate = (length: number) => {
      made++;
      return new Float32Array(new SharedArrayBuffer(length * 4));
    };
    const back = await readGeoTiff(file, { allocate });
    expect(made).toBe(1);
    expect(back.heights.buffer).toBeInstanceOf(SharedArrayBuffer);
    expect(back.heights).toEqual(terrain.heights);
  });

  test('reads from the start of a file and random access: pixels straight into the heights, else the whole file', async () => {
    // Source: readGeoTiff on the whole file (round-trips above, GDAL below); common practice, no source.
    const values = Float32Array.from(terrain.heights);
    values[5] = NaN;
    const whole = writeGeoTiff(terrain, values, { nodata: -9999 });
    const expected = await readGeoTiff(whole);
    for (const startBytes of [4096, 16]) {
      const [start, file] = startAndFile(whole, startBytes);
      const back = await readGeoTiff(start, { file });
      expect(back).toEqual(expected);
      // With the tables in the start, only the pixels are read; with 16 bytes, the whole file.
      expect(file.bytesRead).toBe(startBytes === 16 ? whole.byteLength : values.length * 4);
    }
    const [start, file] = startAndFile(whole.slice(0, whole.byteLength - 100), 4096);
    await expect(readGeoTiff(start, { file })).rejects.toMatchObject({ code: 'truncated' });
    await expect(readGeoTiff(start, { file, maxCells: 100 })).rejects.toMatchObject({ code: 'oversize' });
  });

  test('a 4000 × 4000 raster round-trips', async () => {
    const n = 4000;
    const values = new Float32Array(n * n);
    for (let i = 0; i < values.length; i += 997) values[i] = i % 1000;
    const grid = { width: n, height: n, cellSize: 25, xll: 500_000, yll: 5_700_000, crs: { epsg: 32633, wkt: null } };
    const back = await readGeoTiff(writeGeoTiff(grid, values));
    expect(back.heights.length).toBe(n * n);
    expect(back.heights[997 * 1000]).toBe((997 * 1000) % 1000);
    expect(back.yll).toBe(5_700_000);
  });

  test.each([
    ['empty', new Uint8Array(0), 'truncated'],
    ['a PNG', new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0]), 'wrong-type'],
    ['text', new TextEncoder().encode('ncols 2\nnrows 2\n'), 'wrong-type'],
  ])('rejects %s', async (_name, bytes, code) => {
    await expect(readGeoTiff(bytes.buffer as ArrayBuffer)).rejects.toMatchObject({ name: 'TerrainFormatError', code });
  });

  test('rejects a truncated file', async () => {
    const whole = writeGeoTiff(terrain, terrain.heights);
    await expect(readGeoTiff(whole.slice(0, whole.byteLength - 100))).rejects.toMatchObject({ code: 'truncated' });
    await expect(readGeoTiff(whole.slice(0, 60))).rejects.toMatchObject({ name: 'TerrainFormatError' });
  });

  test('rejects a corrupt IFD', async () => {
    const broken = writeGeoTiff(terrain, terrain.heights);
    new DataView(broken).setUint32(4, 0x7fffffff, true); // IFD offset far past the end
    await expect(readGeoTiff(broken)).rejects.toMatchObject({ name: 'TerrainFormatError' });
  });

  test('rejects a raster over the size limit before reading its data', async () => {
    // A header that claims 20 000 × 20 000 cells (4e8 > 1e8 limit) with almost no data.
    const small = writeGeoTiff({ width: 1, height: 1, cellSize: 1, xll: 0, yll: 0, crs: null }, new Float32Array([1]));
    const view = new DataView(small);
    const entries = view.getUint16(8, true);
    for (let e = 0; e < entries; e++) {
      const at = 10 + e * 12;
      const tag = view.getUint16(at, true);
      if (tag === 256 || tag === 257) view.setUint32(at + 8, 20_000, true);
    }
    await expect(readGeoTiff(small)).rejects.toMatchObject({ code: 'oversize' });
  });
});

describeWithGdal('GeoTIFF and GDAL', () => {
  // Source: GDAL (reference library) — gdalinfo reads the geotransform, CRS, type and
  // nodata of our files; gdal_translate writes the variants we must read.
  const terrain = generateSyntheticTerrain({ width: 64, height: 48, seed: 13 });
  let folder: ReturnType<typeof temporaryFolder>;
  beforeAll(() => {
    folder = temporaryFolder();
    writeFileSync(path.join(folder.dir, 'ours.tif'), Buffer.from(writeGeoTiff(terrain, terrain.heights)));
  });
  afterAll(() => folder.remove());

  test('GDAL reads our Float32 GeoTIFF with the same geotransform, EPSG and values', () => {
    const info = JSON.parse(gdal('gdalinfo', ['-json', '-stats', path.join(folder.dir, 'ours.tif')]));
    expect(info.size).toEqual([64, 48]);
    expect(info.geoTransform).toEqual([terrain.xll, 25, 0, terrain.yll + 48 * 25, 0, -25]);
    expect(info.coordinateSystem.wkt).toMatch(/ID\["EPSG",32633\]\]\s*$/);
    expect(info.bands[0].type).toBe('Float32');
    let low = Infinity;
    for (const h of terrain.heights) low = Math.min(low, h);
    expect(info.bands[0].minimum).toBeCloseTo(low, 3);
  });

  test.each([
    ['deflate, tiled', ['-co', 'COMPRESS=DEFLATE', '-co', 'TILED=YES']],
    ['LZW, Int16', ['-co', 'COMPRESS=LZW', '-ot', 'Int16']],
    ['Float64, big-endian strips', ['-ot', 'Float64', '-co', 'ENDIANNESS=BIG']],
  ])('reads GDAL output: %s', async (_name, options) => {
    const out = path.join(folder.dir, `v-${Math.random().toString(36).slice(2)}.tif`);
    gdal('gdal_translate', ['-q', ...options, path.join(folder.dir, 'ours.tif'), out]);
    const back = await readGeoTiff(bufferOf(out));
    expect([back.width, back.height, back.cellSize, back.xll, back.yll, back.crs?.epsg]).toEqual([
      64,
      48,
      25,
      terrain.xll,
      terrain.yll,
      32633,
    ]);
    // Read from the file's start: the general decoder needs the whole file, read through `file`.
    const [start, file] = startAndFile(bufferOf(out), 4096);
    expect((await readGeoTiff(start, { file })).heights).toEqual(back.heights);
    // The general decoder's values land in the caller's array too.
    const shared = await readGeoTiff(bufferOf(out), { allocate: (n) => new Float32Array(new SharedArrayBuffer(n * 4)) });
    expect(shared.heights.buffer).toBeInstanceOf(SharedArrayBuffer);
    expect(shared.heights).toEqual(back.heights);
    const integer = options.includes('Int16');
    for (let i = 0; i < back.heights.length; i++) {
      expect(Math.abs((back.heights[i] as number) - (terrain.heights[i] as number))).toBeLessThanOrEqual(integer ? 0.5 : 1e-4);
    }
  });

  test('reads PixelIsPoint georeferencing as GDAL does', async () => {
    const out = path.join(folder.dir, 'point.tif');
    gdal('gdal_translate', ['-q', '-mo', 'AREA_OR_POINT=Point', path.join(folder.dir, 'ours.tif'), out]);
    const info = JSON.parse(gdal('gdalinfo', ['-json', out]));
    const back = await readGeoTiff(bufferOf(out));
    expect(back.xll).toBeCloseTo(info.geoTransform[0], 6);
    expect(back.yll + 48 * 25).toBeCloseTo(info.geoTransform[3], 6);
  });

  test('rejects a geographic (degrees) GeoTIFF and says how to reproject', async () => {
    const out = path.join(folder.dir, 'degrees.tif');
    gdal('gdal_translate', [
      '-q',
      '-a_srs',
      'EPSG:4326',
      '-a_ullr',
      '15.1',
      '51.8',
      '15.2',
      '51.7',
      path.join(folder.dir, 'ours.tif'),
      out,
    ]);
    await expect(readGeoTiff(bufferOf(out))).rejects.toMatchObject({
      code: 'geographic-crs',
      message: expect.stringMatching(/gdalwarp -t_srs EPSG:326xx/),
    });
  });
});
