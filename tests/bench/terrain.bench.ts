/**
 * Terrain benchmark: the hillshade against `gdaldem hillshade` on the same
 * grid, the base-layer picture, the terrain profile, and the whole upload
 * ingest (read, checks, hillshade, PNG, normalised GeoTIFF) of 4000 × 4000
 * grids as GeoTIFF and as ESRI ASCII grid in the worker thread, and the 3D
 * mesh decimation. Speed figures
 * only; nothing passes or fails.
 *
 * Grids are a smooth invented surface (sines), 25 m cells in UTM zone 33N.
 * Timings are medians of a few runs after a warm-up; GDAL's time is the whole
 * process (start-up, reading, computing, writing).
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, statSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { createTerrainIngestRunner } from '@/server/workers/terrain-ingest-runner';
import { writeEsriAsciiGrid } from '@/shared/terrain/formats/esri-ascii-grid-writer';
import { writeGeoTiff } from '@/shared/terrain/formats/geotiff-writer';
import { decimateTerrain } from '@/shared/terrain/decimate-terrain';
import { computeHillshade } from '@/shared/terrain/hillshade';
import { hillshadeImage } from '@/shared/terrain/hillshade-image';
import { terrainProfile } from '@/shared/terrain/terrain-profile';
import type { TerrainRaster } from '@/shared/terrain/terrain-raster';
import { type BenchRow, median, timed } from './measure';

function surface(size: number): TerrainRaster {
  const heights = new Float32Array(size * size);
  for (let r = 0; r < size; r++) {
    for (let c = 0; c < size; c++) {
      heights[r * size + c] = 400 + 180 * Math.sin(c / 37) * Math.cos(r / 53) + 60 * Math.sin((c + 2 * r) / 11);
    }
  }
  return {
    heights,
    width: size,
    height: size,
    cellSize: 25,
    xll: 400_000,
    yll: 5_700_000,
    nodata: null,
    crs: { epsg: 32633, wkt: null },
  };
}

export async function benchTerrain(): Promise<BenchRow[]> {
  const rows: BenchRow[] = [];
  const dir = mkdtempSync(path.join(os.tmpdir(), 'kenning-terrain-bench-'));
  try {
    for (const size of [1000, 4000]) {
      const terrain = surface(size);
      const cells = size * size;
      const ms = timed(() => computeHillshade(terrain), size > 2000 ? 3 : 5, { warmUp: true });
      rows.push({
        name: `hillshade ${size}² (core, in memory)`,
        value: ms,
        unit: 'ms',
        detail: `${(cells / 1e3 / ms).toFixed(1)} Mcells/s`,
      });
      const file = path.join(dir, `dem-${size}.tif`);
      writeFileSync(file, Buffer.from(writeGeoTiff(terrain, terrain.heights)));
      const gdalTimes: number[] = [];
      for (let r = 0; r < 3; r++) {
        const t0 = performance.now();
        const run = spawnSync('gdaldem', ['hillshade', '-q', '-compute_edges', file, path.join(dir, `shade-${size}.tif`)]);
        if (run.status !== 0) break;
        gdalTimes.push(performance.now() - t0);
      }
      if (gdalTimes.length)
        rows.push({ name: `gdaldem hillshade ${size}² (whole process)`, value: median(gdalTimes), unit: 'ms' });
      const relief = computeHillshade(terrain);
      rows.push({
        name: `hillshade picture ${size}² → ≤ 2048 px`,
        value: timed(() => hillshadeImage(relief), 3, { warmUp: true }),
        unit: 'ms',
      });
      rows.push({
        name: `3D mesh ${size}² → ≤ 256 cells`,
        value: timed(() => decimateTerrain(terrain, 256), 3, { warmUp: true }),
        unit: 'ms',
      });

      // Corner to corner, three conditions.
      const span = size * 25;
      const input = {
        observer: { x: terrain.xll + 12.5, y: terrain.yll + 12.5, eyeHeight: 20 },
        target: { x: terrain.xll + span - 12.5, y: terrain.yll + span - 12.5, height: 30 },
        conditions: [{ refractionCoefficient: 0 }, { refractionCoefficient: 0.13 }, { refractionCoefficient: -0.2 }],
      };
      const profileMs = timed(() => terrainProfile(terrain, input), 20, { warmUp: true });
      rows.push({
        name: `terrain profile ${size}² diagonal, ${((span * Math.SQRT2) / 1000).toFixed(0)} km, 3 conditions`,
        value: profileMs,
        unit: 'ms',
        detail: `${Math.round(1000 / profileMs)} profiles/s`,
      });
    }

    // The upload ingest in the worker thread (what a planner waits for after the bytes arrive).
    const ingest = createTerrainIngestRunner();
    const big = surface(4000);
    const tif = path.join(dir, 'upload-4000.tif');
    writeFileSync(tif, Buffer.from(writeGeoTiff(big, big.heights)));
    const asc = path.join(dir, 'upload-4000.asc');
    writeFileSync(asc, writeEsriAsciiGrid(big, big.heights, { decimals: 2 }).asc);
    for (const [file, format] of [
      [tif, 'geotiff'],
      [asc, 'esri-ascii'],
    ] as const) {
      const out = mkdtempSync(path.join(dir, 'out-'));
      const t0 = performance.now();
      const result = await ingest({
        filePath: file,
        format,
        prjPath: null,
        epsg: 32633,
        maxCells: 25_000_000,
        hillshadeMaxEdge: 2048,
        boundary: null,
        outDir: out,
      });
      const total = performance.now() - t0;
      const t = result.timings;
      rows.push({
        name: `ingest 4000² ${format} (${(statSync(file).size / 1e6).toFixed(0)} MB) in a worker`,
        value: total,
        unit: 'ms',
        detail: `read+checks ${t.readMs.toFixed(0)}, hillshade ${t.hillshadeMs.toFixed(0)}, write ${t.writeMs.toFixed(0)} ms`,
      });
    }
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
  return rows;
}
