// geotiff's CommonJS build requires quick-lru, which ships only as an ES module that
// Jest's CommonJS runtime cannot load; it is used for remote sources only, so a Map stands in.
jest.mock('quick-lru', () => ({ __esModule: true, default: class QuickLRU extends Map {} }));

import { spawnSync } from 'node:child_process';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { readEsriAsciiGrid } from '@/shared/terrain/formats/esri-ascii-grid-reader';
import { writeEsriAsciiGrid } from '@/shared/terrain/formats/esri-ascii-grid-writer';
import { readGeoTiff } from '@/shared/terrain/formats/geotiff-reader';
import { writeGeoTiff } from '@/shared/terrain/formats/geotiff-writer';
import { computeHiddenHeightRaster } from '@/shared/terrain/hidden-height-raster';
import { generateSyntheticTerrain } from '@/shared/terrain/synthetic-terrain';
import { temporaryFolder } from '@/tests/unit/terrain/gdal-tools';

jest.setTimeout(60_000);

const ROOT = path.join(__dirname, '..', '..', '..');
const SCRIPT = path.join(ROOT, 'server', 'scripts', 'viewshed.ts');

function viewshed(args: string[]): { status: number | null; stdout: string; stderr: string } {
  const run = spawnSync(process.execPath, ['--import', 'tsx', SCRIPT, ...args], { cwd: ROOT, encoding: 'utf8' });
  return { status: run.status, stdout: run.stdout, stderr: run.stderr };
}

describe('server/scripts/viewshed.ts', () => {
  const terrain = generateSyntheticTerrain({ width: 80, height: 60, seed: 17 });
  const post = { col: 25, row: 40, eyeHeight: 15 };
  // Inside the post's cell, off its centre: the cell is the one containing (x, y).
  const x = terrain.xll + (post.col + 0.8) * terrain.cellSize;
  const y = terrain.yll + (terrain.height - post.row - 0.3) * terrain.cellSize;
  let folder: ReturnType<typeof temporaryFolder>;
  let tif: string;
  let asc: string;
  beforeAll(() => {
    folder = temporaryFolder();
    tif = path.join(folder.dir, 'dem.tif');
    asc = path.join(folder.dir, 'dem.asc');
    writeFileSync(tif, Buffer.from(writeGeoTiff(terrain, terrain.heights, { nodata: null })));
    const { asc: text, prj } = writeEsriAsciiGrid(terrain, terrain.heights, { decimals: 4 });
    writeFileSync(asc, text);
    writeFileSync(path.join(folder.dir, 'dem.prj'), prj as string);
  });
  afterAll(() => folder.remove());

  test('writes hidden heights as a Float32 GeoTIFF on the input grid and times itself', async () => {
    const out = path.join(folder.dir, 'hidden.tif');
    const run = viewshed(['--dem', tif, '--x', String(x), '--y', String(y), '--eye', '15', '--k', '-0.1', '--out', out]);
    expect(run.stderr).toMatch(/compute \d+ ms/);
    expect(run.status).toBe(0);
    const bytes = readFileSync(out);
    const result = await readGeoTiff(bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength));
    expect([result.width, result.height, result.cellSize, result.xll, result.yll, result.crs?.epsg]).toEqual([
      80,
      60,
      25,
      terrain.xll,
      terrain.yll,
      32633,
    ]);
    expect(result.heights).toEqual(computeHiddenHeightRaster(terrain, post, { refractionCoefficient: -0.1 }).hidden);
  });

  test('writes a visible mask as an ASCII grid with a .prj, from an ASCII terrain', () => {
    const out = path.join(folder.dir, 'seen.asc');
    const run = viewshed([
      '--dem',
      asc,
      '--x',
      String(x),
      '--y',
      String(y),
      '--eye',
      '15',
      '--mode',
      'visible',
      '--target',
      '30',
      '--max-distance',
      '800',
      '--out',
      out,
    ]);
    expect(run.status).toBe(0);
    const mask = readEsriAsciiGrid(readFileSync(out, 'latin1'), readFileSync(out.replace(/asc$/, 'prj'), 'utf8'));
    expect(mask.crs?.epsg).toBe(32633);
    const ascTerrain = readEsriAsciiGrid(readFileSync(asc, 'latin1'));
    const hidden = computeHiddenHeightRaster(ascTerrain, post, { maxDistance: 800 }).hidden;
    for (let i = 0; i < hidden.length; i++) {
      const h = hidden[i] as number;
      const expected = Number.isNaN(h) ? -9999 : h <= 30.001 ? 1 : 0;
      expect(mask.heights[i]).toBe(expected);
    }
  });

  test.each([
    [[], /--dem is required/],
    [['--dem', 'x.tif', '--x', '1', '--y', '2', '--eye', '3'], /--out is required/],
    [['--dem', 'x.tif', '--x', 'east', '--y', '2', '--eye', '3', '--out', 'o.tif'], /--x must be a number/],
    [['--dem', 'x.tif', '--x', '1', '--y', '2', '--eye', '-3', '--out', 'o.tif'], /--eye must be ≥ 0/],
    [['--dem', 'x.tif', '--x', '1', '--y', '2', '--eye', '3', '--out', 'o.png'], /--out must end in \.asc/],
    [['--dem', 'x.tif', '--x', '1', '--y', '2', '--eye', '3', '--out', 'o.tif', '--mode', 'seen'], /--mode must be/],
    [['--dem', 'x.tif', '--x', '1', '--y', '2', '--eye', '3', '--out', 'o.tif', '--bogus'], /Unknown option '--bogus'/],
    [['--dem', 'x.tif', '--x', '1', '--y', '2', '--eye', '3', '--out', 'o.tif', '--threads', '3'], /--threads must be 1 or 2/],
    [['--dem', 'missing.tif', '--x', '1', '--y', '2', '--eye', '3', '--out', 'o.tif'], /file not found/],
  ])('rejects bad arguments %j with exit status 2', (args, message) => {
    const run = viewshed(args as string[]);
    expect(run.status).toBe(2);
    expect(run.stderr).toMatch(message as RegExp);
  });

  test('rejects a post outside the terrain', () => {
    const run = viewshed(['--dem', tif, '--x', '1', '--y', '2', '--eye', '3', '--out', path.join(folder.dir, 'o.tif')]);
    expect(run.status).toBe(2);
    expect(run.stderr).toMatch(/outside the terrain/);
  });

  test('reports an unreadable terrain with exit status 1 and writes nothing', () => {
    const bad = path.join(folder.dir, 'bad.tif');
    writeFileSync(bad, 'not a tiff at all');
    const out = path.join(folder.dir, 'never.tif');
    const run = viewshed(['--dem', bad, '--x', String(x), '--y', String(y), '--eye', '3', '--out', out]);
    expect(run.status).toBe(1);
    expect(run.stderr).toMatch(/wrong-type/);
    expect(existsSync(out)).toBe(false);
  });

  test('two threads write the same bits as one (GeoTIFF, and ASCII with a range limit)', () => {
    // Source: the one-thread sweep (held to the previous engine in sweep-reference.test.ts); the two
    // halves must not change a bit of it. Common practice, no source.
    const base = ['--x', String(x), '--y', String(y), '--eye', '12', '--k', '0.2'];
    for (const [dem, ext, extra] of [
      [tif, 'tif', []],
      [asc, 'asc', ['--max-distance', '700']],
    ] as const) {
      const outs = (['1', '2'] as const).map((threads) => {
        const out = path.join(folder.dir, `threads-${threads}.${ext}`);
        const run = viewshed(['--dem', dem, ...base, ...extra, '--threads', threads, '--out', out]);
        expect(run.stderr).toMatch(threads === '2' ? /Mcells\/s, 2 threads\)/ : /Mcells\/s, 1 thread\)/);
        expect(run.status).toBe(0);
        return readFileSync(out);
      });
      expect(outs[0]?.length).toBeGreaterThan(1000);
      expect(Buffer.compare(outs[0] as Buffer, outs[1] as Buffer)).toBe(0);
    }
  });

  test('two threads: a post on nodata is refused with exit status 2 and nothing written', () => {
    const heights = Float32Array.from(terrain.heights);
    heights[post.row * terrain.width + post.col] = NaN;
    const holed = path.join(folder.dir, 'holed.tif');
    writeFileSync(holed, Buffer.from(writeGeoTiff(terrain, heights)));
    const out = path.join(folder.dir, 'holed-out.tif');
    const run = viewshed(['--dem', holed, '--x', String(x), '--y', String(y), '--eye', '3', '--threads', '2', '--out', out]);
    expect(run.stderr).toMatch(/no ground height/);
    expect(run.status).toBe(2);
    expect(existsSync(out)).toBe(false);
  });

  test('the prebuilt command (npm run viewshed) builds its bundle and writes the same file as the TypeScript entry', () => {
    const out = path.join(folder.dir, 'prebuilt.tif');
    const args = ['--dem', tif, '--x', String(x), '--y', String(y), '--eye', '15', '--threads', '2'];
    const run = spawnSync(
      process.execPath,
      [path.join(ROOT, 'server', 'scripts', 'viewshed-command.mjs'), ...args, '--out', out],
      {
        cwd: ROOT,
        encoding: 'utf8',
      },
    );
    expect(run.stderr).toMatch(/compute \d+ ms/);
    expect(run.status).toBe(0);
    const reference = path.join(folder.dir, 'reference.tif');
    expect(viewshed([...args, '--threads', '1', '--out', reference]).status).toBe(0);
    expect(Buffer.compare(readFileSync(out), readFileSync(reference))).toBe(0);
    expect(existsSync(path.join(ROOT, 'dist', 'cli', 'viewshed.cjs'))).toBe(true);
  });

  test('prints usage with --help', () => {
    const run = viewshed(['--help']);
    expect(run.status).toBe(0);
    expect(run.stdout).toMatch(/--mode hidden\|visible/);
  });
});
