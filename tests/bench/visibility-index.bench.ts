/**
 * Visibility index (the siting heat map) benchmark: a 2000² seeded synthetic
 * terrain of 25 m cells, a 20 m tower, radius 5 km, 64 rays, the stride the
 * job picks, computed as the worker does it (threads started for the call,
 * terrain shared). Median of 5, with the load average and the process's peak
 * RSS (worker threads included). Target (issue 18): ≤ 30 s on 2 cores.
 * Speed figures only; nothing passes or fails.
 */
import os from 'node:os';
import { generateSyntheticTerrain } from '@/shared/terrain/synthetic-terrain';
import { computeVisibilityIndex, VISIBILITY_INDEX_RAYS, visibilityIndexStride } from '@/shared/terrain/visibility-index';
import { threadedVisibilityIndex } from '@/server/workers/visibility-index-pool';

interface Row {
  name: string;
  value: number;
  unit: string;
  detail?: string;
}

const RUNS = 5;
const load = () =>
  os
    .loadavg()
    .map((x) => x.toFixed(1))
    .join(' ');
const peakRssMiB = () => process.resourceUsage().maxRSS / 1024;
const median = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)] as number;

/** Runs the visibility index benchmark and returns its figures. */
export async function benchVisibilityIndex(): Promise<Row[]> {
  const rows: Row[] = [];
  const terrain = generateSyntheticTerrain({ width: 2000, height: 2000, seed: 4243 });
  const heightM = 20;
  const radiusM = 5000;
  const rays = VISIBILITY_INDEX_RAYS;
  const strideCells = visibilityIndexStride(terrain, radiusM, rays);
  const indexW = Math.ceil(terrain.width / strideCells);
  const indexH = Math.ceil(terrain.height / strideCells);
  const samplesPerCell = rays * Math.floor(radiusM / terrain.cellSize);

  // One thread, a band of 10 index rows: samples per second of the kernel.
  computeVisibilityIndex(terrain, { heightM, radiusM, strideCells, indexRows: [0, 2] }); // warm-up
  const single: number[] = [];
  for (let r = 0; r < RUNS; r++) {
    const t0 = performance.now();
    computeVisibilityIndex(terrain, { heightM, radiusM, strideCells, indexRows: [100, 110] });
    single.push(performance.now() - t0);
  }
  const rate = (10 * indexW * samplesPerCell) / (median(single) / 1000) / 1e6;
  rows.push({
    name: 'heat map kernel, one thread (median of 5)',
    value: rate,
    unit: 'M samples/s',
    detail: `load ${load()}, peak RSS ${peakRssMiB().toFixed(0)} MiB`,
  });

  const compute = threadedVisibilityIndex(2);
  const whole: number[] = [];
  for (let r = 0; r < RUNS; r++) {
    const t0 = performance.now();
    await compute(terrain, { heightM, radiusM, rays, strideCells, mask: null }, () => undefined);
    whole.push(performance.now() - t0);
  }
  rows.push({
    name: `heat map 2000², tower ${heightM} m, radius ${radiusM / 1000} km, 2 threads (median of 5)`,
    value: median(whole) / 1000,
    unit: 's',
    detail:
      `target ≤ 30 s; every ${strideCells}th cell (${indexW}×${indexH}), ${rays} rays, ` +
      `${((indexW * indexH * samplesPerCell) / 1e9).toFixed(2)}·10⁹ samples; runs ${whole.map((t) => (t / 1000).toFixed(1)).join(' / ')} s; ` +
      `load ${load()}, peak RSS ${peakRssMiB().toFixed(0)} MiB`,
  });
  return rows;
}
