import { writeFileSync } from 'node:fs';
import path from 'node:path';
import { readEsriAsciiGrid } from '@/shared/terrain/formats/esri-ascii-grid-reader';
import { writeEsriAsciiGrid } from '@/shared/terrain/formats/esri-ascii-grid-writer';
import { epsgFromWkt } from '@/shared/terrain/formats/epsg-from-wkt';
import { wktForEpsg } from '@/shared/terrain/formats/wkt-for-epsg';
import { TerrainFormatError } from '@/shared/terrain/formats/terrain-format-error';
import { generateSyntheticTerrain } from '@/shared/terrain/synthetic-terrain';
import { describeWithGdal, gdal, temporaryFolder } from '@/tests/unit/terrain/gdal-tools';

jest.setTimeout(60_000);

const SMALL = 'ncols 3\nnrows 2\nxllcorner 500000\nyllcorner 6000000\ncellsize 25\nNODATA_value -9999\n1 2.5 -3\n4e1 -9999 6\n';

describe('readEsriAsciiGrid', () => {
  // Source: ESRI ASCII raster format description — header keys, rows north to south.
  test('reads header and values, row 0 = north', () => {
    const t = readEsriAsciiGrid(SMALL);
    expect([t.width, t.height, t.cellSize, t.xll, t.yll, t.nodata]).toEqual([3, 2, 25, 500000, 6000000, -9999]);
    expect(Array.from(t.heights)).toEqual([1, 2.5, -3, 40, -9999, 6]);
    expect(t.crs).toBeNull();
  });
  test('accepts xllcenter/yllcenter, dx = dy, mixed case and CRLF', () => {
    const t = readEsriAsciiGrid('NCOLS 2\r\nNROWS 1\r\nXLLCENTER 100\r\nYLLCENTER 200\r\nDX 10\r\nDY 10\r\n7 8\r\n');
    expect([t.xll, t.yll, t.cellSize]).toEqual([95, 195, 10]);
    expect(Array.from(t.heights)).toEqual([7, 8]);
  });
  test('keeps the .prj text and reads its EPSG code', () => {
    const t = readEsriAsciiGrid(SMALL, wktForEpsg(32633));
    expect(t.crs?.epsg).toBe(32633);
    expect(t.crs?.wkt).toContain('UTM zone 33N');
  });
  test.each([
    ['a PNG', '\x89PNG\r\n\x1a\n....', 'wrong-type'],
    ['a TIFF', 'II*\0\x08\0\0\0', 'wrong-type'],
    ['a CSV', 'x,y,z\n1,2,3\n', 'wrong-type'],
    ['no nrows', 'ncols 2\nxllcorner 0\nyllcorner 0\ncellsize 1\n1 2\n', 'corrupt'],
    ['a bad value', 'ncols 2\nnrows 1\nxllcorner 0\nyllcorner 0\ncellsize 1\n1 x2\n', 'corrupt'],
    ['too many values', 'ncols 2\nnrows 1\nxllcorner 0\nyllcorner 0\ncellsize 1\n1 2 3\n', 'corrupt'],
    ['too few values', 'ncols 2\nnrows 2\nxllcorner 0\nyllcorner 0\ncellsize 1\n1 2 3\n', 'truncated'],
    ['an empty file', '', 'truncated'],
    ['a header cut short', 'ncols 2\nnrows', 'truncated'],
    ['dx ≠ dy', 'ncols 1\nnrows 1\nxllcorner 0\nyllcorner 0\ndx 1\ndy 2\n5\n', 'unsupported'],
    ['too many cells', 'ncols 20000\nnrows 20000\nxllcorner 0\nyllcorner 0\ncellsize 1\n1\n', 'oversize'],
    ['degree-sized cells', 'ncols 1\nnrows 1\nxllcorner 15.2\nyllcorner 51.7\ncellsize 0.00025\n5\n', 'geographic-crs'],
  ])('rejects %s', (_name, text, code) => {
    expect(() => readEsriAsciiGrid(text)).toThrow(expect.objectContaining({ name: 'TerrainFormatError', code }));
  });
  test('rejects a geographic .prj and says how to reproject', () => {
    const prj =
      'GEOGCS["GCS_WGS_1984",DATUM["D_WGS_1984",SPHEROID["WGS_1984",6378137,298.257223563]],PRIMEM["Greenwich",0],UNIT["Degree",0.0174532925199433]]';
    let error: unknown;
    try {
      readEsriAsciiGrid(SMALL, prj);
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(TerrainFormatError);
    expect((error as TerrainFormatError).code).toBe('geographic-crs');
    expect((error as TerrainFormatError).message).toMatch(/gdalwarp -t_srs EPSG:326/);
  });
  test('reads a 4000 × 4000 grid', () => {
    const n = 4000;
    const row = Array.from({ length: n }, (_, i) => String(i % 97)).join(' ');
    const text = `ncols ${n}\nnrows ${n}\nxllcorner 0\nyllcorner 0\ncellsize 25\n` + `${row}\n`.repeat(n);
    const t = readEsriAsciiGrid(text);
    expect(t.heights.length).toBe(n * n);
    expect(t.heights[n * n - 1]).toBe((n - 1) % 97);
  });
});

describe('writeEsriAsciiGrid', () => {
  test('round-trips through the reader at the chosen precision and marks NaN as nodata', () => {
    const t = generateSyntheticTerrain({ width: 40, height: 30, seed: 2 });
    const values = Float32Array.from(t.heights);
    values[5] = NaN;
    const { asc, prj } = writeEsriAsciiGrid(t, values, { decimals: 3 });
    expect(prj).toContain('AUTHORITY["EPSG","32633"]');
    const back = readEsriAsciiGrid(asc, prj);
    expect([back.width, back.height, back.cellSize, back.xll, back.yll, back.crs?.epsg]).toEqual([
      40,
      30,
      25,
      t.xll,
      t.yll,
      32633,
    ]);
    expect(back.heights[5]).toBe(-9999);
    for (let i = 0; i < values.length; i++)
      if (i !== 5) expect(Math.abs((back.heights[i] as number) - (values[i] as number))).toBeLessThanOrEqual(0.0005 + 1e-4);
  });
  test('does not mutate its input and rejects a wrong length', () => {
    const values = new Float32Array([1.23456, 2]);
    writeEsriAsciiGrid({ width: 2, height: 1, cellSize: 1, xll: 0, yll: 0, crs: null }, values);
    expect(values[0]).toBeCloseTo(1.23456, 5);
    expect(() => writeEsriAsciiGrid({ width: 3, height: 1, cellSize: 1, xll: 0, yll: 0, crs: null }, values)).toThrow(
      TerrainFormatError,
    );
  });
});

describe('epsgFromWkt and wktForEpsg', () => {
  // Source: EPSG numbering of WGS 84 / UTM zones (326zz north, 327zz south).
  test('reads the outermost authority and ESRI UTM names', () => {
    expect(epsgFromWkt(wktForEpsg(32633) as string)).toBe(32633);
    expect(epsgFromWkt(wktForEpsg(32719) as string)).toBe(32719);
    expect(epsgFromWkt('PROJCS["WGS_1984_UTM_Zone_10N",GEOGCS["GCS_WGS_1984"]]')).toBe(32610);
    expect(epsgFromWkt('LOCAL_CS["x"]')).toBeNull();
    expect(wktForEpsg(3857)).toBeNull();
  });
});

describeWithGdal('ESRI ASCII grids and GDAL', () => {
  // Source: GDAL's AAIGrid driver (reference library) reads and writes the same format.
  test('GDAL reads our grid and .prj with the same geotransform, CRS and values', () => {
    const { dir, remove } = temporaryFolder();
    try {
      const t = generateSyntheticTerrain({ width: 50, height: 40, seed: 6 });
      const { asc, prj } = writeEsriAsciiGrid(t, t.heights, { decimals: 2 });
      writeFileSync(path.join(dir, 'a.asc'), asc);
      writeFileSync(path.join(dir, 'a.prj'), prj as string);
      const info = JSON.parse(gdal('gdalinfo', ['-json', path.join(dir, 'a.asc')]));
      expect(info.geoTransform).toEqual([t.xll, 25, 0, t.yll + 40 * 25, 0, -25]);
      expect(info.coordinateSystem.wkt).toMatch(/ID\["EPSG",32633\]\]\s*$/);
      // GDAL writes it back as XYZ-free AAIGrid; our reader must read GDAL's output too.
      gdal('gdal_translate', ['-q', '-of', 'AAIGrid', path.join(dir, 'a.asc'), path.join(dir, 'b.asc')]);
      const { readFileSync } = jest.requireActual<typeof import('node:fs')>('node:fs');
      const back = readEsriAsciiGrid(
        readFileSync(path.join(dir, 'b.asc'), 'latin1'),
        readFileSync(path.join(dir, 'b.prj'), 'utf8'),
      );
      expect([back.width, back.height, back.xll, back.yll, back.cellSize]).toEqual([50, 40, t.xll, t.yll, 25]);
      for (let i = 0; i < back.heights.length; i++)
        expect(Math.abs((back.heights[i] as number) - (t.heights[i] as number))).toBeLessThan(0.006);
    } finally {
      remove();
    }
  });
});
