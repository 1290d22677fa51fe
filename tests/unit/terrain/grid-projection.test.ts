import { execFileSync } from 'node:child_process';
import { gridProjection, TerrainCrsError } from '@/shared/terrain/grid-projection';
import { elevationAt } from '@/shared/terrain/terrain-elevation';
import type { TerrainRaster } from '@/shared/terrain/terrain-raster';
import { describeWithGdal, gdal } from '@/tests/unit/terrain/gdal-tools';

/** Lat/lon → grid with GDAL's gdaltransform (PROJ), traditional lon-lat order. */
function gdaltransform(from: string, to: string, a: number, b: number): [number, number] {
  const out = execFileSync('gdaltransform', ['-s_srs', from, '-t_srs', to], { input: `${a} ${b}\n`, encoding: 'utf8' });
  const [x, y] = out.trim().split(/\s+/).map(Number);
  return [x as number, y as number];
}

describe('gridProjection: known UTM values', () => {
  test('33.3°N 44.4°E in zone 38N', () => {
    // Source: GeographicLib GeoConvert usage text: "33.3 44.4" ≡ "38N 444140.54 3684706.36".
    const { x, y } = gridProjection({ epsg: 32638, wkt: null }).toGrid({ latDeg: 33.3, lonDeg: 44.4 });
    expect(Math.abs(x - 444140.54)).toBeLessThan(0.006);
    expect(Math.abs(y - 3684706.36)).toBeLessThan(0.006);
  });

  test('the central meridian maps to easting 500 000 m, both ways', () => {
    // Source: UTM definition, false easting 500 000 m on the central meridian 6·zone − 183°
    // (common practice, no source).
    const grid = gridProjection({ epsg: 32633, wkt: null });
    const { x } = grid.toGrid({ latDeg: 51.8, lonDeg: 15 });
    expect(Math.abs(x - 500_000)).toBeLessThan(1e-6);
    const back = grid.toLatLon(500_000, 5_740_000);
    expect(Math.abs(back.lonDeg - 15)).toBeLessThan(1e-9);
  });

  test('southern zones carry the 10 000 000 m false northing', () => {
    const { y } = gridProjection({ epsg: 32756, wkt: null }).toGrid({ latDeg: -0.0001, lonDeg: 153 });
    expect(Math.abs(y - (10_000_000 - 11.06))).toBeLessThan(0.05); // 0.0001° of latitude ≈ 11.06 m (from memory)
  });
});

describeWithGdal('gridProjection against gdaltransform (PROJ)', () => {
  // Source: GDAL gdaltransform from Debian gdal-bin, which runs the PROJ library.
  test.each([
    { epsg: 32633, lat: 51.8, lon: 15.3 },
    { epsg: 32633, lat: 51.71, lon: 13.1 },
    { epsg: 32756, lat: -33.9, lon: 151.2 },
    { epsg: 25833, lat: 51.8, lon: 15.3 },
    { epsg: 26910, lat: 45.2, lon: -120.5 },
  ])('EPSG:$epsg at $lat, $lon: within 1 mm, and back within 1e-8°', ({ epsg, lat, lon }) => {
    const [ex, ey] = gdaltransform('EPSG:4326', `EPSG:${epsg}`, lon, lat);
    const grid = gridProjection({ epsg, wkt: null });
    const { x, y } = grid.toGrid({ latDeg: lat, lonDeg: lon });
    expect(Math.abs(x - ex)).toBeLessThan(0.001);
    expect(Math.abs(y - ey)).toBeLessThan(0.001);
    const back = grid.toLatLon(ex, ey);
    expect(Math.abs(back.latDeg - lat)).toBeLessThan(1e-8);
    expect(Math.abs(back.lonDeg - lon)).toBeLessThan(1e-8);
  });

  test.each([
    { epsg: 3035, lat: 52, lon: 10, tolerance: 0.01 },
    { epsg: 2193, lat: -41.3, lon: 174.8, tolerance: 0.01 },
  ])('EPSG:$epsg from its WKT (gdalsrsinfo) matches within $tolerance m', ({ epsg, lat, lon, tolerance }) => {
    const wkt = gdal('gdalsrsinfo', ['-o', 'wkt1', `EPSG:${epsg}`]).trim();
    const grid = gridProjection({ epsg: null, wkt });
    const [ex, ey] = gdaltransform('EPSG:4326', `EPSG:${epsg}`, lon, lat);
    const { x, y } = grid.toGrid({ latDeg: lat, lonDeg: lon });
    expect(Math.abs(x - ex)).toBeLessThan(tolerance);
    expect(Math.abs(y - ey)).toBeLessThan(tolerance);
  });

  test('a CRS in US survey feet is refused as not metric', () => {
    const wkt = gdal('gdalsrsinfo', ['-o', 'wkt1', 'EPSG:2227']).trim();
    expect(() => gridProjection({ epsg: null, wkt })).toThrow(expect.objectContaining({ code: 'not-metric' }));
  });

  test('a geographic .prj is refused as degrees', () => {
    const wkt = gdal('gdalsrsinfo', ['-o', 'wkt1', 'EPSG:4326']).trim();
    expect(() => gridProjection({ epsg: null, wkt })).toThrow(expect.objectContaining({ code: 'geographic' }));
  });
});

describe('gridProjection refusals', () => {
  const codeOf = (run: () => unknown): string | null => {
    try {
      run();
      return null;
    } catch (error) {
      expect(error).toBeInstanceOf(TerrainCrsError);
      return (error as TerrainCrsError).code;
    }
  };
  test('no CRS at all', () => {
    expect(codeOf(() => gridProjection(null))).toBe('missing');
    expect(codeOf(() => gridProjection({ epsg: null, wkt: null }))).toBe('missing');
  });
  test('geographic codes', () => {
    expect(codeOf(() => gridProjection({ epsg: 4326, wkt: null }))).toBe('geographic');
  });
  test('Web Mercator', () => {
    expect(codeOf(() => gridProjection({ epsg: 3857, wkt: null }))).toBe('unsupported');
  });
  test('an EPSG code Kenning has no definition for, without WKT', () => {
    expect(codeOf(() => gridProjection({ epsg: 2193, wkt: null }))).toBe('unknown');
  });
  test('unreadable WKT', () => {
    expect(codeOf(() => gridProjection({ epsg: null, wkt: 'PROJCS["broken"' }))).not.toBeNull();
  });
});

describe('elevationAt', () => {
  // A tilted plane z = 100 + 0.02·x − 0.01·y: bilinear interpolation reproduces a plane
  // exactly (common practice, no source).
  const width = 6;
  const height = 4;
  const cellSize = 25;
  const xll = 512_000;
  const yll = 5_731_000;
  const plane = (x: number, y: number) => 100 + 0.02 * (x - xll) - 0.01 * (y - yll);
  const heights = new Float32Array(width * height);
  for (let r = 0; r < height; r++) {
    for (let c = 0; c < width; c++)
      heights[r * width + c] = plane(xll + (c + 0.5) * cellSize, yll + (height - r - 0.5) * cellSize);
  }
  const terrain: TerrainRaster = { heights, width, height, cellSize, xll, yll, nodata: -9999, crs: { epsg: 32633, wkt: null } };

  test('reproduces a plane between cell centres', () => {
    for (const [x, y] of [
      [xll + 30, yll + 40],
      [xll + 101.3, yll + 62.9],
      [xll + 137.5, yll + 87.5],
    ] as const) {
      expect(Math.abs((elevationAt(terrain, x, y) as number) - plane(x, y))).toBeLessThan(1e-4);
    }
  });

  test('is flat in the outer half cell', () => {
    expect(elevationAt(terrain, xll + 1, yll + 50)).toBeCloseTo(elevationAt(terrain, xll + 12.5, yll + 50) as number, 9);
  });

  test('null on nodata, error outside', () => {
    const holed = new Float32Array(heights);
    holed[1 * width + 2] = -9999;
    expect(elevationAt({ ...terrain, heights: holed }, xll + 2.5 * cellSize + 5, yll + 2.5 * cellSize)).toBeNull();
    expect(() => elevationAt(terrain, xll - 1, yll + 10)).toThrow(expect.objectContaining({ code: 'point-outside-raster' }));
  });
});
