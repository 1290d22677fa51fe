// geotiff's CommonJS build requires quick-lru (an ES module Jest cannot load); only remote sources use it.
jest.mock('quick-lru', () => ({ __esModule: true, default: class QuickLRU extends Map {} }));

import { readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { fromArrayBuffer } from 'geotiff';
import { decimateTerrain } from '@/shared/terrain/decimate-terrain';
import { writeGeoTiff } from '@/shared/terrain/formats/geotiff-writer';
import { generateSyntheticTerrain } from '@/shared/terrain/synthetic-terrain';
import { TerrainInputError } from '@/shared/terrain/terrain-input-error';
import type { TerrainRaster } from '@/shared/terrain/terrain-raster';
import { describeWithGdal, gdal, temporaryFolder } from '@/tests/unit/terrain/gdal-tools';

jest.setTimeout(120_000);

const grid = (width: number, height: number, values: number[], nodata: number | null = null): TerrainRaster => ({
  heights: Float32Array.from(values),
  width,
  height,
  cellSize: 10,
  xll: 1000,
  yll: 2000,
  nodata,
  crs: null,
});

describeWithGdal('decimateTerrain against gdal_translate -r average', () => {
  // Source: GDAL `gdal_translate -r average -outsize` (Debian gdal-bin): the mean of the
  // source pixels of each output pixel, nodata left out.
  let folder: ReturnType<typeof temporaryFolder>;
  beforeAll(() => {
    folder = temporaryFolder();
  });
  afterAll(() => folder.remove());

  test('a 300 × 240 grid with a hole, to at most 100 cells an edge (factor 3)', async () => {
    const base = generateSyntheticTerrain({ width: 300, height: 240, seed: 21, cellSize: 25, xll: 500_000, yll: 5_700_000 });
    const heights = new Float32Array(base.heights);
    for (let r = 30; r < 36; r++) for (let c = 60; c < 66; c++) heights[r * base.width + c] = NaN; // two whole blocks
    heights[90 * base.width + 91] = NaN; // one cell of a block
    const terrain = { ...base, heights };
    const input = path.join(folder.dir, 'in.tif');
    const output = path.join(folder.dir, 'out.tif');
    writeFileSync(input, Buffer.from(writeGeoTiff(terrain, terrain.heights)));
    gdal('gdal_translate', ['-q', '-r', 'average', '-outsize', '100', '80', '-ot', 'Float64', input, output]);
    const bytes = readFileSync(output);
    const image = await (
      await fromArrayBuffer(bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength))
    ).getImage();
    const reference = (await image.readRasters({ samples: [0] }))[0] as Float64Array;
    const [west, south, east, north] = image.getBoundingBox();

    const mine = decimateTerrain(terrain, 100);
    expect([mine.width, mine.height, mine.factor, mine.cellSize]).toEqual([100, 80, 3, 75]);
    expect([mine.xll, mine.yll, mine.xll + mine.width * mine.cellSize, mine.yll + mine.height * mine.cellSize]).toEqual([
      west,
      south,
      east,
      north,
    ]);
    let worst = 0;
    for (let i = 0; i < reference.length; i++) {
      const ref = reference[i] as number;
      const got = mine.heights[i] as number;
      if (Number.isNaN(ref)) {
        expect(got).toBeNaN();
        continue;
      }
      worst = Math.max(worst, Math.abs(got - ref));
    }
    // Float32 output of a Float64 mean: half an ulp at ~1000 m is ~3e-5 m.
    expect(worst).toBeLessThan(1e-3);
    expect(mine.heights[10 * 100 + 20]).toBeNaN(); // the all-NaN blocks
    expect(Number.isNaN(mine.heights[30 * 100 + 30] as number)).toBe(false); // one NaN of nine
  });
});

describe('decimateTerrain by itself', () => {
  test('keeps a grid that already fits, as a copy', () => {
    const terrain = grid(3, 2, [1, 2, 3, 4, 5, 6]);
    const small = decimateTerrain(terrain, 3);
    expect(small.factor).toBe(1);
    expect([...small.heights]).toEqual([1, 2, 3, 4, 5, 6]);
    expect(small.heights).not.toBe(terrain.heights);
    expect([small.xll, small.yll, small.cellSize]).toEqual([1000, 2000, 10]);
  });

  test('averages 2 × 2 blocks, leaves nodata out, partial blocks at the east and south edges', () => {
    // 5 × 3 cells → factor 2 → 3 × 2; row 0 = north.
    // common practice, no source: box mean by hand.
    const terrain = grid(5, 3, [1, 3, 10, 20, 7, -9999, 5, 30, 40, 9, 100, 200, 300, 400, 500], -9999);
    const small = decimateTerrain(terrain, 3);
    expect([small.width, small.height, small.factor, small.cellSize]).toEqual([3, 2, 2, 20]);
    expect(small.heights[0]).toBeCloseTo((1 + 3 + 5) / 3, 5); // the -9999 cell left out
    expect(small.heights[1]).toBeCloseTo((10 + 20 + 30 + 40) / 4, 5);
    expect(small.heights[2]).toBeCloseTo((7 + 9) / 2, 5); // a 1 × 2 block at the east edge
    expect(small.heights[3]).toBeCloseTo(150, 5); // a 2 × 1 block at the south edge
    expect(small.heights[5]).toBeCloseTo(500, 5);
    // North-west corner kept: north = 2000 + 3·10 = 2030; the coarse grid reaches 2 × 20 m south of it.
    expect(small.xll).toBe(1000);
    expect(small.yll).toBe(2030 - 40);
  });

  test('a block without data is NaN', () => {
    const small = decimateTerrain(grid(4, 2, [NaN, NaN, 1, 2, NaN, NaN, 3, 4]), 2);
    expect(small.heights[0]).toBeNaN();
    expect(small.heights[1]).toBeCloseTo(2.5, 6);
  });

  test('does not modify the terrain', () => {
    const terrain = generateSyntheticTerrain({ width: 40, height: 30, seed: 3 });
    const copy = new Float32Array(terrain.heights);
    decimateTerrain(terrain, 7);
    expect(terrain.heights).toEqual(copy);
  });

  test('refuses an edge below 2 cells or not whole', () => {
    const terrain = grid(2, 1, [1, 2]);
    expect(() => decimateTerrain(terrain, 1)).toThrow(TerrainInputError);
    expect(() => decimateTerrain(terrain, 2.5)).toThrow(/whole number/);
  });
});
