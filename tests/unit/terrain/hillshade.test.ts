// geotiff's CommonJS build requires quick-lru (an ES module Jest cannot load); only remote sources use it.
jest.mock('quick-lru', () => ({ __esModule: true, default: class QuickLRU extends Map {} }));

import { readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { fromArrayBuffer } from 'geotiff';
import { readGeoTiff } from '@/shared/terrain/formats/geotiff-reader';
import { writeGeoTiff } from '@/shared/terrain/formats/geotiff-writer';
import { computeHillshade } from '@/shared/terrain/hillshade';
import { hillshadeImage } from '@/shared/terrain/hillshade-image';
import { generateSyntheticTerrain } from '@/shared/terrain/synthetic-terrain';
import { TerrainInputError } from '@/shared/terrain/terrain-input-error';
import type { TerrainRaster } from '@/shared/terrain/terrain-raster';
import { describeWithGdal, gdal, temporaryFolder } from '@/tests/unit/terrain/gdal-tools';

jest.setTimeout(120_000);

const bufferOf = (file: string): ArrayBuffer => {
  const bytes = readFileSync(file);
  return bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength) as ArrayBuffer;
};

async function readByteBand(file: string): Promise<Uint8Array> {
  const image = await (await fromArrayBuffer(bufferOf(file))).getImage();
  return (await image.readRasters({ samples: [0] }))[0] as Uint8Array;
}

/** Synthetic hill country with a block of NaN cells and one nodata-marker cell. */
function terrainWithHoles(): TerrainRaster {
  const base = generateSyntheticTerrain({ width: 257, height: 193, seed: 11 });
  const heights = new Float32Array(base.heights);
  for (let r = 60; r < 75; r++) for (let c = 100; c < 130; c++) heights[r * base.width + c] = NaN;
  heights[0] = NaN; // a hole in the corner
  return { ...base, heights };
}

describeWithGdal('computeHillshade against gdaldem hillshade', () => {
  // Source: GDAL `gdaldem hillshade` (Debian gdal-bin), defaults -az 315 -alt 45 -z 1 -s 1,
  // Horn's gradient; -compute_edges for the edge and nodata treatment.
  let folder: ReturnType<typeof temporaryFolder>;
  beforeAll(() => {
    folder = temporaryFolder();
  });
  afterAll(() => folder.remove());

  const compare = (mine: Uint8Array, reference: Uint8Array) => {
    let differ = 0;
    let worst = 0;
    for (let i = 0; i < reference.length; i++) {
      const d = Math.abs((mine[i] as number) - (reference[i] as number));
      if (d > 0) differ++;
      worst = Math.max(worst, d);
    }
    return { differ, worst, share: differ / reference.length };
  };

  test('every cell, edges and holes included, matches -compute_edges to within 1 grey level', async () => {
    const terrain = terrainWithHoles();
    const input = path.join(folder.dir, 'holes.tif');
    const output = path.join(folder.dir, 'holes-shade.tif');
    writeFileSync(input, Buffer.from(writeGeoTiff(terrain, terrain.heights)));
    gdal('gdaldem', ['hillshade', '-q', '-compute_edges', input, output]);
    const reference = await readByteBand(output);
    const mine = computeHillshade(terrain).shade;
    const { worst, share } = compare(mine, reference);
    // GDAL sums the 3 × 3 window in single precision and divides with an approximate
    // reciprocal square root; a shade lying on x.5 can round the other way.
    expect(worst).toBeLessThanOrEqual(1);
    expect(share).toBeLessThan(0.001);
    // The hole is nodata (0) in both.
    expect(mine[65 * terrain.width + 110]).toBe(0);
    expect(reference[65 * terrain.width + 110]).toBe(0);
  });

  test('interior cells match plain gdaldem hillshade (which leaves the edges as nodata)', async () => {
    const terrain = generateSyntheticTerrain({ width: 200, height: 150, seed: 4, cellSize: 30 });
    const input = path.join(folder.dir, 'plain.tif');
    const output = path.join(folder.dir, 'plain-shade.tif');
    writeFileSync(input, Buffer.from(writeGeoTiff(terrain, terrain.heights, { nodata: null })));
    gdal('gdaldem', ['hillshade', '-q', input, output]);
    const reference = await readByteBand(output);
    const mine = computeHillshade(terrain).shade;
    let interior = 0;
    let differ = 0;
    for (let r = 1; r < terrain.height - 1; r++) {
      for (let c = 1; c < terrain.width - 1; c++) {
        const i = r * terrain.width + c;
        interior++;
        if (Math.abs((mine[i] as number) - (reference[i] as number)) > 1)
          throw new Error(`cell ${c}, ${r} differs by more than 1`);
        if (mine[i] !== reference[i]) differ++;
      }
    }
    expect(differ / interior).toBeLessThan(0.001);
    expect(reference[0]).toBe(0); // gdaldem without -compute_edges: edge = nodata
  });

  test('the committed demo terrain matches gdaldem -compute_edges', async () => {
    const file = path.join(__dirname, '..', '..', '..', 'assets', 'terrain', 'demo-forest-district.tif');
    const output = path.join(folder.dir, 'demo-shade.tif');
    gdal('gdaldem', ['hillshade', '-q', '-compute_edges', file, output]);
    const reference = await readByteBand(output);
    const terrain = await readGeoTiff(bufferOf(file));
    const { worst, share } = compare(computeHillshade(terrain).shade, reference);
    expect(worst).toBeLessThanOrEqual(1);
    expect(share).toBeLessThan(0.001);
  });

  test('a steeper light and exaggeration match gdaldem -az 200 -alt 30 -z 2', async () => {
    const terrain = generateSyntheticTerrain({ width: 120, height: 120, seed: 9 });
    const input = path.join(folder.dir, 'light.tif');
    const output = path.join(folder.dir, 'light-shade.tif');
    writeFileSync(input, Buffer.from(writeGeoTiff(terrain, terrain.heights, { nodata: null })));
    gdal('gdaldem', ['hillshade', '-q', '-compute_edges', '-az', '200', '-alt', '30', '-z', '2', input, output]);
    const reference = await readByteBand(output);
    const { worst, share } = compare(
      computeHillshade(terrain, { azimuthDeg: 200, altitudeDeg: 30, zFactor: 2 }).shade,
      reference,
    );
    expect(worst).toBeLessThanOrEqual(1);
    expect(share).toBeLessThan(0.001);
  });
});

describe('computeHillshade by itself', () => {
  const flat = (value: number): TerrainRaster => ({
    heights: new Float32Array(25).fill(value),
    width: 5,
    height: 5,
    cellSize: 10,
    xll: 0,
    yll: 0,
    nodata: -9999,
    crs: null,
  });

  test('flat ground is lit by sin(altitude): 1 + 254·sin 45° ≈ 181 everywhere', () => {
    // Source: Lambertian shading of a horizontal surface, cos(zenith of the light) =
    // sin(altitude) (common practice, no source).
    const shade = computeHillshade(flat(300)).shade;
    expect([...shade]).toEqual(new Array(25).fill(Math.round(1 + 254 * Math.SQRT1_2)));
  });

  test('a slope facing the light is brighter than one facing away', () => {
    // Ground rising towards the south-east faces the north-west light (azimuth 315°);
    // ground rising towards the north-west faces away from it.
    const terrain = flat(0);
    const risingSE = new Float32Array(25);
    const risingNW = new Float32Array(25);
    for (let r = 0; r < 5; r++) {
      for (let c = 0; c < 5; c++) {
        risingSE[r * 5 + c] = 5 * (c + r);
        risingNW[r * 5 + c] = -5 * (c + r);
      }
    }
    const litFace = computeHillshade({ ...terrain, heights: risingSE }).shade[12] as number;
    const darkFace = computeHillshade({ ...terrain, heights: risingNW }).shade[12] as number;
    expect(litFace).toBeGreaterThan(200);
    expect(darkFace).toBeLessThan(120);
  });

  test('cells with the nodata marker get 0 and do not disturb their neighbours', () => {
    const terrain = flat(100);
    const heights = new Float32Array(terrain.heights);
    heights[12] = -9999;
    const shade = computeHillshade({ ...terrain, heights }).shade;
    expect(shade[12]).toBe(0);
    expect(shade[11]).toBe(181);
  });

  test('does not modify the terrain', () => {
    const terrain = generateSyntheticTerrain({ width: 30, height: 20, seed: 2 });
    const copy = new Float32Array(terrain.heights);
    computeHillshade(terrain);
    expect(terrain.heights).toEqual(copy);
  });

  test('rejects an altitude outside 0 … 90°', () => {
    expect(() => computeHillshade(flat(1), { altitudeDeg: 95 })).toThrow(TerrainInputError);
  });
});

describe('hillshadeImage', () => {
  const relief = (width: number, height: number, fill: (i: number) => number) => ({
    width,
    height,
    cellSize: 25,
    xll: 0,
    yll: 0,
    crs: null,
    shade: Uint8Array.from({ length: width * height }, (_, i) => fill(i)),
  });

  test('keeps full resolution up to the edge limit', () => {
    const image = hillshadeImage(
      relief(4, 3, (i) => (i === 5 ? 0 : 100 + i)),
      4,
    );
    expect([image.width, image.height, image.factor]).toEqual([4, 3, 1]);
    expect([image.greyAlpha[0], image.greyAlpha[1]]).toEqual([100, 255]);
    expect([image.greyAlpha[10], image.greyAlpha[11]]).toEqual([0, 0]); // nodata is transparent
  });

  test('averages whole blocks: 4001 × 10 cells at 2048 px → factor 2, 2001 × 5 px', () => {
    // Source: box filter (common practice, no source): mean of the cells with data.
    const image = hillshadeImage(relief(4001, 10, (i) => ((i % 4001) % 2 === 0 ? 100 : 200)));
    expect([image.width, image.height, image.factor]).toEqual([2001, 5, 2]);
    expect(image.greyAlpha[0]).toBe(150);
    expect(image.greyAlpha[1]).toBe(255);
    // The last column of pixels covers one column of cells (all value 100 there).
    expect(image.greyAlpha[2 * 2000]).toBe(100);
  });

  test('alpha is the share of cells with data', () => {
    const image = hillshadeImage(
      relief(2, 2, (i) => (i === 0 ? 0 : 90)),
      1,
    );
    expect(image.factor).toBe(2);
    expect([image.greyAlpha[0], image.greyAlpha[1]]).toEqual([90, Math.round((255 * 3) / 4)]);
  });
});
