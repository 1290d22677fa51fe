/**
 * Viewshed benchmark: Kenning's hidden-height engine against GDAL's
 * `gdal_viewshed -om GROUND` on the same seeded synthetic terrains (1000²,
 * 2000², 4000² cells of 25 m), plus a whole plan — 10 posts × 3 conditions on
 * 2000² — through the worker pool. Speed figures only; nothing passes or fails.
 *
 * Timings are medians of a few runs, wall clock, after a warm-up run that
 * lets the JIT compile the sweep. GDAL's time is the whole process (start-up,
 * reading the GeoTIFF, computing, writing); the engine's "core" time is the
 * computation on a raster already in memory and its "file to file" time adds
 * decoding and encoding the GeoTIFFs, for a like-for-like comparison.
 *
 * "Old vs new": the engine before the speed work of issue 18 (kept verbatim in
 * tests/support/previous-hidden-height-raster.ts) and today's, alternated in
 * the same process (median of 5 each), so that the ratio holds on a machine
 * whose load moves; the load average is printed beside it.
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { createViewshedPool, type ViewshedJob } from '@/server/workers/viewshed-pool';
import { readGeoTiff } from '@/shared/terrain/formats/geotiff-reader';
import { writeGeoTiff } from '@/shared/terrain/formats/geotiff-writer';
import { computeHiddenHeightRaster, type SightConditions } from '@/shared/terrain/hidden-height-raster';
import { generateSyntheticTerrain } from '@/shared/terrain/synthetic-terrain';
import type { TerrainRaster } from '@/shared/terrain/terrain-raster';
import { computeHiddenHeightRasterBefore } from '@/tests/support/previous-hidden-height-raster';
import { type BenchRow, median, timed } from './measure';

const EYE = 15; // metres
/** The command line as `npm run viewshed` starts it: the prebuilt bundle (made on the first run). */
const CLI = path.join(__dirname, '..', '..', 'server', 'scripts', 'viewshed-command.mjs');
const K = 0.13;
/** GDAL uses the CRS's semi-major axis as the earth radius; so does the engine here. */
const CONDITIONS: SightConditions = { refractionCoefficient: K, earthRadius: 6_378_137 };

async function timedAsync(fn: () => Promise<void>, runs: number): Promise<number> {
  const times: number[] = [];
  for (let r = 0; r < runs; r++) {
    const t0 = performance.now();
    await fn();
    times.push(performance.now() - t0);
  }
  return median(times);
}

const gdalAvailable = (() => {
  const probe = spawnSync('gdal_viewshed', ['--version'], { encoding: 'utf8' });
  return probe.error === undefined && /GDAL \d/.test(probe.stdout + probe.stderr);
})();

function loadAverage(): string {
  return os
    .loadavg()
    .map((x) => x.toFixed(2))
    .join(' ');
}

/** Load average and the process's peak RSS so far, for every figure. */
function stamp(): string {
  return `load ${loadAverage()}, peak RSS ${(process.resourceUsage().maxRSS / 1024).toFixed(0)} MiB`;
}

/** Appends the load average and peak RSS to every row's detail. */
function stamped(row: BenchRow): BenchRow {
  return { ...row, detail: row.detail ? `${row.detail}; ${stamp()}` : stamp() };
}

/**
 * Runs the command line as a whole process (node start-up, read, compute, write) on `threads` threads,
 * and returns its peak RSS in MiB (from `/usr/bin/time` when there is one, else NaN).
 */
function runCli(input: string, output: string, x: number, y: number, threads: 1 | 2): number {
  const args = [CLI, '--threads', String(threads), '--dem', input, '--x', String(x), '--y', String(y)].concat([
    '--eye',
    String(EYE),
    '--k',
    String(K),
    '--earth-radius',
    String(CONDITIONS.earthRadius),
    '--out',
    output,
  ]);
  if (!existsSync('/usr/bin/time')) {
    execFileSync(process.execPath, args, { stdio: 'ignore' });
    return NaN;
  }
  const run = spawnSync('/usr/bin/time', ['-f', 'maxrss %M', process.execPath, ...args], { encoding: 'utf8' });
  if (run.status !== 0) throw new Error(`viewshed command line failed: ${run.stderr}`);
  return Number(/maxrss (\d+)/.exec(run.stderr)?.[1]) / 1024;
}

/**
 * Old and new engine alternated, `runs` times each: medians of wall-clock and
 * of CPU time (user + system of this process, which runs nothing else
 * meanwhile), in ms. CPU time moves less than wall-clock time when other work
 * loads the machine.
 */
function oldVersusNew(terrain: TerrainRaster, runs: number): { old: number; now: number; oldCpu: number; nowCpu: number } {
  const post = postOf(terrain);
  const olds: number[] = [];
  const nows: number[] = [];
  const oldCpus: number[] = [];
  const nowCpus: number[] = [];
  const cpuMs = (since: NodeJS.CpuUsage) => {
    const used = process.cpuUsage(since);
    return (used.user + used.system) / 1000;
  };
  for (let r = 0; r < runs; r++) {
    let c0 = process.cpuUsage();
    let t0 = performance.now();
    computeHiddenHeightRasterBefore(terrain, post, CONDITIONS);
    olds.push(performance.now() - t0);
    oldCpus.push(cpuMs(c0));
    c0 = process.cpuUsage();
    t0 = performance.now();
    computeHiddenHeightRaster(terrain, post, CONDITIONS);
    nows.push(performance.now() - t0);
    nowCpus.push(cpuMs(c0));
  }
  return { old: median(olds), now: median(nows), oldCpu: median(oldCpus), nowCpu: median(nowCpus) };
}

function postOf(terrain: TerrainRaster): { col: number; row: number; eyeHeight: number } {
  return { col: Math.floor(terrain.width * 0.45), row: Math.floor(terrain.height * 0.55), eyeHeight: EYE };
}

function toArrayBuffer(bytes: Buffer): ArrayBuffer {
  return bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength) as ArrayBuffer;
}

/** Runs the viewshed benchmark and returns its figures. */
export async function benchViewshed(): Promise<BenchRow[]> {
  const rows: BenchRow[] = [];
  // Every figure carries the load average and peak RSS at the moment it was measured.
  const push = (row: BenchRow) => rows.push(stamped(row));
  const dir = mkdtempSync(path.join(os.tmpdir(), 'kenning-viewshed-bench-'));
  try {
    // Warm-up: let the JIT compile the sweep before anything is timed.
    const warm = generateSyntheticTerrain({ width: 400, height: 400, seed: 99 });
    for (let i = 0; i < 3; i++) {
      computeHiddenHeightRaster(warm, postOf(warm), CONDITIONS);
      computeHiddenHeightRasterBefore(warm, postOf(warm), CONDITIONS);
    }

    for (const size of [1000, 2000, 4000]) {
      const terrain = generateSyntheticTerrain({ width: size, height: size, seed: 4242 });
      const post = postOf(terrain);
      const cells = size * size;
      const input = path.join(dir, `dem-${size}.tif`);
      writeFileSync(input, Buffer.from(writeGeoTiff(terrain, terrain.heights, { nodata: null })));
      const runs = 5;

      const core = timed(() => {
        computeHiddenHeightRaster(terrain, post, CONDITIONS);
      }, runs);
      const output = path.join(dir, `ours-${size}.tif`);
      const fileToFile = await timedAsync(async () => {
        const dem = await readGeoTiff(toArrayBuffer(readFileSync(input)));
        const hidden = computeHiddenHeightRaster(dem, post, CONDITIONS);
        writeFileSync(output, Buffer.from(writeGeoTiff(hidden, hidden.hidden)));
      }, runs);
      const versus = oldVersusNew(terrain, 5);
      push({
        name: `old engine core, one post, ${size}² (median of 5)`,
        value: versus.old,
        unit: 'ms',
      });
      push({
        name: `new engine core, one post, ${size}² (median of 5)`,
        value: versus.now,
        unit: 'ms',
      });
      push({
        name: `old → new throughput, ${size}²`,
        value: cells / 1e6 / (versus.now / 1000),
        unit: 'Mcells/s',
        detail: `old ${(cells / 1e6 / (versus.old / 1000)).toFixed(1)} Mcells/s`,
      });
      push({
        name: `ratio new / old, ${size}²`,
        value: versus.now / versus.old,
        unit: '×',
        detail: '< 1 means faster; same process, alternated',
      });
      push({
        name: `ratio new / old in CPU time, ${size}²`,
        value: versus.nowCpu / versus.oldCpu,
        unit: '×',
        detail: `CPU ms old ${versus.oldCpu.toFixed(0)}, new ${versus.nowCpu.toFixed(0)}`,
      });
      const span = size + 2;
      push({
        name: `memory per call, ${size}² (result + scratch, old and new alike)`,
        value: (cells * 4 + span * (5 * 4 + 2 * 8)) / 2 ** 20,
        unit: 'MiB',
        detail: 'Float32 result; obstacle columns, 1/i and the per-distance drop per row or column',
      });
      push({ name: `engine core, one post, ${size}²`, value: core, unit: 'ms' });
      push({
        name: `engine core throughput per CPU second, ${size}² (median of 5)`,
        value: cells / 1e6 / (versus.nowCpu / 1000),
        unit: 'Mcells/s',
        detail: 'CPU time of this process: moves less than wall time on a loaded machine',
      });
      push({
        name: `engine core throughput, ${size}² (median of 5)`,
        value: cells / 1e6 / (core / 1000),
        unit: 'Mcells/s',
        detail: size === 4000 ? 'target ≥ 64 Mcells/s (≤ 0.25 s) on one thread' : undefined,
      });
      push({ name: `engine file to file (read tif, compute, write tif), ${size}²`, value: fileToFile, unit: 'ms' });

      if (gdalAvailable) {
        const x = terrain.xll + (post.col + 0.5) * terrain.cellSize;
        const y = terrain.yll + (size - post.row - 0.5) * terrain.cellSize;
        const gdalOut = path.join(dir, `gdal-${size}.tif`);
        // The same question as the engine's: ground seen from the eye at (x, y), target at 0 m, curvature coefficient 1 − k.
        const gdalArgs = [
          '-q',
          '-om',
          'GROUND',
          '-oz',
          String(EYE),
          '-tz',
          '0',
          '-cc',
          String(1 - K),
          '-ox',
          String(x),
          '-oy',
          String(y),
          input,
          gdalOut,
        ];
        const runGdal = () => {
          execFileSync('gdal_viewshed', gdalArgs);
        };
        const gdal = timed(runGdal, runs);
        push({ name: `gdal_viewshed -om GROUND (whole process), ${size}²`, value: gdal, unit: 'ms' });
        push({
          name: `ratio engine core / gdal_viewshed, ${size}²`,
          value: core / gdal,
          unit: '×',
          detail: '≤ 1 means Kenning is faster',
        });
        push({
          name: `ratio engine file to file / gdal_viewshed, ${size}²`,
          value: fileToFile / gdal,
          unit: '×',
          detail: 'in this process: no start-up',
        });
        if (size === 4000) {
          // The command line as a whole process, on one thread and on two, against gdal_viewshed as a
          // whole process, alternated.
          const ours: Record<1 | 2, number[]> = { 1: [], 2: [] };
          const rss: Record<1 | 2, number> = { 1: 0, 2: 0 };
          const theirs: number[] = [];
          const cliOut = path.join(dir, `cli-${size}.tif`);
          runCli(input, cliOut, x, y, 1); // builds the bundle when a source changed; not timed
          for (let r = 0; r < 5; r++) {
            for (const threads of [1, 2] as const) {
              const t0 = performance.now();
              rss[threads] = Math.max(rss[threads], runCli(input, cliOut, x, y, threads));
              ours[threads].push(performance.now() - t0);
            }
            const t0 = performance.now();
            runGdal();
            theirs.push(performance.now() - t0);
          }
          for (const threads of [1, 2] as const) {
            push({
              name: `command line file to file (whole process), ${size}², ${threads} thread${threads > 1 ? 's' : ''} (median of 5)`,
              value: median(ours[threads]),
              unit: 'ms',
              detail: `gdal_viewshed ${median(theirs).toFixed(0)} ms, alternated; peak RSS of the command line ${rss[threads].toFixed(0)} MiB`,
            });
            push({
              name: `ratio command line (${threads} thread${threads > 1 ? 's' : ''}) / gdal_viewshed, whole processes, ${size}²`,
              value: median(ours[threads]) / median(theirs),
              unit: '×',
              detail: 'target ≤ 0.5; the command line picks 2 threads only when a core is spare',
            });
          }
        }
      } else {
        push({ name: `gdal_viewshed, ${size}²`, value: NaN, unit: 'ms', detail: 'gdal_viewshed not on PATH' });
      }
      const memory = process.memoryUsage();
      push({
        name: `peak RSS so far (after ${size}²)`,
        value: process.resourceUsage().maxRSS / 1024,
        unit: 'MiB',
        detail: `now: rss ${(memory.rss / 2 ** 20).toFixed(0)} MiB, array buffers ${(memory.arrayBuffers / 2 ** 20).toFixed(0)} MiB`,
      });
    }

    // A whole plan: 10 posts × 3 conditions on 2000², both cores through the pool.
    const plan = generateSyntheticTerrain({ width: 2000, height: 2000, seed: 4243 });
    const jobs: ViewshedJob[] = [];
    for (let p = 0; p < 10; p++) {
      const post = { col: 150 + p * 170, row: 200 + ((p * 577) % 1600), eyeHeight: EYE };
      for (const k of [0.13, 0, -0.2]) jobs.push({ post, conditions: { refractionCoefficient: k } });
    }
    const t0 = performance.now();
    const pool = createViewshedPool();
    try {
      await pool.run(plan, jobs);
      const cold = performance.now() - t0;
      const warmRuns: number[] = [];
      for (let r = 0; r < 5; r++) {
        const t1 = performance.now();
        await pool.run(plan, jobs);
        warmRuns.push(performance.now() - t1);
      }
      push({
        name: `plan 10 posts × 3 conditions, 2000², pool of ${pool.size}, cold`,
        value: cold / 1000,
        unit: 's',
        detail: 'includes starting the workers and sharing the terrain',
      });
      push({
        name: `plan 10 posts × 3 conditions, 2000², pool of ${pool.size}, warm (viewsheds only, median of 5)`,
        value: median(warmRuns) / 1000,
        unit: 's',
        detail: 'the target ≤ 1.0 s is for the whole run with its evaluation: npm run bench -- plan',
      });
    } finally {
      await pool.close();
    }
    const sequential = timed(() => {
      for (const job of jobs) computeHiddenHeightRaster(plan, job.post, job.conditions);
    }, 1);
    push({ name: 'plan 10 posts × 3 conditions, 2000², one thread, no pool', value: sequential / 1000, unit: 's' });
    push({ name: 'peak RSS of the benchmark process', value: process.resourceUsage().maxRSS / 1024, unit: 'MiB' });
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
  return rows;
}
