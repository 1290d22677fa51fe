// geotiff's CommonJS build requires quick-lru, which ships only as an ES module that
// Jest's CommonJS runtime cannot load; it is used for remote sources only, so a Map stands in.
jest.mock('quick-lru', () => ({ __esModule: true, default: class QuickLRU extends Map {} }));

import { readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { readGeoTiff } from '@/shared/terrain/formats/geotiff-reader';
import { writeGeoTiff } from '@/shared/terrain/formats/geotiff-writer';
import { computeHiddenHeightRaster } from '@/shared/terrain/hidden-height-raster';
import { generateSyntheticTerrain } from '@/shared/terrain/synthetic-terrain';
import { checkHiddenHeights } from '@/tests/support/line-of-sight-checker';
import { compareHiddenHeights } from '@/tests/unit/terrain/agreement';
import { describeWithGdal, gdal, temporaryFolder } from '@/tests/unit/terrain/gdal-tools';

jest.setTimeout(120_000);

/**
 * GDAL 3.6 mishandles a few cells right next to the observer; they are left out
 * of every comparison (project note, measured on gdal-bin 3.6.2).
 */
const NEAR_POST_EXCLUSION = 10; // cells

describeWithGdal('hidden heights against gdal_viewshed -om GROUND', () => {
  // Source: GDAL gdal_viewshed documentation — -om GROUND writes the height above
  // ground a target needs to be seen; -cc is the curvature coefficient 1 − k; the
  // earth radius is the CRS's semi-major axis (6 378 137 m for WGS 84 / UTM).
  const cases = [
    { seed: 3, post: { col: 100, row: 130, eyeHeight: 10 }, k: 0.13 },
    { seed: 8, post: { col: 40, row: 60, eyeHeight: 20 }, k: 0.13 },
    { seed: 21, post: { col: 180, row: 200, eyeHeight: 6 }, k: -0.1 },
  ];
  let folder: ReturnType<typeof temporaryFolder>;
  beforeAll(() => {
    folder = temporaryFolder();
  });
  afterAll(() => folder.remove());

  test.each(cases)('seed $seed, post ($post.col, $post.row), k $k', async ({ seed, post, k }) => {
    const size = 241;
    const terrain = generateSyntheticTerrain({ width: size, height: size, seed });
    const input = path.join(folder.dir, `dem-${seed}.tif`);
    const output = path.join(folder.dir, `ground-${seed}.tif`);
    writeFileSync(input, Buffer.from(writeGeoTiff(terrain, terrain.heights, { nodata: null })));
    const x = terrain.xll + (post.col + 0.5) * terrain.cellSize;
    const y = terrain.yll + (size - post.row - 0.5) * terrain.cellSize;
    gdal('gdal_viewshed', [
      '-q',
      '-om',
      'GROUND',
      '-oz',
      String(post.eyeHeight),
      '-tz',
      '0',
      '-cc',
      String(1 - k),
      '-ox',
      String(x),
      '-oy',
      String(y),
      input,
      output,
    ]);
    const bytes = readFileSync(output);
    const reference = await readGeoTiff(bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength));
    expect([reference.width, reference.height]).toEqual([size, size]);

    const conditions = { refractionCoefficient: k, earthRadius: 6_378_137 };
    const engine = computeHiddenHeightRaster(terrain, post, conditions);
    const checker = checkHiddenHeights(terrain, post, conditions);

    const engineVsGdal = compareHiddenHeights(engine.hidden, reference.heights, size, post, NEAR_POST_EXCLUSION);
    const engineVsChecker = compareHiddenHeights(engine.hidden, checker, size, post, NEAR_POST_EXCLUSION);
    const gdalVsChecker = compareHiddenHeights(reference.heights, checker, size, post, NEAR_POST_EXCLUSION);

    // Both approximate the same exact quantity: they agree on ≥ 98.5 % of cells
    // (GDAL itself agrees with the checker on 99.2–99.9 % here, measured).
    for (const h of [0, 10]) {
      expect(engineVsGdal.seenAgreement(h)).toBeGreaterThanOrEqual(0.985);
      // The engine is at least as exact as the reference library.
      expect(engineVsChecker.seenAgreement(h)).toBeGreaterThanOrEqual(gdalVsChecker.seenAgreement(h));
    }
    // Hidden heights: within 2 m of GDAL in the median, and no worse than GDAL against the checker.
    expect(engineVsGdal.medianErrorHidden).toBeLessThanOrEqual(2);
    expect(engineVsChecker.medianErrorHidden).toBeLessThanOrEqual(gdalVsChecker.medianErrorHidden);
    expect(engineVsChecker.p95ErrorHidden).toBeLessThanOrEqual(gdalVsChecker.p95ErrorHidden);
  });
});
