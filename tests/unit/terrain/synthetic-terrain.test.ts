// geotiff's CommonJS build requires quick-lru, which ships only as an ES module that
// Jest's CommonJS runtime cannot load; it is used for remote sources only, so a Map stands in.
jest.mock('quick-lru', () => ({ __esModule: true, default: class QuickLRU extends Map {} }));

import { readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { readGeoTiff } from '@/shared/terrain/formats/geotiff-reader';
import { writeGeoTiff } from '@/shared/terrain/formats/geotiff-writer';
import { generateSyntheticTerrain } from '@/shared/terrain/synthetic-terrain';

jest.setTimeout(120_000);

const DEMO = path.join(__dirname, '..', '..', '..', 'assets', 'terrain', 'demo-forest-district.tif');
/** The options documented in assets/terrain/README.md. */
const DEMO_OPTIONS = { width: 600, height: 600, cellSize: 25, seed: 20260, xll: 512_000, yll: 5_731_000 };

describe('generateSyntheticTerrain', () => {
  test('is deterministic for a seed and differs between seeds', () => {
    const a = generateSyntheticTerrain({ width: 64, height: 48, seed: 7 });
    const b = generateSyntheticTerrain({ width: 64, height: 48, seed: 7 });
    const c = generateSyntheticTerrain({ width: 64, height: 48, seed: 8 });
    expect(a.heights).toEqual(b.heights);
    expect(a.heights).not.toEqual(c.heights);
    expect([a.width, a.height, a.heights.length]).toEqual([64, 48, 64 * 48]);
  });
  test('has hill-country relief: finite heights, hundreds of metres of range', () => {
    // common practice, no source: a forest district of ridges and valleys.
    const t = generateSyntheticTerrain({ width: 160, height: 160, cellSize: 50, seed: 3 });
    let low = Infinity;
    let high = -Infinity;
    for (const h of t.heights) {
      expect(Number.isFinite(h)).toBe(true);
      low = Math.min(low, h);
      high = Math.max(high, h);
    }
    expect(high - low).toBeGreaterThan(200);
    expect(high - low).toBeLessThan(2000);
    expect(t.crs).toEqual({ epsg: 32633, wkt: null });
  });
  test('rejects bad sizes', () => {
    expect(() => generateSyntheticTerrain({ width: 0 })).toThrow(expect.objectContaining({ code: 'invalid-option' }));
  });
});

describe('the demo terrain asset', () => {
  // Golden file: regenerate with KENNING_REGENERATE_GOLDEN=1 (or the generate-demo-terrain script).
  test('is what the generator makes from the documented options', async () => {
    const expected = generateSyntheticTerrain(DEMO_OPTIONS);
    if (process.env.KENNING_REGENERATE_GOLDEN === '1') {
      writeFileSync(DEMO, Buffer.from(writeGeoTiff(expected, expected.heights, { nodata: null })));
    }
    const bytes = readFileSync(DEMO);
    expect(bytes.byteLength).toBeLessThan(3 * 1024 * 1024);
    const demo = await readGeoTiff(bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength));
    expect([demo.width, demo.height, demo.cellSize, demo.xll, demo.yll]).toEqual([600, 600, 25, 512_000, 5_731_000]);
    expect(demo.crs?.epsg).toBe(32633);
    expect(demo.heights).toEqual(expected.heights);
  });
});
