/**
 * Network-coverage benchmark: combining 10 posts' hidden-height rasters on a
 * 2000² grid (25 m cells) into posts per cell, cross-bearing classes,
 * statistics and the standard check — what the job runner does after the
 * worker pool has computed the rasters. The rasters themselves are computed
 * once beforehand and not timed (see the viewshed benchmark for them).
 * Speed figures only; nothing passes or fails.
 *
 * Timings are medians of a few runs after a warm-up run: wall clock (the
 * figure given) and this process's CPU time (in the detail column; it is the
 * steadier one when other jobs share the cores). Throughput = 2000² cells /
 * wall-clock time.
 */
import { checkCoverageStandard } from '@/shared/terrain/check-coverage-standard';
import { compareCoverage } from '@/shared/terrain/coverage-difference';
import type { CoveragePost } from '@/shared/terrain/coverage-post';
import { computeCoverageStatistics } from '@/shared/terrain/coverage-statistics';
import { crossBearingQuality } from '@/shared/terrain/cross-bearing-quality';
import { decodeClassRaster } from '@/shared/terrain/decode-class-raster';
import { encodeClassRaster } from '@/shared/terrain/encode-class-raster';
import { computeHiddenHeightRaster, type HiddenHeightRaster } from '@/shared/terrain/hidden-height-raster';
import { evaluateNetworkCoverage } from '@/shared/terrain/network-coverage';
import { countPostsPerCell } from '@/shared/terrain/posts-per-cell';
import { rasterizePolygon } from '@/shared/terrain/rasterize-polygon';
import { prepareSweepTerrain } from '@/shared/terrain/sweep-terrain';
import { generateSyntheticTerrain } from '@/shared/terrain/synthetic-terrain';
import { classifyVisibility } from '@/shared/terrain/visibility-classes';
import { type BenchRow, median } from './measure';

const SIZE = 2000;
const TARGET = 30; // metres, a smoke column
const STANDARD = { minSeenPct: 70, priorityMinPosts: 2 };

const cpuNow = () => {
  const usage = process.cpuUsage();
  return (usage.user + usage.system) / 1000;
};

/**
 * Median wall-clock and CPU time of `runs` runs after one warm-up, ms. The CPU
 * time (this process, all threads) shows the cost when other work shares the cores.
 */
function timed(fn: () => void, runs = 3): { wall: number; cpu: number } {
  fn();
  const wall: number[] = [];
  const cpu: number[] = [];
  for (let r = 0; r < runs; r++) {
    const c0 = cpuNow();
    const t0 = performance.now();
    fn();
    wall.push(performance.now() - t0);
    cpu.push(cpuNow() - c0);
  }
  return { wall: median(wall), cpu: median(cpu) };
}

/** A ring of `n` corners around (cx, cy), metres, wobbling between 0.75 and 1 × radius. */
function wobblyRing(cx: number, cy: number, radius: number, n: number): [number, number][] {
  return Array.from({ length: n }, (_, i) => {
    const a = (2 * Math.PI * i) / n;
    const r = radius * (0.875 + 0.125 * Math.sin(7 * a));
    return [cx + r * Math.cos(a), cy + r * Math.sin(a)] as [number, number];
  });
}

/** Runs the coverage benchmark and returns its figures. */
export async function benchCoverage(): Promise<BenchRow[]> {
  const rows: BenchRow[] = [];
  const cells = SIZE * SIZE;
  const mcells = (ms: number) => cells / 1e6 / (ms / 1000);
  const add = (name: string, time: { wall: number; cpu: number }, detail?: string) => {
    const cpu = `CPU ${time.cpu.toFixed(0)} ms`;
    rows.push({ name: `${name}, wall`, value: time.wall, unit: 'ms', detail: detail ? `${cpu}; ${detail}` : cpu });
    rows.push({ name: `${name}, throughput`, value: mcells(time.wall), unit: 'Mcells/s' });
  };

  const terrain = generateSyntheticTerrain({ width: SIZE, height: SIZE, seed: 4243 });
  const sweep = prepareSweepTerrain(terrain);
  const posts = Array.from({ length: 10 }, (_, p) => ({ col: 150 + p * 170, row: 200 + ((p * 577) % 1600), eyeHeight: 20 }));
  const hidden: HiddenHeightRaster[] = posts.map((post) =>
    computeHiddenHeightRaster(terrain, post, { refractionCoefficient: 0.13 }, sweep),
  );
  const coveragePosts: CoveragePost[] = hidden.map((h, p) => ({
    col: h.post.col,
    row: h.post.row,
    classes: classifyVisibility(h, TARGET).classes,
    // Every third post watches a half circle, as shore posts do.
    sector: p % 3 === 0 ? { from: Math.PI / 2, to: (3 * Math.PI) / 2 } : null,
  }));

  const cx = terrain.xll + (SIZE * terrain.cellSize) / 2;
  const cy = terrain.yll + (SIZE * terrain.cellSize) / 2;
  const siteRing = wobblyRing(cx, cy, 0.48 * SIZE * terrain.cellSize, 2000);
  let siteMask: Uint8Array = new Uint8Array(0);
  add(
    'rasterizePolygon, 2 000 corners',
    timed(() => (siteMask = rasterizePolygon(terrain, [siteRing]))),
  );
  const zones = [0, 1, 2].map((z) => ({
    name: `Zone ${z + 1}`,
    weight: 3 + z,
    mask: rasterizePolygon(terrain, [wobblyRing(cx + (z - 1) * 12_000, cy, 6_000, 200)]),
  }));

  let counts = countPostsPerCell(terrain, coveragePosts);
  add(
    'countPostsPerCell, 10 posts',
    timed(() => (counts = countPostsPerCell(terrain, coveragePosts))),
  );
  let cross = crossBearingQuality(counts, coveragePosts);
  add(
    'crossBearingQuality, 10 posts',
    timed(() => (cross = crossBearingQuality(counts, coveragePosts))),
  );
  let stats = computeCoverageStatistics(counts, cross, siteMask, zones);
  add(
    'statistics, site + 3 zones + blind',
    timed(() => (stats = computeCoverageStatistics(counts, cross, siteMask, zones))),
  );
  add(
    'checkCoverageStandard',
    timed(() => checkCoverageStandard(stats, STANDARD)),
  );

  const networkPosts = hidden.map((h, p) => ({ post: posts[p]!, hidden: h, sector: coveragePosts[p]!.sector }));
  add(
    'evaluateNetworkCoverage, 10 posts',
    timed(() => evaluateNetworkCoverage({ posts: networkPosts, targetHeight: TARGET, siteMask, zones, standard: STANDARD })),
    'classify + all of the above: one condition × one target',
  );

  // Scaling to 30 posts (the 10 rasters three times over): many cells are seen by more than 16
  // posts, so the sorting path of crossBearingQuality runs.
  const thirty = [...coveragePosts, ...coveragePosts, ...coveragePosts];
  let counts30 = countPostsPerCell(terrain, thirty);
  add(
    'countPostsPerCell, 30 posts',
    timed(() => (counts30 = countPostsPerCell(terrain, thirty))),
  );
  add(
    'crossBearingQuality, 30 posts',
    timed(() => crossBearingQuality(counts30, thirty)),
  );

  let encoded = encodeClassRaster(terrain, counts.layer);
  add(
    'encodeClassRaster, layer',
    timed(() => (encoded = encodeClassRaster(terrain, counts.layer))),
  );
  add(
    'decodeClassRaster, layer',
    timed(() => decodeClassRaster(encoded)),
  );
  rows.push({
    name: 'encoded coverage layer size',
    value: encoded.data.length / 1024,
    unit: 'KiB',
    detail: `raw layer ${(cells / 1024).toFixed(0)} KiB`,
  });

  const fewer = countPostsPerCell(terrain, coveragePosts.slice(1));
  add(
    'compareCoverage, 10 vs 9 posts',
    timed(() => compareCoverage(counts, fewer, siteMask)),
  );
  rows.push({ name: 'peak RSS of the benchmark process', value: process.resourceUsage().maxRSS / 1024, unit: 'MiB' });
  return rows;
}
