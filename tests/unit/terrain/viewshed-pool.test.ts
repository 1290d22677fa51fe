import { createViewshedPool, type ViewshedJob, type ViewshedPool } from '@/server/workers/viewshed-pool';
import { computeHiddenHeightRaster } from '@/shared/terrain/hidden-height-raster';
import { generateSyntheticTerrain } from '@/shared/terrain/synthetic-terrain';
import { TerrainInputError } from '@/shared/terrain/terrain-input-error';

jest.setTimeout(60_000);

describe('createViewshedPool', () => {
  const terrain = generateSyntheticTerrain({ width: 150, height: 120, seed: 31 });
  let pool: ViewshedPool;
  beforeAll(() => {
    pool = createViewshedPool({ size: 2 });
  });
  afterAll(async () => {
    await pool.close();
  });

  test('computes many post × condition jobs exactly as the engine does, in order', async () => {
    // The pool must be a transparent parallel runner: bitwise the same result (common practice, no source).
    const jobs: ViewshedJob[] = [];
    for (const col of [10, 75, 140]) {
      for (const k of [0.13, 0, -0.15])
        jobs.push({ post: { col, row: 60, eyeHeight: 12 }, conditions: { refractionCoefficient: k } });
    }
    jobs.push({ post: { col: 30, row: 100, eyeHeight: 5 }, conditions: { maxDistance: 900 } });
    const results = await pool.run(terrain, jobs);
    expect(results).toHaveLength(jobs.length);
    results.forEach((result, i) => {
      const job = jobs[i]!;
      expect(result.job).toBe(job);
      const direct = computeHiddenHeightRaster(terrain, job.post, job.conditions);
      // (Arrays from a worker belong to another realm than Jest's, so compare the values.)
      expect(Array.from(result.raster.hidden)).toEqual(Array.from(direct.hidden));
      expect(result.raster.eyeElevation).toBe(direct.eyeElevation);
      expect(result.raster.refractionCoefficient).toBe(direct.refractionCoefficient);
      expect(result.raster.maxDistance).toBe(direct.maxDistance);
    });
  });

  test('can be run again on another terrain', async () => {
    const other = generateSyntheticTerrain({ width: 60, height: 60, seed: 32 });
    const results = await pool.run(other, [
      { post: { col: 30, row: 30, eyeHeight: 10 } },
      { post: { col: 5, row: 5, eyeHeight: 10 } },
    ]);
    expect(Array.from(results[1]!.raster.hidden)).toEqual(
      Array.from(computeHiddenHeightRaster(other, { col: 5, row: 5, eyeHeight: 10 }).hidden),
    );
    expect(pool.size).toBe(2);
  });

  test('passes terrain-core errors back as TerrainInputError', async () => {
    const run = pool.run(terrain, [{ post: { col: 500, row: 0, eyeHeight: 10 } }]);
    await expect(run).rejects.toBeInstanceOf(TerrainInputError);
    await expect(pool.run(terrain, [{ post: { col: 500, row: 0, eyeHeight: 10 } }])).rejects.toMatchObject({
      code: 'post-outside-raster',
    });
    // …and keeps working afterwards.
    await expect(pool.run(terrain, [{ post: { col: 1, row: 1, eyeHeight: 1 } }])).resolves.toHaveLength(1);
  });

  test('does not modify the terrain', async () => {
    const before = Float32Array.from(terrain.heights);
    await pool.run(terrain, [{ post: { col: 20, row: 20, eyeHeight: 10 } }]);
    expect(terrain.heights).toEqual(before);
  });
});
