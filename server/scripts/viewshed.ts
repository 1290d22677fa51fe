// Over 300 lines: the command line's arguments, file reading and writing, and its second thread belong to one program.
/**
 * Command line: the hidden-height raster or the seen/not-seen mask of one
 * lookout post, written as an ESRI ASCII grid or a Float32 GeoTIFF with the
 * input terrain's extent, cell size and CRS.
 *
 *   npm run viewshed -- --dem terrain.tif --x 519000 --y 5738000 --eye 15 --out hidden.tif
 *
 * Run with --help for every option. Timing goes to stderr. Exit status: 0 on
 * success, 2 for bad arguments, 1 when the terrain cannot be read or the
 * result cannot be written.
 */
import { closeSync, existsSync, fstatSync, openSync, readFileSync, readSync, writeFileSync, writeSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { parseArgs } from 'node:util';
import { Worker } from 'node:worker_threads';
import { epsgFromWkt } from '@/shared/terrain/formats/epsg-from-wkt';
import { readEsriAsciiGrid } from '@/shared/terrain/formats/esri-ascii-grid-reader';
import { writeEsriAsciiGrid } from '@/shared/terrain/formats/esri-ascii-grid-writer';
import { readGeoTiff } from '@/shared/terrain/formats/geotiff-reader';
import { geoTiffParts } from '@/shared/terrain/formats/geotiff-writer';
import { TerrainFormatError } from '@/shared/terrain/formats/terrain-format-error';
import { MEAN_EARTH_RADIUS_M, STANDARD_OPTICAL_K } from '@/shared/physics/constants';
import {
  completeHiddenHeightRaster,
  computeHiddenHeightHalf,
  computeHiddenHeightRaster,
  type HiddenHeightRaster,
  type LookoutPost,
  type SightConditions,
} from '@/shared/terrain/hidden-height-raster';
import { locatePostCell } from '@/shared/terrain/locate-post-cell';
import { targetVisibilityMask } from '@/shared/terrain/target-visibility-mask';
import { TerrainInputError } from '@/shared/terrain/terrain-input-error';
import type { TerrainRaster } from '@/shared/terrain/terrain-raster';
import type { GridSpec } from '@/shared/terrain/grid-spec';

/** Grids of at least this many cells are swept on two threads by default (below it a thread costs more than it saves). */
const TWO_THREAD_CELLS = 1_000_000;

const USAGE = `Usage: npm run viewshed -- --dem <file.tif|file.asc> --x <easting> --y <northing> --eye <m> --out <file.asc|file.tif> [options]

Computes what one lookout post sees of the terrain.

Required:
  --dem <file>           terrain: GeoTIFF (.tif/.tiff) or ESRI ASCII grid (.asc, with optional .prj beside it),
                         in a projected CRS in metres (e.g. UTM)
  --x <m>, --y <m>       post position, easting and northing in the terrain's CRS; the post is the cell containing it
  --eye <m>              eye height above the ground at the post, metres (add the tower or cab height)
  --out <file>           result: .asc (ESRI ASCII grid, plus .prj) or .tif (Float32 GeoTIFF), same grid as the terrain

Options:
  --mode hidden|visible  hidden  = hidden height in metres, 0 where the ground is seen (default)
                         visible = 1 where a target of --target metres is seen, 0 where not
  --target <m>           target height above ground for --mode visible, metres (default 0)
  --k <k>                refraction coefficient (default ${STANDARD_OPTICAL_K})
  --earth-radius <m>     earth radius, metres (default ${MEAN_EARTH_RADIUS_M})
"  --max-distance <m>     compute only within this distance of the post; cells beyond are nodata
  --threads 1|2          threads for the sweep (default 2 for grids of ${TWO_THREAD_CELLS} cells or more when the
                         machine has a core to spare, else 1); the result is the same bit for bit
  --help                 this text
`;

/** A problem with the command line itself (exit status 2). */
class UsageError extends Error {}

interface Arguments {
  dem: string;
  x: number;
  y: number;
  eye: number;
  out: string;
  mode: 'hidden' | 'visible';
  target: number;
  k: number;
  earthRadius: number;
  maxDistance: number | undefined;
  /** 1 or 2; null = decide by the grid's size and the machine's cores. */
  threads: number | null;
}

const VALUE_OPTIONS = new Set([
  '--dem',
  '--x',
  '--y',
  '--eye',
  '--out',
  '--mode',
  '--target',
  '--k',
  '--earth-radius',
  '--max-distance',
  '--threads',
]);

/** Joins `--k -0.1` into `--k=-0.1`, so negative numbers are taken as values, not options. */
function joinNegativeValues(argv: string[]): string[] {
  const joined: string[] = [];
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i] as string;
    const next = argv[i + 1];
    if (VALUE_OPTIONS.has(arg) && next !== undefined && /^-\d|^-\.\d/.test(next)) {
      joined.push(`${arg}=${next}`);
      i++;
    } else {
      joined.push(arg);
    }
  }
  return joined;
}

function parseCommandLine(argv: string[]): Arguments | null {
  let parsed;
  try {
    parsed = parseArgs({
      args: joinNegativeValues(argv),
      strict: true,
      allowPositionals: false,
      options: {
        dem: { type: 'string' },
        x: { type: 'string' },
        y: { type: 'string' },
        eye: { type: 'string' },
        out: { type: 'string' },
        mode: { type: 'string' },
        target: { type: 'string' },
        k: { type: 'string' },
        'earth-radius': { type: 'string' },
        'max-distance': { type: 'string' },
        threads: { type: 'string' },
        help: { type: 'boolean' },
      },
    });
  } catch (error) {
    throw new UsageError((error as Error).message.replace(/\. To specify a positional.*$/s, '.'));
  }
  const v = parsed.values;
  if (v.help) return null;
  const required = (name: 'dem' | 'x' | 'y' | 'eye' | 'out'): string => {
    const value = v[name];
    if (value === undefined || value === '') throw new UsageError(`--${name} is required.`);
    return value;
  };
  const number = (name: string, raw: string | undefined, what: string): number | undefined => {
    if (raw === undefined) return undefined;
    const value = Number(raw);
    if (raw.trim() === '' || !Number.isFinite(value)) {
      throw new UsageError(`--${name} must be a number (${what}), got "${raw}".`);
    }
    return value;
  };
  const dem = required('dem');
  const out = required('out');
  const x = number('x', required('x'), 'easting, metres') as number;
  const y = number('y', required('y'), 'northing, metres') as number;
  const eye = number('eye', required('eye'), 'eye height above ground, metres') as number;
  if (eye < 0) throw new UsageError(`--eye must be ≥ 0 metres, got ${eye}.`);
  const mode = v.mode ?? 'hidden';
  if (mode !== 'hidden' && mode !== 'visible') {
    throw new UsageError(`--mode must be "hidden" or "visible", got "${mode}".`);
  }
  const target = number('target', v.target, 'target height above ground, metres') ?? 0;
  if (target < 0) throw new UsageError(`--target must be ≥ 0 metres, got ${target}.`);
  if (v.target !== undefined && mode === 'hidden') {
    throw new UsageError('--target only applies to --mode visible (the hidden-height raster serves every target height).');
  }
  const k = number('k', v.k, 'refraction coefficient') ?? STANDARD_OPTICAL_K;
  if (k >= 1) throw new UsageError(`--k must be below 1, got ${k}.`);
  const earthRadius = number('earth-radius', v['earth-radius'], 'metres') ?? MEAN_EARTH_RADIUS_M;
  if (!(earthRadius > 0)) throw new UsageError(`--earth-radius must be > 0 metres, got ${earthRadius}.`);
  const maxDistance = number('max-distance', v['max-distance'], 'metres');
  if (maxDistance !== undefined && !(maxDistance > 0)) {
    throw new UsageError(`--max-distance must be > 0 metres, got ${maxDistance}.`);
  }
  const threads = number('threads', v.threads, '1 or 2') ?? null;
  if (threads !== null && threads !== 1 && threads !== 2) throw new UsageError(`--threads must be 1 or 2, got ${threads}.`);
  if (!/\.(asc|tif|tiff)$/i.test(dem)) throw new UsageError(`--dem must end in .tif, .tiff or .asc, got "${dem}".`);
  if (!/\.(asc|tif|tiff)$/i.test(out)) throw new UsageError(`--out must end in .asc, .tif or .tiff, got "${out}".`);
  if (!existsSync(dem)) throw new UsageError(`--dem file not found: ${dem}`);
  return { dem, x, y, eye, out, mode, target, k, earthRadius, maxDistance, threads };
}

/** Heights over a SharedArrayBuffer, which the second thread reads without a copy. */
function sharedFloat32(length: number): Float32Array {
  return new Float32Array(new SharedArrayBuffer(length * 4));
}

async function readTerrain(file: string, shared: boolean): Promise<TerrainRaster> {
  if (/\.asc$/i.test(file)) {
    const prjFile = file.replace(/\.asc$/i, '.prj');
    const prj = existsSync(prjFile) ? readFileSync(prjFile, 'utf8') : null;
    const terrain = readEsriAsciiGrid(readFileSync(file, 'latin1'), prj);
    if (!shared) return terrain;
    const heights = sharedFloat32(terrain.heights.length);
    heights.set(terrain.heights);
    return { ...terrain, heights };
  }
  // The header and tables are read first; plain Float32 pixels then go straight from the file into the
  // heights (no buffer of the whole file, no copy). Anything else is read whole by readGeoTiff.
  const fd = openSync(file, 'r');
  try {
    const byteLength = fstatSync(fd).size;
    const start = new Uint8Array(Math.min(byteLength, TIFF_START_BYTES));
    readFully(fd, start, 0);
    return await readGeoTiff(start.buffer, {
      ...(shared ? { allocate: sharedFloat32 } : {}),
      file: { byteLength, read: (target, position) => readFully(fd, target, position) },
    });
  } finally {
    closeSync(fd);
  }
}

/** Bytes of a GeoTIFF read before its tables are known: enough for the tables of common files. */
const TIFF_START_BYTES = 1 << 20;

/** Reads `target.length` bytes at `position`, or throws when the file ends first. */
function readFully(fd: number, target: Uint8Array, position: number): void {
  let at = 0;
  while (at < target.byteLength) {
    const got = readSync(fd, target, at, target.byteLength - at, position + at);
    if (got === 0) throw new Error(`the file ends at byte ${position + at}`);
    at += got;
  }
}

/** Writes all of `bytes` at the file position of `fd`. */
function writeAll(fd: number, bytes: Uint8Array): void {
  let at = 0;
  while (at < bytes.byteLength) at += writeSync(fd, bytes, at, bytes.byteLength - at);
}

function writeResult(file: string, grid: GridSpec, values: Float32Array, decimals: number): string[] {
  const notes: string[] = [];
  if (/\.asc$/i.test(file)) {
    const { asc, prj } = writeEsriAsciiGrid(grid, values, { decimals });
    writeFileSync(file, asc);
    const prjFile = file.replace(/\.asc$/i, '.prj');
    if (prj !== null) writeFileSync(prjFile, prj);
    else notes.push(`the terrain's CRS is not known as WKT, so no ${path.basename(prjFile)} was written`);
  } else {
    let out = grid;
    if (grid.crs && grid.crs.epsg === null && grid.crs.wkt) {
      const epsg = epsgFromWkt(grid.crs.wkt);
      out = { ...grid, crs: { epsg, wkt: grid.crs.wkt } };
    }
    if (!out.crs || out.crs.epsg === null) notes.push('the terrain has no EPSG code, so the GeoTIFF carries no CRS');
    // Header, then the pixels straight from the result array (no 4-bytes-a-cell copy).
    const { head, data } = geoTiffParts(out, values);
    const fd = openSync(file, 'w');
    try {
      writeAll(fd, head);
      writeAll(fd, data);
    } finally {
      closeSync(fd);
    }
  }
  return notes;
}

/** The command line's second thread: sweeps one half of a post into a shared result (see viewshed-half-worker.ts). */
interface HalfSweeper {
  sweep(terrain: TerrainRaster, post: LookoutPost, conditions: SightConditions, out: Float32Array): Promise<void>;
  close(): void;
}

/**
 * Starts the second thread. Its start-up runs while the main thread reads
 * the terrain. Run from the prebuilt bundle, it loads the bundled worker;
 * run through tsx (tests), the TypeScript entry through its shim.
 */
function startHalfSweeper(): HalfSweeper {
  const bundled = __filename.endsWith('.cjs');
  const entry = path.join(__dirname, bundled ? 'viewshed-half-worker.cjs' : 'viewshed-half-worker.mjs');
  const worker = new Worker(entry);
  let failed: Error | null = null;
  let waiting: { resolve: () => void; reject: (error: Error) => void } | null = null;
  const fail = (error: Error) => {
    failed = error;
    waiting?.reject(error);
    waiting = null;
  };
  worker.on('error', fail);
  worker.on('exit', (code) => fail(new Error(`the sweep thread stopped (exit code ${code})`)));
  worker.on('message', (message: { ok: boolean; name?: string; message?: string }) => {
    if (message.ok) waiting?.resolve();
    else waiting?.reject(new Error(`${message.name}: ${message.message}`));
    waiting = null;
  });
  return {
    sweep(terrain, post, conditions, out) {
      return new Promise<void>((resolve, reject) => {
        if (failed) return reject(failed);
        waiting = { resolve, reject };
        worker.postMessage({ terrain, post, conditions, half: 'south', out });
      });
    },
    close() {
      worker.removeAllListeners('exit');
      void worker.terminate();
    },
  };
}

/**
 * One post's hidden heights: on two threads (south half in the worker, north
 * half here, one shared result — bitwise the one-thread sweep), or on this one.
 */
async function sweepPost(
  terrain: TerrainRaster,
  post: LookoutPost,
  conditions: SightConditions,
  helper: HalfSweeper | null,
): Promise<HiddenHeightRaster> {
  if (helper === null || !(terrain.heights.buffer instanceof SharedArrayBuffer)) {
    return computeHiddenHeightRaster(terrain, post, conditions);
  }
  const out = sharedFloat32(terrain.width * terrain.height);
  const south = helper.sweep(terrain, post, conditions, out);
  // Bad inputs throw TerrainInputError from this thread's half before it sweeps; the other thread's
  // answer is then not awaited, so it must not count as an unhandled rejection.
  south.catch(() => undefined);
  computeHiddenHeightHalf(terrain, post, conditions, 'north', out);
  await south;
  return completeHiddenHeightRaster(terrain, post, conditions, out);
}

async function main(): Promise<number> {
  let args: Arguments | null;
  try {
    args = parseCommandLine(process.argv.slice(2));
  } catch (error) {
    if (error instanceof UsageError) {
      process.stderr.write(`viewshed: ${error.message}\n\n${USAGE}`);
      return 2;
    }
    throw error;
  }
  if (args === null) {
    process.stdout.write(USAGE);
    return 0;
  }
  const threads = args.threads ?? defaultThreads();
  // Started first, so that the thread's start-up overlaps reading the terrain.
  const helper = threads === 2 ? startHalfSweeper() : null;
  try {
    return await run(args, helper);
  } finally {
    helper?.close();
  }
}

/**
 * Two threads when a core is spare: the 1-minute load average below the
 * cores less one. A second thread on a busy machine only adds its start-up
 * (≈ 0.1 s of CPU) — measured on the 2-core machine at load ≈ 10: one thread
 * 2.1 s, two 2.4 s for the whole 4000² run.
 */
function defaultThreads(): number {
  const cores = os.availableParallelism();
  return cores >= 2 && (os.loadavg()[0] as number) < cores - 1 ? 2 : 1;
}

async function run(args: Arguments, helper: HalfSweeper | null): Promise<number> {
  const t0 = performance.now();
  let terrain: TerrainRaster;
  try {
    terrain = await readTerrain(args.dem, helper !== null);
  } catch (error) {
    if (error instanceof TerrainFormatError) {
      process.stderr.write(`viewshed: cannot read ${args.dem} (${error.code}): ${error.message}\n`);
      return 1;
    }
    throw error;
  }
  const t1 = performance.now();
  let values: Float32Array;
  let grid: GridSpec;
  const small = args.threads === null && terrain.width * terrain.height < TWO_THREAD_CELLS;
  const sweeper = small ? null : helper;
  try {
    const cell = locatePostCell(terrain, args.x, args.y);
    const hidden = await sweepPost(
      terrain,
      { ...cell, eyeHeight: args.eye },
      { refractionCoefficient: args.k, earthRadius: args.earthRadius, maxDistance: args.maxDistance },
      sweeper,
    );
    grid = hidden;
    values = args.mode === 'hidden' ? hidden.hidden : targetVisibilityMask(hidden, args.target);
  } catch (error) {
    if (error instanceof TerrainInputError) {
      process.stderr.write(`viewshed: ${error.message}\n`);
      return 2;
    }
    throw error;
  }
  const t2 = performance.now();
  let notes: string[];
  try {
    notes = writeResult(args.out, grid, values, args.mode === 'hidden' ? 3 : 0);
  } catch (error) {
    process.stderr.write(`viewshed: cannot write ${args.out}: ${(error as Error).message}\n`);
    return 1;
  }
  const t3 = performance.now();
  for (const note of notes) process.stderr.write(`viewshed: note: ${note}\n`);
  const cells = terrain.width * terrain.height;
  process.stderr.write(
    `viewshed: ${terrain.width} × ${terrain.height} cells; read ${ms(t1 - t0)}, compute ${ms(t2 - t1)} ` +
      `(${(cells / 1e6 / ((t2 - t1) / 1000)).toFixed(1)} Mcells/s, ${sweeper ? 2 : 1} thread${sweeper ? 's' : ''}), write ${ms(t3 - t2)}, total ${ms(t3 - t0)}\n`,
  );
  return 0;
}

function ms(value: number): string {
  return `${value.toFixed(0)} ms`;
}

main().then(
  (code) => {
    process.exitCode = code;
  },
  (error: unknown) => {
    process.stderr.write(
      `viewshed: unexpected failure: ${error instanceof Error ? (error.stack ?? error.message) : String(error)}\n`,
    );
    process.exitCode = 1;
  },
);
